import type { Knex } from 'knex';

// Issue 23: a theme attaches an item one way only, as an item. Sales series that were added to
// themes as series become the theme's items (by their item name) and leave theme_series.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    `INSERT IGNORE INTO theme_items (theme_id, item, studio_id)
     SELECT ts.theme_id, s.term, ts.studio_id FROM theme_series ts JOIN series s ON s.id = ts.series_id AND s.studio_id = ts.studio_id
     WHERE s.kind = 'sales'`,
  );
  await knex.raw(
    `DELETE ts FROM theme_series ts JOIN series s ON s.id = ts.series_id WHERE s.kind = 'sales'`,
  );
}

// Which items were once series is not kept, so there is nothing to undo.
export async function down(): Promise<void> {}
