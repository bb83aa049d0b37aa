import type { Knex } from 'knex';
import { addDays } from '@shared/calendar/dates';
import { appClock } from '../../server/clock/clock';
import { RunwayService } from '../../server/runways/runway-service';

// Invented markets and two planned runways for the demo studio. Nothing here is a real event.
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
/** The runway under way on the day the demo is seeded: its steps before that day are done. */
export const demoRunwayUnderWayName = 'Winter window stars';

/** The part of a planned step that decides whether it is work at hand. */
export interface PlannedStep {
  kind: string;
  start: string | null;
  end: string | null;
}

/**
 * Whether a runway planned so, its steps that ended before `today` done, leaves work at hand for both
 * the partner (build steps) and crew (content steps) on `today` and after midnight: a build step still
 * open tomorrow and a content step open within the next 7 days (the home page's window).
 */
export function leavesWorkAtHand(steps: readonly PlannedStep[], today: string): boolean {
  const open = (step: PlannedStep, from: string) => step.start !== null && step.end !== null && step.end >= from && step.start <= addDays(today, 7);
  return steps.some((step) => step.kind === 'build' && open(step, addDays(today, 1))) && steps.some((step) => step.kind === 'content' && open(step, today));
}

/** How far ahead the runway under way may launch at most (the default template is about 4 weeks). */
const LATEST_LAUNCH_DAYS = 60;

/**
 * Writes the demo markets, a runway planned back from the fair and one under way (its past steps
 * ticked done, build and content work left at hand); resets what it wrote before.
 */
export async function seedDemoCalendar(db: Knex, studioId: number): Promise<void> {
  const memberships: { user_id: number; role: string }[] = await db('memberships').where({ studio_id: studioId }).orderBy('user_id').select('user_id', 'role');
  const memberOf = (role: string) => memberships.find((member) => member.role === role)?.user_id;
  const ownerId = memberOf('owner');
  if (ownerId === undefined) throw new Error(`demo studio ${studioId} has no owner`);
  await db('runways').where({ studio_id: studioId }).whereIn('name', [demoRunwayName, demoRunwayUnderWayName]).delete();
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
  const assign = async (steps: { id: string; kind: string }[]) => {
    for (const step of steps) {
      const assignee = step.kind === 'build' ? byKind.build : step.kind === 'content' ? byKind.content : undefined;
      if (assignee) await db('events').where({ id: Number(step.id), studio_id: studioId }).update({ assignee_user_id: assignee });
    }
  };
  await assign(runway.steps);

  // The same template, launching on the first day that leaves build and content work at hand, whatever
  // the weekday and hour; what ended before today was done by its assignee.
  const studio = await db('studios').where({ id: studioId }).first('timezone');
  const today = appClock.today(studio.timezone);
  const runways = new RunwayService(db);
  const owner = { id: studioId, role: 'owner' } as const;
  let launch = addDays(today, 1);
  for (let ahead = 1; ahead <= LATEST_LAUNCH_DAYS; ahead += 1) {
    launch = addDays(today, ahead);
    const preview = await runways.preview(owner, { anchorDate: launch, offsetDays: 0, templateId: 'default' });
    if (leavesWorkAtHand(preview.steps, today)) break;
  }
  const underWay = await runways.create(owner, ownerId, { anchorDate: launch, offsetDays: 0, templateId: 'default', name: demoRunwayUnderWayName });
  await assign(underWay.steps);
  const doneBefore = underWay.steps.filter((step) => step.end !== null && step.end < today).map((step) => Number(step.id));
  await db('events')
    .whereIn('id', doneBefore)
    .andWhere({ studio_id: studioId })
    .update({ done: true, done_by: db.raw('coalesce(assignee_user_id, ?)', [ownerId]), done_at: db.fn.now() });
}
