import type { Knex } from 'knex';

// Password-reset tokens, stored as SHA-256 (hex) only; single use and short-lived.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('password_resets', (table) => {
    table.increments('id');
    table.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    table.specificType('token_hash', 'CHAR(64)').notNullable().unique();
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('expires_at').notNullable();
    table.dateTime('used_at').nullable();
    table.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_resets');
}
