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

export interface DemoSeedResult {
  studioId: number;
  isNew: boolean;
}

/** Idempotent: a second run finds the demo owner's studio and leaves it as it is. */
export async function seedDemoStudio(db: Knex): Promise<DemoSeedResult> {
  const existing = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .join('studios as s', 's.id', 'm.studio_id')
    .where({ 'u.email': demoMembers[0].email, 's.name': demoStudioName })
    .first('s.id');
  if (existing) return { studioId: existing.id, isNew: false };

  const passwordHash = await hashPassword(demoPassword);
  const studioId = await db.transaction(async (trx) => {
    const [id] = await trx('studios').insert({
      name: demoStudioName,
      timezone: 'America/Chicago',
      country: 'US',
      region: null,
      week_start: 7,
      work_days: '1,2,3,4,5,6',
      daily_capacity_hours: 7,
      holidays_off: true,
    });
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
  await seedDemoImports(db, studioId, ownerId);
  await seedDemoThemes(db, studioId, ownerId);
  await seedDemoCalendar(db, studioId);
  return { studioId, isNew: true };
}
