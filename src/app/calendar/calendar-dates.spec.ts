import { addMonths as addMonthsDateFns, endOfMonth, endOfWeek, format, startOfMonth, startOfWeek as startOfWeekDateFns } from 'date-fns';
import { addDays, dateRange } from '@shared/calendar/dates';
import { addMonths, formatLong, loadedRange, formatMonth, formatShort, formatWeekday, initialsOf, startOfWeek, visibleDays, weeksOf } from './calendar-dates';

// Checked against date-fns (startOfWeek with weekStartsOn, addMonths, format), an outside implementation.
const local = (iso: string) => new Date(`${iso}T12:00:00`);
const iso = (date: Date) => format(date, 'yyyy-MM-dd');

describe('calendar dates', () => {
  it.each([
    ['2026-12-01', 1],
    ['2026-12-06', 1],
    ['2026-12-06', 7],
    ['2027-01-01', 7],
    ['2024-02-29', 1],
    ['2026-03-08', 7], // a US daylight-saving change
  ] as const)('startOfWeek(%s, %i) agrees with date-fns', (date, weekStart) => {
    expect(startOfWeek(date, weekStart)).toBe(iso(startOfWeekDateFns(local(date), { weekStartsOn: weekStart === 7 ? 0 : 1 })));
  });

  it.each([
    ['2026-01-31', 1],
    ['2024-01-31', 1],
    ['2026-12-15', 1],
    ['2026-03-31', -1],
    ['2027-01-10', -13],
  ])('addMonths(%s, %i) agrees with date-fns', (date, months) => {
    expect(addMonths(date, months)).toBe(iso(addMonthsDateFns(local(date), months)));
  });

  it('lays December 2026 out as five whole weeks from Monday, or from Sunday', () => {
    const fromMonday = visibleDays('month', '2026-12-17', 1);
    expect([fromMonday[0], fromMonday[fromMonday.length - 1], fromMonday.length]).toEqual(['2026-11-30', '2027-01-03', 35]);
    const fromSunday = visibleDays('month', '2026-12-17', 7);
    expect([fromSunday[0], fromSunday[fromSunday.length - 1], fromSunday.length]).toEqual(['2026-11-29', '2027-01-02', 35]);
    expect(weeksOf(fromSunday).map((week) => week.length)).toEqual([7, 7, 7, 7, 7]);
  });

  it('needs six rows for a month that starts late in the week (August 2026 from Monday: Saturday the 1st to Monday the 31st)', () => {
    expect(visibleDays('month', '2026-08-01', 1).length).toBe(42);
  });

  it.each(['2026-12-17', '2026-08-01', '2027-02-14', '2024-02-29', '2026-03-08'])(
    'loads the month of %s from the earlier of its Monday and Sunday grid starts to the later of their ends, as date-fns lays them out',
    (date) => {
      const grids = [0, 1].map((weekStartsOn) => ({
        from: iso(startOfWeekDateFns(startOfMonth(local(date)), { weekStartsOn: weekStartsOn as 0 | 1 })),
        to: iso(endOfWeek(endOfMonth(local(date)), { weekStartsOn: weekStartsOn as 0 | 1 })),
      }));
      expect(loadedRange('month', date)).toEqual({ from: [grids[0].from, grids[1].from].sort()[0], to: [grids[0].to, grids[1].to].sort()[1] });
    },
  );

  it('loads a week from its Sunday to the Sunday after, and the agenda as it shows', () => {
    expect(loadedRange('week', '2026-12-03')).toEqual({ from: '2026-11-29', to: '2026-12-06' });
    expect(loadedRange('agenda', '2026-12-30')).toEqual({ from: '2026-12-30', to: '2027-01-06' });
  });

  it('shows one week for the week view and eight days for the agenda', () => {
    expect(visibleDays('week', '2026-12-03', 7)).toEqual(['2026-11-29', '2026-11-30', '2026-12-01', '2026-12-02', '2026-12-03', '2026-12-04', '2026-12-05']);
    expect(visibleDays('agenda', '2026-12-30', 1)).toEqual(['2026-12-30', '2026-12-31', '2027-01-01', '2027-01-02', '2027-01-03', '2027-01-04', '2027-01-05', '2027-01-06']);
  });

  it('names every day of a leap year and the next two years as date-fns formats them in US English', () => {
    for (const date of dateRange('2024-01-01', addDays('2027-01-01', -1))) {
      const day = local(date);
      expect([formatLong(date), formatShort(date), formatMonth(date), formatWeekday(date)]).toEqual([
        format(day, 'EEEE, MMMM d'),
        format(day, 'EEE, MMM d'),
        format(day, 'MMMM yyyy'),
        format(day, 'EEE'),
      ]);
    }
  });

  it.each([
    ['Tobin Ashgrove', 'TA'],
    ['Wren Mae Calloway', 'WC'],
    ['juniper', 'JU'],
    ['  ', ''],
    [null, ''],
  ])('initials of %p are %p', (name, initials) => {
    expect(initialsOf(name)).toBe(initials);
  });
});
