import type { Knex } from 'knex';

// The studio's own sales, a row per sale or per item-day; money in integer cents, refunds negative.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sales', (table) => {
    table.bigIncrements('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.integer('import_id').unsigned().notNullable().references('imports.id').onDelete('CASCADE');
    table.date('date').notNullable();
    table.string('item', 200).notNullable();
    table.string('sku', 64).nullable();
    table.integer('quantity').notNullable();
    table.bigInteger('revenue_cents').notNullable();
    table.string('channel', 40).notNullable();
    table.specificType('currency', 'CHAR(3)').nullable();
    table.index(['studio_id', 'item']);
    table.index(['studio_id', 'date']);
    table.index(['import_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sales');
}
