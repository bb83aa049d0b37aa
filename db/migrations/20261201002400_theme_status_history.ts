import type { Knex } from 'knex';

// Every status change of a theme, with who made it and when (issue 4, "with who and when").
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('theme_status_history', (table) => {
    table.increments('id');
    table.integer('theme_id').unsigned().notNullable().references('themes.id').onDelete('CASCADE');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('from_status', 16).nullable();
    table.string('to_status', 16).notNullable();
    table.string('target_kind', 16).nullable();
    table.string('target_value', 64).nullable();
    table.integer('changed_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.dateTime('changed_at', { precision: 3 }).notNullable();
    table.index(['theme_id', 'changed_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('theme_status_history');
}
