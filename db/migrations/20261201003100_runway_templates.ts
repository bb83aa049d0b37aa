import type { Knex } from 'knex';

// A studio's own runway templates; the built-in default template lives in code (id "default").
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('runway_templates', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('name', 120).notNullable();
    // The ordered steps as JSON text: [{name, kind, workDays, hoursPerDay, cureDays, cautions?}].
    table.text('steps').notNullable();
    table.integer('version').notNullable().defaultTo(1);
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
    table.index(['studio_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('runway_templates');
}
