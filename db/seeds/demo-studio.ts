import type { Knex } from 'knex';
import { hashPassword } from '../../server/auth/passwords';
import { seedDemoCalendar } from './demo-calendar';
import { seedDemoImports } from './demo-imports';
import { seedDemoThemes } from './demo-themes';

// An invented studio of our own for the demo; these sign-ins are printed at start and are demo data only.
export const demoPassword = 'kerfcast-demo';
export const demoStudioName = 'Fernhollow Workshop';
export const demoMembers = [
  { email: 'owner@demo.test', name: 'Wren Calloway', role: 'owner' },
  { email: 'partner@demo.test', name: 'Tobin Ashgrove', role: 'partner' },
  { email: 'crew@demo.test', name: 'Juniper Lake', role: 'crew' },
] as const;

/** The demo studio's place and work week, as stored. */
export const demoStudioSettings = {
  timezone: 'America/Chicago',
  country: 'US',
  region: null,
  week_start: 7,
  work_days: '1,2,3,4,5,6',
  daily_capacity_hours: 7,
  holidays_off: true,
} as const;

export interface DemoSeedResult {
  studioId: number;
  isNew: boolean;
}

/**
 * Idempotent: a second run finds the demo owner's studio and leaves what it holds as it is, only
 * seeding a part (imports, themes, calendar) of which it has nothing at all: a first start stopped
 * half way, or a database made before that part of the demo existed, would otherwise stay empty.
 */
export async function seedDemoStudio(db: Knex): Promise<DemoSeedResult> {
  const existing = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .join('studios as s', 's.id', 'm.studio_id')
    .where({ 'u.email': demoMembers[0].email, 's.name': demoStudioName })
    .first('s.id', 'u.id as ownerId');
  if (existing) {
    await seedMissingParts(db, existing.id, existing.ownerId);
    return { studioId: existing.id, isNew: false };
  }

  const passwordHash = await hashPassword(demoPassword);
  const studioId = await db.transaction(async (trx) => {
    const [id] = await trx('studios').insert({ name: demoStudioName, ...demoStudioSettings });
    for (const member of demoMembers) {
      let user = await trx('users').where({ email: member.email }).first('id');
      if (!user) {
        const [userId] = await trx('users').insert({ email: member.email, name: member.name, password_hash: passwordHash });
        user = { id: userId };
      }
      await trx('memberships').insert({ studio_id: id, user_id: user.id, role: member.role });
    }
    return id as number;
  });
  const ownerId = (await db('users').where({ email: demoMembers[0].email }).first('id')).id as number;
  await seedMissingParts(db, studioId, ownerId);
  return { studioId, isNew: true };
}

/** Seeds each part of the demo that the studio has no rows of (the themes score the imported series). */
async function seedMissingParts(db: Knex, studioId: number, ownerId: number): Promise<void> {
  const hasAny = async (table: string) => (await db(table).where({ studio_id: studioId }).first('id')) !== undefined;
  if (!(await hasAny('imports'))) await seedDemoImports(db, studioId, ownerId);
  if (!(await hasAny('themes'))) await seedDemoThemes(db, studioId, ownerId);
  if (!(await hasAny('runways')) && !(await hasAny('markets'))) await seedDemoCalendar(db, studioId);
}
