import './zod';
import * as z from 'zod/mini';
import { loginRequest, roles, signupRequest, type Role } from './auth';

// Team, invitations, password reset, profile and the development mailbox.

// The same field rules as sign-up, so an invitee or a reset password meets the same bar.
const email = loginRequest.shape.email;
const role = z.enum(roles, 'Role must be owner, partner or crew');
export const newPassword = signupRequest.shape.password;
const name = signupRequest.shape.name;

export interface MemberView {
  userId: number;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
  /** Whether this member is the one asking. */
  isYou: boolean;
}

export const memberPatch = z.object({ role });
export type MemberPatch = z.infer<typeof memberPatch>;

export const invitationRequest = z.object({ email, role });
export type InvitationRequest = z.infer<typeof invitationRequest>;

export interface InvitationView {
  id: number;
  email: string;
  role: Role;
  invitedBy: string | null;
  createdAt: string;
  expiresAt: string;
}

/** GET /api/invitations/:token (public): what the invitee sees before accepting. */
export interface InvitationPreview {
  studioName: string;
  role: Role;
  email: string;
  /** Whether an account with the invited e-mail exists (then sign in; else sign up). */
  hasAccount: boolean;
  expiresAt: string;
}

/** POST /api/invitations/:token/signup: an account for the invited address, joined at once. */
export const invitationSignupRequest = z.object({ name, password: newPassword });
export type InvitationSignupRequest = z.infer<typeof invitationSignupRequest>;

export interface InvitationAccepted {
  studioId: number;
  studioName: string;
  role: Role;
}

export const passwordResetRequest = z.object({ email });
export type PasswordResetRequest = z.infer<typeof passwordResetRequest>;

export const passwordResetConfirm = z.object({ password: newPassword });
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirm>;

export interface ProfileView {
  id: number;
  name: string;
  email: string;
  /** Whether the Monday agenda e-mail is sent to this user. */
  weeklyAgenda: boolean;
}

export const profilePatch = z.object({ name: z.optional(name), weeklyAgenda: z.optional(z.boolean()) });
export type ProfilePatch = z.infer<typeof profilePatch>;

/** GET /api/dev/mailbox (outside production only). */
export interface CapturedMail {
  id: number;
  to: string;
  subject: string;
  text: string;
  html: string;
  date: string;
}
