import type { Knex } from 'knex';

// A named group of series and items the studio may build a line around, with its target.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('themes', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('name', 120).notNullable();
    table.enum('status', ['idea', 'shortlisted', 'picked', 'building', 'launched', 'retired']).notNullable().defaultTo('idea');
    // What the theme is picked for: a month (YYYY-MM), an occasion key, a holiday key, a market id or a date.
    table.enum('target_kind', ['month', 'holiday', 'occasion', 'market', 'date']).nullable();
    table.string('target_value', 64).nullable();
    table.date('target_date').nullable();
    table.integer('offset_days').notNullable().defaultTo(0);
    table.text('notes').nullable();
    table.integer('version').notNullable().defaultTo(1);
    table.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.integer('status_changed_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.dateTime('status_changed_at').nullable();
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
    table.index(['studio_id', 'status']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('themes');
}
