import type { Knex } from 'knex';

// What the weekly agenda scheduler has sent: one row per studio, member and week (the Monday).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('agenda_sends', (table) => {
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    table.date('week').notNullable();
    table.dateTime('sent_at').notNullable().defaultTo(knex.fn.now());
    table.primary(['studio_id', 'user_id', 'week']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('agenda_sends');
}
