import './zod';
import * as z from 'zod/mini';
import { safeName } from './text';

export const weekStarts = [1, 7] as const;

export const studioSettingsPatch = z.object({
  name: z.optional(z.string().check(z.trim(), z.minLength(1, 'Enter a studio name'), z.maxLength(120, 'Studio name is too long'), ...safeName('Studio name'))),
  timezone: z.optional(z.string().check(z.minLength(1), z.maxLength(64))),
  country: z.optional(z.string().check(z.regex(/^[A-Z]{2}$/, 'Country must be a two-letter ISO 3166 code such as US or GB'))),
  region: z.optional(
    z.nullable(z.string().check(z.regex(/^[A-Z0-9]{1,3}$/, 'Region must be an ISO 3166-2 subdivision code such as ENG or ON'))),
  ),
  weekStart: z.optional(z.union([z.literal(1), z.literal(7)])),
  workDays: z.optional(
    z
      .array(z.int().check(z.gte(1, 'Work days are ISO weekdays 1 (Monday) to 7 (Sunday)'), z.lte(7, 'Work days are ISO weekdays 1 (Monday) to 7 (Sunday)')))
      .check(z.minLength(1, 'Choose at least one work day'), z.maxLength(7)),
  ),
  dailyCapacityHours: z.optional(z.number().check(z.gt(0, 'Daily capacity must be more than 0 hours'), z.lte(24, 'A day has 24 hours at most'))),
  holidaysOff: z.optional(z.boolean()),
  /** The studio's sales channels, in its own spelling; sales imports map channel cells onto them. */
  channels: z.optional(
    z
      .array(z.string().check(z.trim(), z.minLength(1, 'A channel needs a name'), z.maxLength(40, 'A channel name is 40 characters at most'), ...safeName('A channel name')))
      .check(
        z.minLength(1, 'Keep at least one channel'),
        z.maxLength(20, 'Twenty channels at most'),
        z.refine((names) => new Set(names.map((name) => name.toLowerCase())).size === names.length, 'Each channel once'),
        z.refine((names) => !names.some((name) => name.toLowerCase() === 'other'), '"other" is where unknown channels go; choose another name'),
      ),
  ),
  version: z.optional(z.int()),
});
export type StudioSettingsPatch = z.infer<typeof studioSettingsPatch>;

export interface StudioSettings {
  id: number;
  name: string;
  timezone: string;
  country: string;
  region: string | null;
  weekStart: 1 | 7;
  workDays: number[];
  dailyCapacityHours: number;
  holidaysOff: boolean;
  channels: string[];
  version: number;
  role: 'owner' | 'partner' | 'crew';
}

export interface StudioSummary {
  seriesCount: number;
  themeCount: number;
  upcomingCount: number;
  memberCount: number;
}
