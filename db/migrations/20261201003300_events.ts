import type { Knex } from 'knex';

// Stored calendar events: the steps of runways. start/end null = in the tray. end is inclusive.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('events', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.integer('runway_id').unsigned().nullable().references('runways.id').onDelete('CASCADE');
    table.integer('theme_id').unsigned().nullable().references('themes.id').onDelete('SET NULL');
    table.integer('step_index').nullable();
    table.enum('kind', ['build', 'content', 'launch']).notNullable();
    table.string('title', 120).notNullable();
    table.date('start_date').nullable();
    table.date('end_date').nullable();
    // The work days the step uses (JSON list of dates), so its hours book the right days.
    table.text('days').nullable();
    // end − start in calendar days: the month query finds the rare long steps by it.
    table.integer('span_days').nullable();
    table.integer('work_days').notNullable().defaultTo(0);
    table.decimal('hours_per_day', 5, 2).notNullable().defaultTo(0);
    table.integer('cure_days').notNullable().defaultTo(0);
    table.text('cautions').nullable();
    table.text('notes').nullable();
    table.integer('assignee_user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.boolean('done').notNullable().defaultTo(false);
    table.integer('done_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.dateTime('done_at').nullable();
    table.integer('version').notNullable().defaultTo(1);
    // iCalendar SEQUENCE: bumped with every change a subscriber should see.
    table.integer('sequence').notNullable().defaultTo(0);
    table.dateTime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.dateTime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['studio_id', 'start_date']);
    table.index(['studio_id', 'updated_at']);
    table.index(['runway_id', 'step_index']);
    table.index(['studio_id', 'span_days']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('events');
}
