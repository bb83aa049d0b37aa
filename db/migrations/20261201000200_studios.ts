import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('studios', (table) => {
    table.increments('id');
    table.string('name', 120).notNullable();
    table.string('timezone', 64).notNullable().defaultTo('America/New_York');
    table.string('country', 2).notNullable().defaultTo('US');
    table.string('region', 3).nullable();
    table.tinyint('week_start').notNullable().defaultTo(1);
    // ISO weekday numbers as a comma list, e.g. "1,2,3,4,5".
    table.string('work_days', 20).notNullable().defaultTo('1,2,3,4,5');
    table.decimal('daily_capacity_hours', 5, 2).notNullable().defaultTo(8);
    table.boolean('holidays_off').notNullable().defaultTo(true);
    table.integer('version').notNullable().defaultTo(1);
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('studios');
}
