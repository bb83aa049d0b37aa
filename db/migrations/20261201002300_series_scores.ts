import type { Knex } from 'knex';

// Stored scores, so the Trends board sorts and pages in SQL. One row per series and target: ''
// is the default target (each series' own next peak); others are 'YYYY-MM', 'occasion:<key>',
// 'holiday:<key>' or 'date:YYYY-MM-DD', scored on demand and kept until the day or the series
// changes. scored_for is the studio's "today" the score was computed for.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('series_scores', (table) => {
    table.integer('series_id').unsigned().notNullable().references('series.id').onDelete('CASCADE');
    table.string('target', 80).notNullable().defaultTo('');
    table.integer('studio_id').unsigned().notNullable().references('studios.id').onDelete('CASCADE');
    table.date('scored_for').notNullable();
    table.double('heat').notNullable();
    table.string('verdict', 24).notNullable();
    table.double('recent_change').nullable();
    table.double('slope_pct').nullable();
    table.double('yoy').nullable();
    table.double('strength').nullable();
    table.date('next_peak').nullable();
    table.date('target_from').nullable();
    table.date('target_to').nullable();
    table.text('score_json', 'mediumtext').notNullable();
    table.text('spark_json', 'mediumtext').notNullable();
    table.dateTime('computed_at', { precision: 3 }).notNullable();
    table.primary(['series_id', 'target']);
    table.index(['studio_id', 'target', 'heat']);
    table.index(['studio_id', 'target', 'verdict']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('series_scores');
}
