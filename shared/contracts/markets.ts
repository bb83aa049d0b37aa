// Markets and the studio's calendar settings (own occasions, sell windows, back-to-school day,
// blackout days) as the API takes and gives them. Rules live in shared/calendar.
import './zod';
import * as z from 'zod/mini';
import { customOccasionSchema, isoDateSchema, marketSchema, sellWindowsSchema } from '../calendar/schemas';
import { safeNote, safeTextAt } from './text';

type MarketFields = z.infer<typeof marketSchema>;

/** POST/PUT /markets body; PUT also takes the `version` it read. The shape is shared/calendar's; names are checked as every typed name is. */
export const marketRequestSchema = marketSchema.check(
  safeTextAt<MarketFields>('name', 'Market name'),
  safeTextAt<MarketFields>('place', 'Place'),
  safeTextAt<MarketFields>('hours', 'Hours'),
  safeTextAt<MarketFields>('notes', 'Notes', 'note'),
);
export const marketUpdateSchema = z.intersection(marketRequestSchema, z.object({ version: z.optional(z.int()) }));
export type MarketRequest = z.infer<typeof marketRequestSchema>;

export interface MarketView {
  id: number;
  name: string;
  place: string;
  start: string;
  rrule: string | null;
  exdates: string[];
  rdates: string[];
  hours: string | null;
  boothFeeCents: number | null;
  applicationDeadline: string | null;
  decisionDate: string | null;
  kitsAllowed: boolean;
  notes: string | null;
  version: number;
  /** The next occurrences from today (up to five), for lists. */
  nextDates: string[];
}

/** 'YYYY-MM-DD' for one year, 'MM-DD' for the same day every year. */
export const backToSchoolSchema = z.string().check(
  z.regex(/^(\d{4}-)?\d{2}-\d{2}$/, 'Back-to-school is YYYY-MM-DD or MM-DD'),
  z.refine((text) => {
    const full = text.length === 5 ? `2024-${text}` : text; // a leap year, so 02-29 passes
    return !Number.isNaN(Date.parse(`${full}T00:00:00Z`)) && new Date(`${full}T00:00:00Z`).toISOString().startsWith(full);
  }, 'Back-to-school is not a real day'),
);

/** PUT /occasions: the whole set of the studio's occasion settings. */
export const occasionSettingsSchema = z.object({
  custom: z.array(customOccasionSchema.check(safeTextAt<z.infer<typeof customOccasionSchema>>('name', 'Occasion name'))).check(z.maxLength(100)),
  sellWindows: sellWindowsSchema,
  backToSchool: z.nullable(backToSchoolSchema),
});
export type OccasionSettingsRequest = z.infer<typeof occasionSettingsSchema>;

export interface OccasionSettingsView {
  /** The built-in occasions of the studio's country with the sell window in force. */
  builtIn: { key: string; name: string; sellWindowDays: number; defaultSellWindowDays: number }[];
  custom: { key: string; name: string; rrule?: string; start?: string; dates?: string[]; sellWindowDays?: number }[];
  sellWindows: Record<string, number>;
  backToSchool: string | null;
}

/** GET /occasions/upcoming: dates a theme or runway can target; `value` goes back as an anchor value. */
export interface UpcomingTarget {
  kind: 'holiday' | 'occasion' | 'market';
  value: string;
  key: string;
  name: string;
  date: string;
  sellWindowStart?: string | null;
}

export const blackoutSchema = z
  .object({
    start: isoDateSchema,
    end: z.optional(isoDateSchema),
    note: z.optional(z.nullable(z.string().check(z.maxLength(200), ...safeNote('Note')))),
  })
  .check(z.refine((b) => !b.end || b.end >= b.start, { message: 'end cannot be before start', path: ['end'] }));

/** PUT /blackouts: the whole list. */
export const blackoutsRequestSchema = z.object({ blackouts: z.array(blackoutSchema).check(z.maxLength(500)) });
export type BlackoutsRequest = z.infer<typeof blackoutsRequestSchema>;

export interface BlackoutView {
  start: string;
  end: string;
  note: string | null;
}

export const dateRangeQuerySchema = z
  .object({ from: isoDateSchema, to: isoDateSchema })
  .check(
    z.refine((range) => range.from <= range.to, { message: 'to cannot be before from', path: ['to'] }),
    z.refine((range) => Date.parse(range.to) - Date.parse(range.from) <= 400 * 86_400_000, {
      message: 'A range is at most 400 days',
      path: ['to'],
    }),
  );
export const optionalDateRangeQuerySchema = z.object({ from: z.optional(isoDateSchema), to: z.optional(isoDateSchema) });

/** Longest look-ahead of GET /events/at-hand, in days after `today`. */
export const AT_HAND_MAX_DAYS = 31;

/** GET /events/at-hand query: the asker's today and the last day to look at. */
export const atHandQuerySchema = z.object({ today: isoDateSchema, through: isoDateSchema }).check(
  z.refine((range) => range.today <= range.through, { message: 'through cannot be before today', path: ['through'] }),
  z.refine((range) => Date.parse(range.through) - Date.parse(range.today) <= AT_HAND_MAX_DAYS * 86_400_000, {
    message: `through is at most ${AT_HAND_MAX_DAYS} days after today`,
    path: ['through'],
  }),
);
