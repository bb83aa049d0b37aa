import type { Knex } from 'knex';

// A member's private calendar feed; the URL token is stored only as its SHA-256 (hex).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('feeds', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    table.enum('scope', ['all', 'mine', 'markets']).notNullable();
    table.boolean('include_holidays').notNullable().defaultTo(false);
    table.specificType('token_hash', 'CHAR(64)').notNullable().unique();
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('rotated_at').nullable();
    table.dateTime('last_fetched_at').nullable();
    table.index(['studio_id', 'user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('feeds');
}
