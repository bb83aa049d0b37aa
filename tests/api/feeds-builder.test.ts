import fc from 'fast-check';
import ICAL from 'ical.js';
import { expandRecurrence } from '@shared/calendar/recurrence';
import { buildFeed, clearFeedCache, foldLines, type FeedItem } from '../../server/feeds/feed-builder';
import { stepTitle } from '../../server/feeds/feed-items';
import { parseFeed } from './feeds-fixtures';

// RFC 5545 §3.1: content lines are folded after at most 75 octets with CRLF and one space, and a
// multi-octet UTF-8 character is never split.
describe('folding', () => {
  it('when any line is folded, then every piece is at most 75 octets, UTF-8 stays whole and unfolding gives it back', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 400 }), (text) => {
        const line = `DESCRIPTION:${text.replace(/[\r\n]/g, '')}`;
        const folded = foldLines(line);
        for (const piece of folded.split('\r\n')) {
          expect(Buffer.byteLength(piece, 'utf8')).toBeLessThanOrEqual(75);
          expect(Buffer.from(piece, 'utf8').toString('utf8')).toBe(piece);
        }
        expect(folded.replace(/\r\n /g, '')).toBe(line);
      }),
    );
  });

  it('when a long line is plain ASCII (the sliced fast path), then pieces are 75, then 1 + 74 octets, and unfold to it', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme-ascii', minLength: 60, maxLength: 400 }), (text) => {
        const line = `DESCRIPTION:${text.replace(/[\r\n]/g, '')}`;
        const pieces = foldLines(line).split('\r\n');
        pieces.forEach((piece, index) => {
          expect(piece.length).toBeLessThanOrEqual(75);
          if (index < pieces.length - 1) expect(piece.length).toBe(75);
          if (index > 0) expect(piece.startsWith(' ')).toBe(true);
        });
        expect(pieces.join('\r\n').replace(/\r\n /g, '')).toBe(line);
      }),
    );
  });

  it('when a line holds four-octet characters at the boundary, then none is cut', () => {
    const line = `SUMMARY:${'a'.repeat(66)}🪵🪵🪵`;
    const [first, second] = foldLines(line).split('\r\n');
    expect(Buffer.byteLength(first)).toBe(74);
    expect(second).toBe(' 🪵🪵🪵');
  });
});

describe('building', () => {
  const item = { uid: 'kerfcast-event-1@app.example.test', title: 'Cut', start: '2026-07-01', end: '2026-07-02', sequence: 1, description: 'x', url: 'http://app.example.test/', category: 'build' };

  it('when the same events are built at two modification times, then each build carries its own DTSTAMP (cached VEVENTs included)', () => {
    clearFeedCache();
    const feed = { name: 'Feed', timezone: 'Europe/London', refreshSeconds: 3600, items: [item] };
    const first = parseFeed(buildFeed(feed, new Date('2026-06-01T08:00:00Z'))).events[0];
    const second = parseFeed(buildFeed(feed, new Date('2026-06-02T09:30:00Z'))).events[0];
    expect(first.stamp).toBe('2026-06-01T08:00:00Z');
    expect(second.stamp).toBe('2026-06-02T09:30:00Z');
    expect(second).toMatchObject({ uid: item.uid, start: '2026-07-01', end: '2026-07-03', sequence: 1 });
  });

  it('when an event changes, then the build shows the change, not a cached copy', () => {
    const feed = (title: string, sequence: number) => ({ name: 'Feed', timezone: 'Europe/London', refreshSeconds: 3600, items: [{ ...item, title, sequence }] });
    buildFeed(feed('Cut', 1), new Date());
    const changed = parseFeed(buildFeed(feed('Batch cut', 2), new Date())).events[0];
    expect(changed).toMatchObject({ summary: 'Batch cut', sequence: 2 });
  });

  it('when any one field of an event changes, then the cached VEVENT is not reused (ical.js reads the new value)', () => {
    const market = { ...item, uid: 'kerfcast-market-3@app.example.test', category: 'market', rrule: 'FREQ=WEEKLY;COUNT=4', exdates: ['2026-07-08'], rdates: [] as string[] };
    const build = (changes: Record<string, unknown>) =>
      parseFeed(buildFeed({ name: 'Feed', timezone: 'Europe/London', refreshSeconds: 3600, items: [{ ...market, ...changes }] }, new Date())).events[0];
    clearFeedCache();
    expect(build({})).toMatchObject({ exdates: ['2026-07-08'], location: null, end: '2026-07-03' });
    expect(build({ exdates: ['2026-07-15'] }).exdates).toEqual(['2026-07-15']);
    expect(build({ rdates: ['2026-08-01'] }).rdates).toEqual(['2026-08-01']);
    expect(build({ location: 'Old mill yard' }).location).toBe('Old mill yard');
    expect(build({ end: '2026-07-04' }).end).toBe('2026-07-05');
    expect(build({ description: 'Hours: 9-3' }).description).toBe('Hours: 9-3');
    expect(build({ url: 'http://app.example.test/other' }).url).toBe('http://app.example.test/other');
    expect(build({ rrule: 'FREQ=WEEKLY;COUNT=6' }).rrule).toBe('FREQ=WEEKLY;COUNT=6');
    expect(build({ category: 'deadline' }).category).toBe('deadline');
  });
});

describe('a recurring all-day market in the feed', () => {
  // Outside reference: ical.js, a general-purpose iCalendar library, expanding the VEVENT as a
  // calendar client does; the app's own days come from expandRecurrence.
  const market = (rrule: string): FeedItem => ({
    uid: 'market-7@kerfcast.test',
    title: 'Hollow lane market',
    start: '2027-01-02',
    end: '2027-01-02',
    sequence: 0,
    description: 'Every Saturday',
    url: 'http://app.example.test/markets',
    category: 'Market',
    rrule,
    exdates: ['2027-01-16'],
    rdates: [],
  });
  const clientDays = (ics: string) => {
    const component = new ICAL.Component(ICAL.parse(ics)).getFirstSubcomponent('vevent')!;
    const iterator = new ICAL.Event(component).iterator();
    const days: string[] = [];
    for (let next = iterator.next(); next && days.length < 200; next = iterator.next()) days.push(next.toString().slice(0, 10));
    return days;
  };

  it.each([
    ['a date-time UNTIL at noon', 'FREQ=WEEKLY;BYDAY=SA;UNTIL=20270313T120000Z', 'UNTIL=20270313'],
    ['a date-time UNTIL at midnight', 'freq=weekly;byday=sa;until=20270313T000000Z', 'UNTIL=20270312'],
    ['a DATE UNTIL', 'FREQ=WEEKLY;BYDAY=SA;UNTIL=20270313', 'UNTIL=20270313'],
  ])('when the rule has %s, then the feed writes UNTIL as a DATE and a client expands the same days as the app', (_case, rrule, until) => {
    clearFeedCache();
    const ics = buildFeed({ name: 'Feed', timezone: 'America/Chicago', refreshSeconds: 3600, items: [market(rrule)] }, new Date('2027-01-01T00:00:00Z')).toString();
    expect(ics).toContain(`RRULE:FREQ=WEEKLY;BYDAY=SA;${until}`);
    const app = expandRecurrence({ start: '2027-01-02', rrule, exdates: ['2027-01-16'] }, '2027-01-01', '2027-12-31');
    expect(clientDays(ics)).toEqual(app);
    expect(app.at(-1)).toBe(until === 'UNTIL=20270312' ? '2027-03-06' : '2027-03-13');
  });
});

describe('step titles in the feed', () => {
  it('when a step belongs to a theme or only to a runway, then its title names it after the step; a done step is ticked', () => {
    expect(stepTitle({ title: 'Design', done: false, themeName: 'Winter window stars', runwayName: 'Stars for the fair' })).toBe('Design · Winter window stars');
    expect(stepTitle({ title: 'Design', done: false, themeName: null, runwayName: 'Stars for the fair' })).toBe('Design · Stars for the fair');
    expect(stepTitle({ title: 'Design', done: true, themeName: null, runwayName: null })).toBe('✓ Design');
  });
});
