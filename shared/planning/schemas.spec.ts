import {
  runwayPreviewRequestSchema,
  runwayStepSchema,
  workCalendarSettingsSchema,
} from './schemas';

describe('planning schemas', () => {
  const step = { name: 'Batch cut', kind: 'build', workDays: 3, hoursPerDay: 6, cureDays: 0 };

  it('accepts a preview request with steps or with a template id, not both or neither', () => {
    expect(
      runwayPreviewRequestSchema.safeParse({
        anchorDate: '2026-05-10',
        offsetDays: 7,
        steps: [step],
      }).success,
    ).toBe(true);
    expect(
      runwayPreviewRequestSchema.safeParse({
        anchorDate: '2026-05-10',
        offsetDays: 7,
        templateId: 3,
      }).success,
    ).toBe(true);
    expect(
      runwayPreviewRequestSchema.safeParse({ anchorDate: '2026-05-10', offsetDays: 7 }).success,
    ).toBe(false);
    expect(
      runwayPreviewRequestSchema.safeParse({
        anchorDate: '2026-05-10',
        offsetDays: 7,
        steps: [step],
        templateId: 3,
      }).success,
    ).toBe(false);
  });

  it('rejects impossible anchors and offsets', () => {
    expect(
      runwayPreviewRequestSchema.safeParse({
        anchorDate: '2026-02-29',
        offsetDays: 0,
        steps: [step],
      }).success,
    ).toBe(false);
    expect(
      runwayPreviewRequestSchema.safeParse({
        anchorDate: '2026-05-10',
        offsetDays: -1,
        steps: [step],
      }).success,
    ).toBe(false);
    expect(
      runwayPreviewRequestSchema.safeParse({
        anchorDate: '2026-05-10',
        offsetDays: 1.5,
        steps: [step],
      }).success,
    ).toBe(false);
  });

  it.each([
    [{ ...step, kind: 'cure' }],
    [{ ...step, workDays: 1.5 }],
    [{ ...step, hoursPerDay: 25 }],
    [{ ...step, cureDays: -1 }],
    [{ ...step, name: '  ' }],
  ])('rejects a bad step %o', (bad) => {
    expect(runwayStepSchema.safeParse(bad).success).toBe(false);
  });

  it('checks work-calendar settings', () => {
    expect(
      workCalendarSettingsSchema.safeParse({
        workDays: [1, 2, 3, 4, 5],
        dailyCapacityHours: 7.5,
        holidaysOff: true,
      }).success,
    ).toBe(true);
    expect(
      workCalendarSettingsSchema.safeParse({
        workDays: [],
        dailyCapacityHours: 8,
        holidaysOff: true,
      }).success,
    ).toBe(false);
    expect(
      workCalendarSettingsSchema.safeParse({
        workDays: [8],
        dailyCapacityHours: 8,
        holidaysOff: true,
      }).success,
    ).toBe(false);
  });
});
