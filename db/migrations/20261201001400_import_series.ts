import type { Knex } from 'knex';

// Which series an import wrote to, and how many of its points replaced earlier imports' points:
// the import history behind "newer points win" when series of several imports merge.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('import_series', (table) => {
    table.integer('import_id').unsigned().notNullable().references('imports.id').onDelete('CASCADE');
    table.integer('series_id').unsigned().notNullable().references('series.id').onDelete('CASCADE');
    table.integer('studio_id').unsigned().notNullable();
    table.integer('points_written').notNullable().defaultTo(0);
    table.integer('points_replaced').notNullable().defaultTo(0);
    table.primary(['import_id', 'series_id']);
    table.index(['series_id']);
    table.index(['studio_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('import_series');
}
