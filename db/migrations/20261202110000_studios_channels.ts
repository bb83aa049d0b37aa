import type { Knex } from 'knex';

// The studio's own list of sales channels (a JSON array of names); null keeps the default list of
// market, booth, online, wholesale and consignment. Sales imports map channel cells onto it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studios', (table) => {
    table.text('channels').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studios', (table) => {
    table.dropColumn('channels');
  });
}
