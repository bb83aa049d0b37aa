import type { Knex } from 'knex';

// Mail captured by the local SMTP fake outside production; a table so it survives restarts.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('dev_mailbox', (table) => {
    table.increments('id');
    table.string('to', 1000).notNullable();
    table.string('subject', 500).notNullable();
    table.specificType('text', 'MEDIUMTEXT').nullable();
    table.specificType('html', 'MEDIUMTEXT').nullable();
    table.dateTime('date', { precision: 3 }).notNullable();
    table.index(['date']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('dev_mailbox');
}
