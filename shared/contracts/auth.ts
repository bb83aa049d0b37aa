import './zod';
import * as z from 'zod/mini';

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
  name: z.string().check(z.trim(), z.minLength(1, 'Enter your name'), z.maxLength(120, 'Name is too long (120 characters at most)')),
  email,
  password: z
    .string()
    .check(z.minLength(10, 'Password must be at least 10 characters'), z.maxLength(200, 'Password is too long (200 characters at most)')),
  studioName: z
    .string()
    .check(z.trim(), z.minLength(1, 'Enter a studio name'), z.maxLength(120, 'Studio name is too long (120 characters at most)')),
});
export type SignupRequest = z.infer<typeof signupRequest>;

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
