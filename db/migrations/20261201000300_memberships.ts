import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('memberships', (table) => {
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    table.enum('role', ['owner', 'partner', 'crew']).notNullable();
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.primary(['studio_id', 'user_id']);
    table.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('memberships');
}
