// The themes API (issue 4): /api/studios/:studioId/themes.
import './zod';
import * as z from 'zod/mini';
import { safeName, safeNote } from './text';
import type { ThemeScore } from '../scoring/score-theme';
import type { Verdict } from '../scoring/types';
import type { TargetWindow } from './series';

export const themeStatuses = ['idea', 'shortlisted', 'picked', 'building', 'launched', 'retired'] as const;
export type ThemeStatus = (typeof themeStatuses)[number];

/**
 * Which status may follow which. Forward one step along the design's order, back one step (a pick
 * falls through, a build is paused), retire from anywhere, and revive a retired theme as an idea.
 * Picking skips "shortlisted" when the owner already knows.
 */
export const themeTransitions: Record<ThemeStatus, ThemeStatus[]> = {
  idea: ['shortlisted', 'picked', 'retired'],
  shortlisted: ['idea', 'picked', 'retired'],
  picked: ['shortlisted', 'building', 'retired'],
  building: ['picked', 'launched', 'retired'],
  launched: ['retired'],
  retired: ['idea'],
};

export const themeTargetKinds = ['month', 'date', 'occasion', 'holiday', 'market'] as const;
export type ThemeTargetKind = (typeof themeTargetKinds)[number];

/** What a theme is picked for: a month YYYY-MM, a date, an occasion key, a holiday key or a market id. */
export const themeTarget = z
  .object({
    kind: z.enum(themeTargetKinds, 'Target kind must be month, date, occasion, holiday or market'),
    value: z.string().check(z.minLength(1, 'Choose a target'), z.maxLength(64, 'Target is too long')),
  })
  .check(
    z.refine(
      (target) =>
        target.kind === 'month'
          ? /^\d{4}-(0[1-9]|1[0-2])$/.test(target.value)
          : target.kind === 'date'
            ? /^\d{4}-\d{2}-\d{2}$/.test(target.value)
            : target.kind === 'market'
              ? /^\d{1,10}$/.test(target.value)
              : /^[a-z0-9-]{1,64}$/.test(target.value),
      { message: 'A month is YYYY-MM, a date YYYY-MM-DD, a market its id, an occasion or holiday a key such as mothers-day', path: ['value'] },
    ),
  );
export type ThemeTargetInput = z.infer<typeof themeTarget>;

const name = z.string().check(z.trim(), z.minLength(1, 'Enter a theme name'), z.maxLength(120, 'Theme name is too long (120 characters at most)'), ...safeName('Theme name'));
const seriesIds = z.array(z.int().check(z.positive('Series ids are positive whole numbers'))).check(z.maxLength(50, 'A theme holds 50 series at most'));
const items = z
  .array(z.string().check(z.trim(), z.minLength(1, 'An item name cannot be empty'), z.maxLength(200, 'Item name is too long'), ...safeName('Item name')))
  .check(z.maxLength(100, 'A theme holds 100 items at most'));
const offsetDays = z.int().check(z.gte(0, 'Offset is 0 to 365 days before the target'), z.lte(365, 'Offset is 0 to 365 days before the target'));
const notes = z.nullable(z.string().check(z.maxLength(5000, 'Notes are too long (5000 characters at most)'), ...safeNote('Notes')));

export const themeCreate = z.object({
  name,
  status: z.optional(z.enum(['idea', 'shortlisted'], 'A new theme starts as idea or shortlisted; pick it afterwards')),
  seriesIds: z.optional(seriesIds),
  items: z.optional(items),
  notes: z.optional(notes),
});
export type ThemeCreate = z.infer<typeof themeCreate>;

/** Partners and the owner edit these; the version guards against overwriting someone else's edit. */
export const themePatch = z.object({
  name: z.optional(name),
  seriesIds: z.optional(seriesIds),
  items: z.optional(items),
  notes: z.optional(notes),
  offsetDays: z.optional(offsetDays),
  version: z.int('Send the version you last read'),
});
export type ThemePatch = z.infer<typeof themePatch>;

export const themeStatusChange = z.object({
  status: z.enum(themeStatuses, `status must be one of ${themeStatuses.join(', ')}`),
  version: z.int('Send the version you last read'),
});
export type ThemeStatusChange = z.infer<typeof themeStatusChange>;

/** "Pick for a target" (owner): sets the target and offset and moves the theme to picked. */
export const themePick = z.object({
  target: themeTarget,
  offsetDays: z.optional(offsetDays),
  version: z.int('Send the version you last read'),
});
export type ThemePick = z.infer<typeof themePick>;

export interface ThemeTarget {
  kind: ThemeTargetKind;
  value: string;
  /** The resolved day: the month's first day, the date, or the next occurrence. */
  date: string | null;
  label: string;
}

export interface ThemeHistoryEntry {
  from: ThemeStatus | null;
  to: ThemeStatus;
  /** The target key (as ?target= takes it), for code; screens show targetLabel. */
  target: string | null;
  /** The target in words: "May 2026", "Halloween", the market's name. */
  targetLabel: string | null;
  by: { id: number; name: string } | null;
  at: string;
}

export interface ThemeMember {
  id: number;
  term: string;
  region: string;
  kind: 'interest' | 'sales';
  period: 'daily' | 'weekly' | 'monthly';
  heat: number | null;
  verdict: Verdict | null;
}

export interface ThemeView {
  id: number;
  name: string;
  status: ThemeStatus;
  seriesIds: number[];
  items: string[];
  target: ThemeTarget | null;
  offsetDays: number;
  notes: string | null;
  version: number;
  statusChangedAt: string | null;
  statusChangedBy: { id: number; name: string } | null;
  createdAt: string;
  updatedAt: string;
  /**
   * From the members and the items' sales series by scoreTheme (docs/decisions/0002); null when it
   * has none. Its heat is null when none has enough history; membersUsed of membersTotal count.
   */
  score: ThemeScore | null;
}

export interface ThemeDetail extends ThemeView {
  /** The theme's search-interest series (a sales series joins as an item, never as a member). */
  members: ThemeMember[];
  /** The sales series of the theme's items, scored into the theme's heat with the members. */
  itemSeries: ThemeMember[];
  history: ThemeHistoryEntry[];
  /** The window the members were scored against. */
  window: TargetWindow | null;
  /** The studio's sales of the theme's items, units per month (YYYY-MM). */
  itemSales: { month: string; units: number }[];
}
