import type { Knex } from 'knex';

// The studio's own sell window (days before the occasion people buy) for a built-in occasion.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('studio_sell_windows', (table) => {
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('occasion_key', 60).notNullable();
    table.integer('days').notNullable();
    table.primary(['studio_id', 'occasion_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('studio_sell_windows');
}
