import type { Knex } from 'knex';

// The studio's own sales items (by name as imported) that belong to a theme.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('theme_items', (table) => {
    table.integer('theme_id').unsigned().notNullable().references('themes.id').onDelete('CASCADE');
    table.string('item', 200).notNullable();
    table.integer('studio_id').unsigned().notNullable();
    table.primary(['theme_id', 'item']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('theme_items');
}
