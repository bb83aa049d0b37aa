import type { Knex } from 'knex';

// One time series: search interest for a term (and region), or sales of one item. Region '' means none,
// so the unique key works (NULLs never collide in a unique index).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('series', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.enum('kind', ['interest', 'sales']).notNullable();
    table.string('term', 200).notNullable();
    table.string('region', 64).notNullable().defaultTo('');
    table.enum('period', ['daily', 'weekly', 'monthly']).notNullable();
    table.date('start_date').nullable();
    table.date('end_date').nullable();
    table.integer('points').notNullable().defaultTo(0);
    table.integer('version').notNullable().defaultTo(1);
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
    table.unique(['studio_id', 'kind', 'term', 'region', 'period']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('series');
}
