import { addBusinessDays, differenceInBusinessDays, format } from 'date-fns';
import { WorkCalendar, bookingsFromEvents, type WorkCalendarSettings } from './work-calendar';

const mondayToFriday: WorkCalendarSettings = {
  workDays: [1, 2, 3, 4, 5],
  dailyCapacityHours: 8,
  blackoutDates: [],
  holidaysOff: true,
  holidays: [],
  marketDays: [],
};

// date-fns works on local Dates; build and print them in local time so the zone does not matter.
const toLocal = (date: string) => {
  const [year, month, day] = date.split('-').map(Number);
  return new Date(year, month - 1, day);
};
const fromLocal = (date: Date) => format(date, 'yyyy-MM-dd');

// A small seeded generator so the "random" table is the same on every run.
function randomDates(count: number, seed: number): string[] {
  let state = seed;
  const next = () => (state = (state * 1_103_515_245 + 12_345) % 2_147_483_648) / 2_147_483_648;
  return Array.from({ length: count }, () => {
    const date = new Date(Date.UTC(2023, 0, 1) + Math.floor(next() * 2000) * 86_400_000);
    return date.toISOString().slice(0, 10);
  });
}

describe('WorkCalendar', () => {
  const calendar = new WorkCalendar(mondayToFriday);

  // Outside source: date-fns 4 addBusinessDays / differenceInBusinessDays (Monday–Friday week).
  describe('matches date-fns on a Monday–Friday calendar', () => {
    const starts = randomDates(60, 7);
    const ends = randomDates(60, 99);
    const counts = [0, 1, 2, 5, 7, 13, 40, -1, -3, -12];
    it.each(starts.map((start, index) => [start, counts[index % counts.length]] as const))(
      'addWorkDays(%s, %i)',
      (start, count) => {
        expect(calendar.addWorkDays(start, count)).toBe(
          fromLocal(addBusinessDays(toLocal(start), count)),
        );
      },
    );
    it.each(starts.map((start, index) => [start, ends[index]] as const))(
      'workDaysBetween(%s, %s)',
      (from, to) => {
        expect(calendar.workDaysBetween(from, to)).toBe(
          differenceInBusinessDays(toLocal(to), toLocal(from)),
        );
      },
    );
    it.each([
      ['2026-01-03', '2026-01-05'], // Saturday to Monday
      ['2026-01-05', '2026-01-03'],
      ['2026-03-06', '2026-03-09'], // over the US spring clock change
      ['2024-02-28', '2024-03-01'], // over a leap day
    ])('workDaysBetween at weekends and clock changes: %s → %s', (from, to) => {
      expect(calendar.workDaysBetween(from, to)).toBe(
        differenceInBusinessDays(toLocal(to), toLocal(from)),
      );
    });
  });

  it('knows why a day is off, and that markets are off only for build work', () => {
    const studio = new WorkCalendar({
      workDays: [2, 3, 4, 5, 6],
      dailyCapacityHours: 6,
      blackoutDates: ['2026-08-12'],
      holidaysOff: true,
      holidays: ['2026-09-07'],
      marketDays: ['2026-09-12'],
    });
    expect(studio.dayOffReason('2026-09-07', 'build')).toBe('not-a-work-day'); // a Monday
    expect(studio.dayOffReason('2026-08-12', 'content')).toBe('blackout');
    expect(studio.dayOffReason('2026-09-12', 'build')).toBe('market');
    expect(studio.isWorkDay('2026-09-12', 'content')).toBe(true);
    const withHoliday = new WorkCalendar({ ...mondayToFriday, holidays: ['2026-09-07'] });
    expect(withHoliday.dayOffReason('2026-09-07', 'content')).toBe('holiday');
    const holidaysWorked = new WorkCalendar({
      ...mondayToFriday,
      holidays: ['2026-09-07'],
      holidaysOff: false,
    });
    expect(holidaysWorked.isWorkDay('2026-09-07', 'build')).toBe(true);
    // Labour Day Monday 2026-09-07 is off: 4 work days from Friday 4th to Friday 11th, not 5.
    expect(withHoliday.workDaysBetween('2026-09-04', '2026-09-11')).toBe(4);
    expect(withHoliday.addWorkDays('2026-09-04', 1)).toBe('2026-09-08');
  });

  it('adds up bookings and spreads event hours over the work days of the event', () => {
    const bookings = bookingsFromEvents(
      [
        { start: '2026-04-02', end: '2026-04-07', hoursPerDay: 3, kind: 'build' }, // Thu..Tue: Thu, Fri, Mon, Tue
        { start: '2026-04-06', end: '2026-04-06', hoursPerDay: 2.5, kind: 'content' },
        { start: '2026-04-10', end: '2026-04-10', hoursPerDay: 0, kind: 'launch' },
      ],
      calendar,
    );
    const booked = new WorkCalendar(mondayToFriday, bookings);
    expect(
      ['2026-04-02', '2026-04-03', '2026-04-04', '2026-04-06', '2026-04-07'].map((d) =>
        booked.bookedHours(d),
      ),
    ).toEqual([3, 3, 0, 5.5, 3]);
    expect(booked.withBookings([{ date: '2026-04-07', hours: 1 }]).bookedHours('2026-04-07')).toBe(
      4,
    );
    expect(booked.bookedHours('2026-04-07')).toBe(3);
  });

  it('refuses a calendar without work days or capacity', () => {
    expect(() => new WorkCalendar({ ...mondayToFriday, workDays: [] })).toThrow(
      /at least one work day/,
    );
    expect(() => new WorkCalendar({ ...mondayToFriday, workDays: [0, 1] })).toThrow(/ISO weekdays/);
    expect(() => new WorkCalendar({ ...mondayToFriday, dailyCapacityHours: 0 })).toThrow(
      /capacity/,
    );
  });
});
