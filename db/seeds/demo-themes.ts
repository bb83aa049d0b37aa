import type { Knex } from 'knex';
import { ScoringService } from '../../server/series/scoring-service';
import { ThemesService } from '../../server/themes/themes-service';

// Two invented themes for the demo studio, built from whatever series the imports seed left.
const demoThemes = [
  { name: 'Kitchen garden line', terms: ['herb planter box', 'garden stake set'], items: ['Herb planter box', 'Garden stake set'], status: 'shortlisted' as const, notes: 'Planters and stakes for the spring markets; outdoor pieces need an exterior-rated finish.' },
  { name: 'Autumn porch lights', terms: ['lantern panel', 'pumpkin porch sign'], items: ['Lantern panel, walnut', 'Pumpkin porch sign'], status: 'idea' as const, notes: 'Lantern panels and porch signs for the autumn fair; lanterns take battery candles only.' },
];

/** Scores every series of the studio, then adds the demo themes that are not there yet (by name). */
export async function seedDemoThemes(db: Knex, studioId: number, ownerId: number): Promise<void> {
  const scoring = new ScoringService(db);
  await scoring.rescoreStudio(studioId);
  const themes = new ThemesService(db, scoring);
  const owner = { id: studioId, role: 'owner' as const, userId: ownerId };
  const existing = new Set(await db('themes').where({ studio_id: studioId }).pluck('name'));
  const series: { id: number; term: string }[] = await db('series').where({ studio_id: studioId }).orderBy('id').select('id', 'term');
  for (const [index, theme] of demoThemes.entries()) {
    if (existing.has(theme.name)) continue;
    const wanted = series.filter((row) => theme.terms.includes(row.term.toLowerCase()));
    // Without the demo files (a bare database), take any two series so the screens still show a theme.
    const members = wanted.length > 0 ? wanted : series.slice(index * 2, index * 2 + 2);
    await themes.create(owner, { name: theme.name, status: theme.status, seriesIds: [...new Set(members.map((row) => row.id))], items: theme.items, notes: theme.notes });
  }
}
