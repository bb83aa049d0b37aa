import type { Knex } from 'knex';

// A studio's own retail occasions: an RRULE (from start) and/or fixed dates (JSON text).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('studio_occasions', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('occasion_key', 60).notNullable();
    table.string('name', 120).notNullable();
    table.string('rrule', 500).nullable();
    table.date('start').nullable();
    table.text('dates').nullable();
    table.integer('sell_window_days').nullable();
    table.unique(['studio_id', 'occasion_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('studio_occasions');
}
