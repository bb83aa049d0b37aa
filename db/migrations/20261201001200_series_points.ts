import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('series_points', (table) => {
    table.integer('series_id').unsigned().notNullable().references('series.id').onDelete('CASCADE');
    table.integer('studio_id').unsigned().notNullable();
    table.date('date').notNullable();
    table.double('value').nullable();
    // Whether the file said "<1" (stored as 0.5).
    table.boolean('below_one').notNullable().defaultTo(false);
    // The import that last wrote this point (newer points win on merge).
    table.integer('import_id').unsigned().nullable().references('imports.id').onDelete('SET NULL');
    table.primary(['series_id', 'date']);
    table.index(['studio_id']);
    table.index(['import_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('series_points');
}
