import type { Knex } from 'knex';

// What a captured mail is (invitation, reset, agenda, ...) and the studio that sent it, read from the
// X-Kerfcast-Kind and X-Kerfcast-Studio headers, so the mailbox shows each member only their own
// mail and owners the invitations their studio sent.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('dev_mailbox', (table) => {
    table.string('kind', 32).nullable();
    table.integer('studio_id').unsigned().nullable();
    table.index(['to']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('dev_mailbox', (table) => {
    table.dropIndex(['to']);
    table.dropColumn('kind');
    table.dropColumn('studio_id');
  });
}
