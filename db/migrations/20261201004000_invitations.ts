import type { Knex } from 'knex';

// Invitations by e-mail: the token itself is never stored, only its SHA-256 (hex).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('email', 254).notNullable();
    table.enum('role', ['owner', 'partner', 'crew']).notNullable();
    table.specificType('token_hash', 'CHAR(64)').notNullable().unique();
    table.integer('invited_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('expires_at').notNullable();
    table.dateTime('accepted_at').nullable();
    table.integer('accepted_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.index(['studio_id', 'email']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations');
}
