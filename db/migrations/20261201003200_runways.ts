import type { Knex } from 'knex';

// A planned runway: where it was anchored and the launch the backward pass gave. Its steps are events.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('runways', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.integer('theme_id').unsigned().nullable().references('themes.id').onDelete('SET NULL');
    table.string('name', 120).notNullable();
    // "default" or a runway_templates id as text; null when the steps were given inline.
    table.string('template', 20).nullable();
    table.enum('anchor_kind', ['date', 'holiday', 'occasion', 'market', 'theme']).notNullable().defaultTo('date');
    table.string('anchor_value', 80).nullable();
    table.date('anchor_date').notNullable();
    table.integer('offset_days').notNullable().defaultTo(0);
    table.date('launch').notNullable();
    table.integer('version').notNullable().defaultTo(1);
    table.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.index(['studio_id', 'launch']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('runways');
}
