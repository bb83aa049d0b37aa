import './zod';
import * as z from 'zod/mini';
import { safeName } from './text';

export const roles = ['owner', 'partner', 'crew'] as const;
export type Role = (typeof roles)[number];

const email = z.pipe(
  z.string().check(z.trim(), z.toLowerCase(), z.maxLength(254, 'E-mail is too long (254 characters at most)')),
  z.email('Enter a valid e-mail address'),
);

export const loginRequest = z.object({
  email,
  password: z.string().check(z.minLength(1, 'Enter your password'), z.maxLength(200, 'Password is too long')),
});
export type LoginRequest = z.infer<typeof loginRequest>;

export const signupRequest = z.object({
  name: z
    .string()
    .check(z.trim(), z.minLength(1, 'Enter your name'), z.maxLength(120, 'Name is too long (120 characters at most)'), ...safeName('Name')),
  email,
  password: z
    .string()
    .check(z.minLength(10, 'Password must be at least 10 characters'), z.maxLength(200, 'Password is too long (200 characters at most)')),
  studioName: z
    .string()
    .check(
      z.trim(),
      z.minLength(1, 'Enter a studio name'),
      z.maxLength(120, 'Studio name is too long (120 characters at most)'),
      ...safeName('Studio name'),
    ),
  /** Where the studio is: its time zone (its today) and the public holidays it keeps. */
  timezone: z.optional(z.string().check(z.minLength(1, 'Choose the studio\'s time zone'), z.maxLength(64))),
  country: z.optional(z.string().check(z.regex(/^[A-Z]{2}$/, 'Country must be a two-letter ISO 3166 code such as US or GB'))),
  region: z.optional(z.nullable(z.string().check(z.regex(/^[A-Z0-9]{1,3}$/, 'Region must be an ISO 3166-2 subdivision code such as ENG or ON')))),
});
export type SignupRequest = z.infer<typeof signupRequest>;

/**
 * POST /api/auth/signup answers 202 with this for every address, so the answer never tells whether
 * an address has an account: a new address is signed in to its new studio (GET /api/auth/me shows
 * it), a known one is sent a mail on how to sign in, and nothing is made.
 */
export interface SignupAnswer {
  message: string;
}
export const signupAnswerMessage =
  'Thanks. If you are not signed in now, this address has an account already: we have e-mailed it how to sign in or choose a new password.';

export interface UserView {
  id: number;
  email: string;
  name: string;
}

export interface StudioMembershipView {
  id: number;
  name: string;
  role: Role;
  /** The studio's IANA time zone. */
  timezone: string;
  /** The studio's today (YYYY-MM-DD) by the server's clock in that zone, when the answer was made. */
  today: string;
}

export interface MeResponse {
  user: UserView;
  studios: StudioMembershipView[];
}
