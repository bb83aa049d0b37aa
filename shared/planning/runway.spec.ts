import { WorkCalendar, type WorkCalendarSettings } from './work-calendar';
import {
  checkPlan,
  moveStep,
  planForward,
  planRunway,
  replanForward,
  RunwayError,
  type PlacedStep,
  type RunwayStep,
} from './runway';

// Hand-worked cases. Weekdays for reference: 2026-04-27 and 2026-05-04 are Mondays;
// 2026-05-25 is Memorial Day (a Monday); 2026-06-06 is a Saturday.
const mondayToFriday: WorkCalendarSettings = {
  workDays: [1, 2, 3, 4, 5],
  dailyCapacityHours: 8,
  blackoutDates: [],
  holidaysOff: true,
  holidays: [],
  marketDays: [],
};
const calendar = new WorkCalendar(mondayToFriday);

const shortLine: RunwayStep[] = [
  { name: 'Cut', kind: 'build', workDays: 2, hoursPerDay: 4, cureDays: 0 },
  { name: 'Finish', kind: 'build', workDays: 3, hoursPerDay: 4, cureDays: 2 },
  { name: 'Photograph', kind: 'content', workDays: 1, hoursPerDay: 3, cureDays: 0 },
  { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
];

const spans = (steps: PlacedStep[]) => steps.map((step) => [step.name, step.start, step.end]);

describe('planRunway (backward pass)', () => {
  it('places steps back from the launch with a cure over the weekend', () => {
    // L = 2026-05-10 (Mother's Day) − 3 = 2026-05-07 (Thu); Launch is a milestone on L.
    // Photograph: latestEnd = 05-07 − 1 − 0 = 05-06 (Wed) → 05-06.
    // Finish: latestEnd = 05-06 − 1 − 2 = 05-03 (Sun) → Fri 05-01, Thu 04-30, Wed 04-29;
    //   its cure runs Sat 05-02 and Sun 05-03.
    // Cut: latestEnd = 04-29 − 1 = 04-28 (Tue) → 04-28, 04-27.
    const plan = planRunway(
      { anchorDate: '2026-05-10', offsetDays: 3, steps: shortLine, today: '2026-04-01' },
      calendar,
    );
    expect(plan.launch).toBe('2026-05-07');
    expect(plan.start).toBe('2026-04-27');
    expect(spans(plan.steps)).toEqual([
      ['Cut', '2026-04-27', '2026-04-28'],
      ['Finish', '2026-04-29', '2026-05-01'],
      ['Photograph', '2026-05-06', '2026-05-06'],
      ['Launch', '2026-05-07', '2026-05-07'],
    ]);
    expect(plan.steps[1].days).toEqual(['2026-04-29', '2026-04-30', '2026-05-01']);
    expect(plan.steps[3].days).toEqual([]);
    expect(plan.warnings).toEqual([]);
  });

  it('skips a public holiday when holidays are days off, and uses it when they are not', () => {
    const steps: RunwayStep[] = [
      { name: 'Cut', kind: 'build', workDays: 3, hoursPerDay: 6, cureDays: 0 },
      { name: 'Finish', kind: 'build', workDays: 2, hoursPerDay: 5, cureDays: 1 },
      { name: 'Publish', kind: 'content', workDays: 1, hoursPerDay: 2, cureDays: 0 },
      { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
    ];
    const request = { anchorDate: '2026-05-29', offsetDays: 0, steps, today: '2026-05-01' };
    // L = 05-29 (Fri). Publish: latestEnd 05-28 → 05-28.
    // Finish: latestEnd = 05-28 − 1 − 1 = 05-26 (Tue) → 05-26, skip Mon 05-25 (holiday), Fri 05-22.
    // Cut: latestEnd = 05-22 − 1 = 05-21 → 05-21, 05-20, 05-19.
    const off = planRunway(
      request,
      new WorkCalendar({ ...mondayToFriday, holidays: ['2026-05-25'] }),
    );
    expect(spans(off.steps)).toEqual([
      ['Cut', '2026-05-19', '2026-05-21'],
      ['Finish', '2026-05-22', '2026-05-26'],
      ['Publish', '2026-05-28', '2026-05-28'],
      ['Launch', '2026-05-29', '2026-05-29'],
    ]);
    expect(off.steps[1].days).toEqual(['2026-05-22', '2026-05-26']);
    // Holidays worked: Finish 05-25, 05-26; Cut: latestEnd 05-24 (Sun) → 05-22, 05-21, 05-20.
    const worked = planRunway(
      request,
      new WorkCalendar({ ...mondayToFriday, holidays: ['2026-05-25'], holidaysOff: false }),
    );
    expect(spans(worked.steps).slice(0, 2)).toEqual([
      ['Cut', '2026-05-20', '2026-05-22'],
      ['Finish', '2026-05-25', '2026-05-26'],
    ]);
  });

  it('skips days whose booked hours leave no room, and fills a day exactly to capacity', () => {
    // Another runway books 6 h on Thu 05-14. L = 05-16 − 1 = 05-15 (Fri).
    // Engrave (4 h): latestEnd 05-14: 6 + 4 = 10 > 8 → skip; 05-13 and 05-12 fit.
    // Sand (2 h) instead: 6 + 2 = 8 ≤ 8 → 05-14 and 05-13.
    const booked = new WorkCalendar(mondayToFriday, [{ date: '2026-05-14', hours: 6 }]);
    const launch: RunwayStep = {
      name: 'Launch',
      kind: 'launch',
      workDays: 0,
      hoursPerDay: 0,
      cureDays: 0,
    };
    const engrave = planRunway(
      {
        anchorDate: '2026-05-16',
        offsetDays: 1,
        today: '2026-05-01',
        steps: [
          { name: 'Engrave', kind: 'build', workDays: 2, hoursPerDay: 4, cureDays: 0 },
          launch,
        ],
      },
      booked,
    );
    expect(engrave.steps[0].days).toEqual(['2026-05-12', '2026-05-13']);
    const sand = planRunway(
      {
        anchorDate: '2026-05-16',
        offsetDays: 1,
        today: '2026-05-01',
        steps: [{ name: 'Sand', kind: 'build', workDays: 2, hoursPerDay: 2, cureDays: 0 }, launch],
      },
      booked,
    );
    expect(sand.steps[0].days).toEqual(['2026-05-13', '2026-05-14']);
    expect(sand.warnings).toEqual([]);
  });

  it('keeps build work off market days but lets content happen there', () => {
    // Tuesday–Saturday studio, market on Sat 06-06. L = 06-10 (Wed).
    // Film (content): latestEnd 06-09 (Tue) → 06-09. Cut (build): latestEnd 06-08 (Mon, off),
    // 06-07 (Sun, off), 06-06 (market) → 06-05, 06-04.
    const studio = new WorkCalendar({
      ...mondayToFriday,
      workDays: [2, 3, 4, 5, 6],
      marketDays: ['2026-06-06'],
    });
    const plan = planRunway(
      {
        anchorDate: '2026-06-10',
        offsetDays: 0,
        today: '2026-05-01',
        steps: [
          { name: 'Cut', kind: 'build', workDays: 2, hoursPerDay: 6, cureDays: 0 },
          { name: 'Film', kind: 'content', workDays: 1, hoursPerDay: 4, cureDays: 0 },
          { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
        ],
      },
      studio,
    );
    expect(spans(plan.steps)).toEqual([
      ['Cut', '2026-06-04', '2026-06-05'],
      ['Film', '2026-06-09', '2026-06-09'],
      ['Launch', '2026-06-10', '2026-06-10'],
    ]);
    // Content with latestEnd on the market day itself takes it: L = 06-07 → Film 06-06.
    const filmAtMarket = planRunway(
      {
        anchorDate: '2026-06-07',
        offsetDays: 0,
        today: '2026-05-01',
        steps: [{ name: 'Film', kind: 'content', workDays: 1, hoursPerDay: 4, cureDays: 0 }],
      },
      studio,
    );
    expect(filmAtMarket.steps[0].days).toEqual(['2026-06-06']);
  });

  it('says how many work days short the runway is and finds the first feasible launch', () => {
    // Same plan as the first case, today = Wed 04-29: Cut's 04-27 and 04-28 are in the past → 2 short.
    // Forward from 04-29: Cut 04-29, 04-30; Finish 05-01, 05-04, 05-05, ready 05-05 + 1 + 2 = 05-08;
    // Photograph 05-08; Launch 05-09. Anchor = 05-09 + 3 = 05-12.
    const plan = planRunway(
      { anchorDate: '2026-05-10', offsetDays: 3, steps: shortLine, today: '2026-04-29' },
      calendar,
    );
    expect(plan.warnings).toHaveLength(1);
    expect(plan.warnings[0]).toMatchObject({
      code: 'too-short',
      shortByWorkDays: 2,
      firstFeasibleLaunch: '2026-05-09',
    });
    expect(plan.warnings[0].message).toMatch(/too short by 2 work days/);
    expect(plan.warnings[0].message).toMatch(
      /first feasible launch is 2026-05-09 \(anchor 2026-05-12\)/,
    );
    expect(spans(planForward(shortLine, '2026-04-29', calendar)).map(([, start]) => start)).toEqual(
      ['2026-04-29', '2026-05-01', '2026-05-08', '2026-05-09'],
    );
  });

  it('places a step longer than the day on work days and reports the capacity clash', () => {
    const plan = planRunway(
      {
        anchorDate: '2026-05-08',
        offsetDays: 0,
        today: '2026-05-01',
        steps: [{ name: 'Marathon cut', kind: 'build', workDays: 1, hoursPerDay: 10, cureDays: 0 }],
      },
      calendar,
    );
    expect(plan.steps[0].days).toEqual(['2026-05-07']);
    expect(plan.warnings.map((warning) => warning.code)).toEqual(['capacity']);
  });

  it('gives up with a clear error when there is no room within the bound', () => {
    const everyDayOff = new WorkCalendar({
      ...mondayToFriday,
      workDays: [6],
      marketDays: [],
      blackoutDates: [],
    });
    const saturdaysAtMarket = new WorkCalendar({
      ...mondayToFriday,
      workDays: [6],
      marketDays: Array.from({ length: 200 }, (_, week) =>
        everyDayOff.addWorkDays('2026-06-07', -(week + 1)),
      ),
    });
    expect(() =>
      planRunway(
        {
          anchorDate: '2026-06-10',
          offsetDays: 0,
          today: '2020-01-01',
          steps: [{ name: 'Cut', kind: 'build', workDays: 200, hoursPerDay: 1, cureDays: 0 }],
        },
        saturdaysAtMarket,
      ),
    ).toThrow(RunwayError);
    expect(() =>
      planRunway(
        {
          anchorDate: '2026-06-10',
          offsetDays: 0,
          today: '2026-01-01',
          steps: [{ name: 'Cut', kind: 'build', workDays: 1.5, hoursPerDay: 1, cureDays: 0 }],
        },
        calendar,
      ),
    ).toThrow(/workDays must be a whole number/);
  });

  it('an empty runway is just the launch', () => {
    expect(
      planRunway(
        { anchorDate: '2026-05-10', offsetDays: 0, steps: [], today: '2026-01-01' },
        calendar,
      ),
    ).toEqual({ launch: '2026-05-10', start: '2026-05-10', steps: [], warnings: [] });
  });
});

describe('checkPlan and replanForward', () => {
  const plan = planRunway(
    { anchorDate: '2026-05-10', offsetDays: 3, steps: shortLine, today: '2026-04-01' },
    calendar,
  );
  const withMoved = (index: number, start: string) =>
    plan.steps.map((step, position) =>
      position === index ? moveStep(step, start, calendar) : step,
    );

  it('finds nothing wrong with a fresh plan', () => {
    expect(checkPlan(plan.steps, calendar, { today: '2026-04-01' })).toEqual([]);
  });

  it('warns when a step starts before its predecessor ends', () => {
    // Finish moved to Tue 04-28: Cut ends 04-28.
    const warnings = checkPlan(withMoved(1, '2026-04-28'), calendar);
    expect(warnings.map((warning) => [warning.code, warning.stepIndex])).toEqual([['order', 1]]);
  });

  it('warns inside the cure time and on a day off', () => {
    // Photograph moved to Sun 05-03: after Finish ends (05-01) but before 05-01 + 1 + 2 = 05-04.
    const warnings = checkPlan(withMoved(2, '2026-05-03'), calendar);
    expect(warnings.map((warning) => warning.code).sort()).toEqual(['blackout', 'cure']);
    expect(warnings.find((warning) => warning.code === 'cure')?.message).toMatch(
      /earliest start is 2026-05-04/,
    );
    expect(warnings.find((warning) => warning.code === 'blackout')?.message).toMatch(
      /2026-05-03 is a Sunday/,
    );
  });

  it('warns when hours booked elsewhere and the step overfill a day', () => {
    // 6 h booked on 05-06 + Photograph's 3 h = 9 h > 8 h.
    const busy = calendar.withBookings([{ date: '2026-05-06', hours: 6 }]);
    const [warning] = checkPlan(plan.steps, busy);
    expect(warning).toMatchObject({ code: 'capacity', stepIndex: 2, dates: ['2026-05-06'] });
  });

  it('checks steps given only by start and end (days worked out from the calendar)', () => {
    const dragged = plan.steps.map((step) => ({ ...step, days: [] }));
    expect(checkPlan(dragged, calendar)).toEqual([]);
    // Finish squeezed into Fri 05-01..Mon 05-04: 2 work days for a 3-day step.
    dragged[1] = { ...dragged[1], start: '2026-05-01', end: '2026-05-04' };
    dragged[2] = { ...dragged[2], start: '2026-05-07', end: '2026-05-07' };
    dragged[3] = { ...dragged[3], start: '2026-05-08', end: '2026-05-08' };
    expect(checkPlan(dragged, calendar).map((warning) => warning.code)).toEqual(['blackout']);
  });

  it('pushes the following steps later, keeping order and cure, after a step moves later', () => {
    // Finish moved to Mon 05-04: days 05-04..05-06, ready 05-06 + 1 + 2 = 05-09 (Sat).
    // Photograph (05-06) is now too early → first work day from 05-09 is Mon 05-11.
    // Launch (05-07) → 05-11 + 1 = 05-12.
    const replanned = replanForward(withMoved(1, '2026-05-04'), 1, calendar);
    expect(spans(replanned.steps)).toEqual([
      ['Cut', '2026-04-27', '2026-04-28'],
      ['Finish', '2026-05-04', '2026-05-06'],
      ['Photograph', '2026-05-11', '2026-05-11'],
      ['Launch', '2026-05-12', '2026-05-12'],
    ]);
    expect(replanned.launch).toBe('2026-05-12');
    expect(replanned.warnings).toEqual([]);
  });

  it('leaves later steps that still fit where they are, and reports what the move broke', () => {
    // Finish moved back to Wed 04-22 (before Cut): Photograph and Launch still fit after it.
    const replanned = replanForward(withMoved(1, '2026-04-22'), 1, calendar);
    expect(spans(replanned.steps).slice(2)).toEqual([
      ['Photograph', '2026-05-06', '2026-05-06'],
      ['Launch', '2026-05-07', '2026-05-07'],
    ]);
    expect(replanned.warnings.map((warning) => [warning.code, warning.stepIndex])).toEqual([
      ['order', 1],
    ]);
  });

  it('moves a following step off days that have filled up since', () => {
    // 6 h now booked on Mon 05-11; after moving Finish to 05-04, Photograph (3 h) cannot take 05-11
    // and goes to Tue 05-12; the launch follows on 05-13.
    const busy = calendar.withBookings([{ date: '2026-05-11', hours: 6 }]);
    const replanned = replanForward(withMoved(1, '2026-05-04'), 1, busy);
    expect(spans(replanned.steps).slice(2)).toEqual([
      ['Photograph', '2026-05-12', '2026-05-12'],
      ['Launch', '2026-05-13', '2026-05-13'],
    ]);
    expect(() => replanForward(plan.steps, 9, calendar)).toThrow(RangeError);
  });
});

describe('an order warning in words', () => {
  it('when a step starts on its predecessor\'s last day, then the warning names that last day and the first free one', () => {
    // Hand-worked: Design runs 2026-12-14 to 2026-12-16, so Assemble may start on 2026-12-17 at the earliest.
    const calendar = new WorkCalendar({ workDays: [1, 2, 3, 4, 5, 6, 7], dailyCapacityHours: 24, blackoutDates: [], holidaysOff: false, holidays: [], marketDays: [] });
    const design = { name: 'Design', kind: 'build' as const, workDays: 3, hoursPerDay: 1, cureDays: 0, cautions: [], start: '2026-12-14', end: '2026-12-16', days: ['2026-12-14', '2026-12-15', '2026-12-16'] };
    const assemble = { name: 'Assemble', kind: 'build' as const, workDays: 1, hoursPerDay: 1, cureDays: 0, cautions: [], start: '2026-12-16', end: '2026-12-16', days: ['2026-12-16'] };
    expect(checkPlan([design, assemble], calendar).map((warning) => warning.message)).toEqual(['Assemble starts on 2026-12-16, but Design runs until 2026-12-16; the earliest start is 2026-12-17']);
  });
});
