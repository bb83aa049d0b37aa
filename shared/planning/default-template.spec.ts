import { publicHolidayDates } from '../calendar/holidays';
import { DEFAULT_DECOR_TEMPLATE } from './default-template';
import { planRunway } from './runway';
import { runwayTemplateSchema } from './schemas';
import { WorkCalendar } from './work-calendar';

describe('DEFAULT_DECOR_TEMPLATE', () => {
  const steps = DEFAULT_DECOR_TEMPLATE.steps;
  const byName = (name: string) => steps.find((step) => step.name === name)!;

  it('has the steps of a laser-cut decor line in order, ending on a launch milestone', () => {
    expect(steps.map((step) => step.name)).toEqual([
      'Design',
      'Prototype and test cut',
      'Batch cut',
      'Finish',
      'Assemble',
      'Photograph',
      'List',
      'Film',
      'Edit',
      'Publish',
      'Launch',
    ]);
    expect(steps.at(-1)).toMatchObject({ kind: 'launch', workDays: 0 });
    expect(steps.reduce((total, step) => total + step.workDays, 0)).toBe(18);
    // Cure is a lag after Finish, not a step of its own.
    expect(byName('Finish').cureDays).toBe(3);
    expect(runwayTemplateSchema.safeParse(DEFAULT_DECOR_TEMPLATE).success).toBe(true);
  });

  it('carries the DESIGN §8 cautions on cutting and finishing', () => {
    for (const name of ['Prototype and test cut', 'Batch cut']) {
      const cautions = byName(name).cautions!.join(' ');
      expect(cautions).toMatch(/unattended/);
      expect(cautions).toMatch(/extinguisher/);
      expect(cautions).toMatch(/never PVC or vinyl/);
      expect(cautions).toMatch(/[Vv]ent fumes/);
      expect(cautions).toMatch(/manual and local codes/);
    }
    expect(byName('Finish').cautions!.join(' ')).toMatch(/cure in a well-ventilated space/);
    expect(byName('Batch cut').cautions!.join(' ')).toMatch(
      /children.*electrical.*outdoor.*licensed professionals/,
    );
    expect(byName('Design').cautions).toBeUndefined();
  });

  it('plans back from Mother’s Day 2026 for a Monday–Friday studio', () => {
    // L = 2026-05-10 − 7 = Sun 05-03. Publish Fri 05-01; Edit 04-29..04-30; Film 04-28; List 04-27;
    // Photograph Fri 04-24; Assemble 04-22..04-23; Finish: latestEnd = 04-22 − 1 − 3 = Sat 04-18 →
    // 04-16..04-17 (cures Sat to Mon); Batch cut 04-13..04-15; Prototype 04-09..04-10; Design
    // 04-06..04-08. No US federal holiday falls in April 2026.
    const calendar = new WorkCalendar({
      workDays: [1, 2, 3, 4, 5],
      dailyCapacityHours: 8,
      blackoutDates: [],
      holidaysOff: true,
      marketDays: [],
      holidays: publicHolidayDates('US', undefined, '2026-01-01', '2026-12-31'),
    });
    const plan = planRunway(
      { anchorDate: '2026-05-10', offsetDays: 7, steps, today: '2026-03-02' },
      calendar,
    );
    expect(plan.steps.map((step) => step.start)).toEqual([
      '2026-04-06',
      '2026-04-09',
      '2026-04-13',
      '2026-04-16',
      '2026-04-22',
      '2026-04-24',
      '2026-04-27',
      '2026-04-28',
      '2026-04-29',
      '2026-05-01',
      '2026-05-03',
    ]);
    expect(plan.warnings).toEqual([]);
    expect(plan.steps[1].cautions).toEqual(byName('Prototype and test cut').cautions);
  });
});
