import type { Knex } from 'knex';

// Commit progress, written from outside the commit's transaction. It cannot live on the imports row:
// every sales and series_points insert of the transaction holds a shared lock on that row (their
// foreign key), so an update of it from a second connection would wait for the commit to end.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('import_progress', (table) => {
    table.integer('import_id').unsigned().primary();
    table.integer('studio_id').unsigned().notNullable();
    table.integer('rows_done').notNullable().defaultTo(0);
    table.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('import_progress');
}
