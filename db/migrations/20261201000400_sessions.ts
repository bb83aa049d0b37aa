import type { Knex } from 'knex';

// The shape connect-session-knex expects; created here so migrations own every table.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (table) => {
    table.string('sid', 255).primary();
    table.json('sess').notNullable();
    table.dateTime('expired').notNullable().index();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
