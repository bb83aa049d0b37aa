import type { Knex } from 'knex';

// Craft fairs, pop-up markets and booth restock days; a recurrence is its start plus an RRULE with
// struck (exdates) and extra (rdates) dates kept as JSON text.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('markets', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('name', 120).notNullable();
    table.string('place', 200).notNullable().defaultTo('');
    table.date('start').notNullable();
    table.string('rrule', 500).nullable();
    table.text('exdates').nullable();
    table.text('rdates').nullable();
    table.string('hours', 80).nullable();
    table.bigInteger('booth_fee_cents').nullable();
    table.date('application_deadline').nullable();
    table.date('decision_date').nullable();
    table.boolean('kits_allowed').notNullable().defaultTo(false);
    table.text('notes').nullable();
    table.integer('version').notNullable().defaultTo(1);
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
    table.index(['studio_id', 'start']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('markets');
}
