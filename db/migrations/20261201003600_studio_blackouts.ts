import type { Knex } from 'knex';

// Days nobody works (vacation, a workshop move): both ends included.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('studio_blackouts', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.date('start').notNullable();
    table.date('end').notNullable();
    table.string('note', 200).nullable();
    table.index(['studio_id', 'start']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('studio_blackouts');
}
