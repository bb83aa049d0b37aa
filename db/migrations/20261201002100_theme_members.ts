import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('theme_series', (table) => {
    table.integer('theme_id').unsigned().notNullable().references('themes.id').onDelete('CASCADE');
    table.integer('series_id').unsigned().notNullable().references('series.id').onDelete('CASCADE');
    table.integer('studio_id').unsigned().notNullable();
    table.primary(['theme_id', 'series_id']);
    table.index(['series_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('theme_series');
}
