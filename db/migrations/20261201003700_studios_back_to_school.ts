import type { Knex } from 'knex';

// The studio's back-to-school day: 'YYYY-MM-DD' for one year or 'MM-DD' for every year.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studios', (table) => {
    table.string('back_to_school', 10).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studios', (table) => {
    table.dropColumn('back_to_school');
  });
}
