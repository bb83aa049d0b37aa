import type { Knex } from 'knex';

// A counter bumped by every write to a studio's stored events: GET /events/stamp reads one row
// instead of aggregating all events, so clients can poll it cheaply.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studios', (table) => {
    table.integer('events_stamp').unsigned().notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studios', (table) => {
    table.dropColumn('events_stamp');
  });
}
