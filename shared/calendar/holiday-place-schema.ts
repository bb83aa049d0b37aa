import * as z from 'zod/mini';
import { isValidRegion } from './holidays';

// Apart from the other calendar schemas because it loads date-holidays' data for every country:
// the server needs it, the browser bundle does not.
/** The holiday place of a studio: ISO 3166 country and optional subdivision (GB + ENG). */
export const holidayPlaceSchema = z
  .object({
    country: z
      .string()
      .check(z.regex(/^[A-Z]{2}$/, 'Expected an ISO 3166 country code such as US')),
    region: z.optional(z.nullable(z.string())),
  })
  .check(
    z.refine((place) => isValidRegion(place.country, place.region ?? undefined), {
      message: 'Unknown country or region for public holidays',
      path: ['region'],
    }),
  );
