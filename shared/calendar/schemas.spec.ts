import { holidayPlaceSchema } from './holiday-place-schema';
import { customOccasionSchema, isoDateSchema, marketSchema } from './schemas';

describe('calendar schemas', () => {
  const market = { name: 'Riverside makers market', place: 'Old mill yard', start: '2026-05-02' };

  it('accepts a market with a rule, exceptions and deadlines', () => {
    const parsed = marketSchema.safeParse({
      ...market,
      rrule: 'FREQ=MONTHLY;BYDAY=1SA',
      exdates: ['2026-08-01'],
      rdates: ['2026-12-19'],
      hours: '9:00–15:00',
      boothFeeCents: 4500,
      applicationDeadline: '2026-03-01',
      decisionDate: '2026-03-15',
      kitsAllowed: true,
    });
    expect(parsed.success).toBe(true);
  });

  it('says what is wrong with a market rule', () => {
    const parsed = marketSchema.safeParse({ ...market, rrule: 'FREQ=WEEKLY;BYDAY=SAT' });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]).toMatchObject({
      path: ['rrule'],
      message: expect.stringMatching(/BYDAY item "SAT"/),
    });
  });

  it('rejects impossible dates, negative fees and a decision before the deadline', () => {
    expect(isoDateSchema.safeParse('2026-02-30').success).toBe(false);
    expect(marketSchema.safeParse({ ...market, boothFeeCents: -1 }).success).toBe(false);
    expect(marketSchema.safeParse({ ...market, boothFeeCents: 12.5 }).success).toBe(false);
    const late = marketSchema.safeParse({
      ...market,
      applicationDeadline: '2026-03-15',
      decisionDate: '2026-03-01',
    });
    expect(late.error?.issues[0].path).toEqual(['decisionDate']);
  });

  it('checks the holiday place against the holiday data', () => {
    expect(holidayPlaceSchema.safeParse({ country: 'GB', region: 'ENG' }).success).toBe(true);
    expect(holidayPlaceSchema.safeParse({ country: 'CA', region: null }).success).toBe(true);
    expect(
      holidayPlaceSchema.safeParse({ country: 'GB', region: 'ON' }).error?.issues[0].path,
    ).toEqual(['region']);
    expect(holidayPlaceSchema.safeParse({ country: 'usa' }).success).toBe(false);
  });

  it('needs a rule or dates for a custom occasion', () => {
    expect(
      customOccasionSchema.safeParse({ name: 'Open studio day', dates: ['2026-06-06'] }).success,
    ).toBe(true);
    expect(customOccasionSchema.safeParse({ name: 'Open studio day' }).success).toBe(false);
  });
});
