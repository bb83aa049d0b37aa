import type { Knex } from 'knex';
import { RunwayService } from '../../server/runways/runway-service';

// Invented markets and one planned runway for the demo studio. Nothing here is a real event.
export const demoMarkets = [
  {
    name: 'Thistledown Makers Market',
    place: 'Thistledown commons, north lawn',
    start: '2026-01-10',
    // Second Saturday of every month, except the January break.
    rrule: 'FREQ=MONTHLY;BYDAY=2SA',
    exdates: ['2027-01-09'],
    hours: '8:00–13:00',
    booth_fee_cents: 3500,
    kits_allowed: true,
    notes: 'Tent weights required; power at the east row only.',
  },
  {
    name: 'Quarry Hill Harvest Fair',
    place: 'Quarry Hill fairgrounds, hall B',
    start: '2026-10-03',
    // First Saturday of October, once a year; juried, so it has an application round.
    rrule: 'FREQ=YEARLY;BYMONTH=10;BYDAY=1SA',
    exdates: [],
    hours: '9:00–17:00',
    booth_fee_cents: 18500,
    application_deadline: '2027-06-15',
    decision_date: '2027-07-15',
    kits_allowed: false,
    notes: 'Load-in from 7:00 at the service gate.',
  },
] as const;

export const demoRunwayName = 'Harvest fair lanterns';

/** Writes the demo markets and a runway planned back from the fair; resets what it wrote before. */
export async function seedDemoCalendar(db: Knex, studioId: number): Promise<void> {
  const memberships: { user_id: number; role: string }[] = await db('memberships').where({ studio_id: studioId }).orderBy('user_id').select('user_id', 'role');
  const memberOf = (role: string) => memberships.find((member) => member.role === role)?.user_id;
  const ownerId = memberOf('owner');
  if (ownerId === undefined) throw new Error(`demo studio ${studioId} has no owner`);
  await db('runways').where({ studio_id: studioId, name: demoRunwayName }).delete();
  await db('markets').whereIn('name', demoMarkets.map((market) => market.name)).andWhere({ studio_id: studioId }).delete();
  const ids: number[] = [];
  for (const market of demoMarkets) {
    const [id] = await db('markets').insert({ ...market, studio_id: studioId, exdates: JSON.stringify(market.exdates), rdates: '[]' });
    ids.push(id);
  }
  // The default laser-cut decor template, launching two weeks before the next fair.
  const runway = await new RunwayService(db).create({ id: studioId, role: 'owner' }, ownerId, {
    anchor: { kind: 'market', value: String(ids[1]) },
    offsetDays: 14,
    templateId: 'default',
    name: demoRunwayName,
  });
  const byKind = { build: memberOf('partner'), content: memberOf('crew') };
  for (const step of runway.steps) {
    const assignee = step.kind === 'build' ? byKind.build : step.kind === 'content' ? byKind.content : undefined;
    if (assignee) await db('events').where({ id: Number(step.id), studio_id: studioId }).update({ assignee_user_id: assignee });
  }
}
