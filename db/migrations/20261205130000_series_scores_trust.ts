import type { Knex } from 'knex';

// Issue 23: a series with too little history has no heat (NULL); rise_per_year holds the rise the
// board shows and sorts by (the verdict's own measure, NULL without a clear trend); score_version
// marks how a score was computed, so a new way of scoring makes every stored score stale.
// One ALTER TABLE statement, so MariaDB applies all of it or none.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    'ALTER TABLE series_scores MODIFY heat DOUBLE NULL, ADD COLUMN rise_per_year DOUBLE NULL AFTER slope_pct, ADD COLUMN score_version INT NOT NULL DEFAULT 0 AFTER scored_for',
  );
}

export async function down(knex: Knex): Promise<void> {
  // Stored scores are a cache that is rebuilt on the next read; the ones without heat cannot stay.
  await knex('series_scores').whereNull('heat').delete();
  await knex.raw('ALTER TABLE series_scores MODIFY heat DOUBLE NOT NULL, DROP COLUMN rise_per_year, DROP COLUMN score_version');
}
