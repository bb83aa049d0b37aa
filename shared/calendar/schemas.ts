import * as z from 'zod/mini';
import { isIsoDate } from './dates';
import { normaliseRrule, validateRrule } from './recurrence';

/** The dates the API takes: a studio plans within a few lifetimes, and a far year only costs work. */
export const EARLIEST_DATE = '1900-01-01';
export const LATEST_DATE = '2200-12-31';

/** An all-day date as 'YYYY-MM-DD' that really exists (no 2026-02-30), from 1900 to 2200. */
export const isoDateSchema = z
  .string()
  .check(
    z.refine((text) => isIsoDate(text), { message: 'Expected a real date as YYYY-MM-DD', abort: true }),
    z.refine((text) => text >= EARLIEST_DATE && text <= LATEST_DATE, { message: `Expected a date from ${EARLIEST_DATE} to ${LATEST_DATE}` }),
  );

/** RECUR text checked by validateRrule, whose message says what is wrong; stored in upper case. */
export const rruleSchema = z.pipe(
  z.string().check(
    z.maxLength(500),
    z.superRefine((text, context) => {
      const check = validateRrule(text);
      if (!check.ok) context.issues.push({ code: 'custom', message: check.message, input: text });
    }),
  ),
  z.transform(normaliseRrule),
);

export const marketSchema = z
  .object({
    name: z.string().check(z.trim(), z.minLength(1), z.maxLength(120)),
    place: z.string().check(z.trim(), z.maxLength(200)),
    start: isoDateSchema,
    rrule: z.optional(rruleSchema),
    exdates: z.optional(z.array(isoDateSchema).check(z.maxLength(500))),
    rdates: z.optional(z.array(isoDateSchema).check(z.maxLength(500))),
    /** Opening hours as the studio writes them, e.g. "9:00–15:00". */
    hours: z.optional(z.string().check(z.maxLength(80))),
    boothFeeCents: z.optional(z.int().check(z.minimum(0), z.maximum(100_000_000))),
    applicationDeadline: z.optional(isoDateSchema),
    decisionDate: z.optional(isoDateSchema),
    /** Whether the market lets the studio sell do-it-yourself kits. */
    kitsAllowed: z.optional(z.boolean()),
    notes: z.optional(z.string().check(z.maxLength(2000))),
  })
  .check(
    z.refine(
      (market) =>
        !market.applicationDeadline ||
        !market.decisionDate ||
        market.applicationDeadline <= market.decisionDate,
      {
        message: 'The decision date cannot be before the application deadline',
        path: ['decisionDate'],
      },
    ),
  );

export const customOccasionSchema = z
  .object({
    key: z.optional(z.string().check(z.regex(/^[a-z0-9-]{1,60}$/))),
    name: z.string().check(z.trim(), z.minLength(1), z.maxLength(120)),
    rrule: z.optional(rruleSchema),
    start: z.optional(isoDateSchema),
    dates: z.optional(z.array(isoDateSchema).check(z.maxLength(200))),
    sellWindowDays: z.optional(z.int().check(z.minimum(0), z.maximum(366))),
  })
  .check(
    z.refine((occasion) => Boolean(occasion.rrule || occasion.dates?.length), {
      message: 'An occasion needs an RRULE or at least one date',
      path: ['rrule'],
    }),
  );

/** Sell-window overrides in days, by occasion key. */
export const sellWindowsSchema = z.record(z.string(), z.int().check(z.minimum(0), z.maximum(366)));

export type MarketInput = z.infer<typeof marketSchema>;
export type CustomOccasionInput = z.infer<typeof customOccasionSchema>;
