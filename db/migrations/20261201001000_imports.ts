import type { Knex } from 'knex';

// One uploaded CSV file: previewed first, then committed whole or not at all.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('imports', (table) => {
    table.increments('id');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.string('file_name', 255).notNullable();
    table.enum('kind', ['interest', 'sales']).notNullable();
    table.string('layout', 16).notNullable();
    table.enum('status', ['preview', 'committing', 'committed', 'failed']).notNullable().defaultTo('preview');
    table.specificType('sha256', 'CHAR(64)').notNullable();
    table.bigInteger('byte_size').notNullable().defaultTo(0);
    table.string('delimiter', 4).nullable();
    table.string('period', 10).nullable();
    table.integer('row_count').notNullable().defaultTo(0);
    table.integer('series_count').notNullable().defaultTo(0);
    table.integer('sales_rows').notNullable().defaultTo(0);
    table.integer('progress_rows').notNullable().defaultTo(0);
    table.date('period_start').nullable();
    table.date('period_end').nullable();
    // The preview answer and the mapping as JSON text; the uploaded file waits in stored_path until commit.
    table.text('preview_json', 'longtext').nullable();
    table.text('mapping_json').nullable();
    table.string('stored_path', 500).nullable();
    table.text('failure').nullable();
    table.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    table.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    table.dateTime('committed_at').nullable();
    table.index(['studio_id', 'sha256']);
    table.index(['studio_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('imports');
}
