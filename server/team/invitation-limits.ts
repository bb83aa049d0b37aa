import { tooManyRequests, waitInWords } from '../auth/retry-after';

export interface SendingLimit {
  count: number;
  windowMs: number;
  /** The window in words, for the message. */
  window: string;
}

/**
 * Invitations a studio may send: enough to bring a whole small team in on the first day, too few
 * for anyone to use the studio's invitation mail to reach strangers in bulk.
 */
export const invitationLimits: readonly SendingLimit[] = [
  { count: 10, windowMs: 3600_000, window: 'hour' },
  { count: 30, windowMs: 24 * 3600_000, window: 'day' },
];

export const longestLimitWindowMs = Math.max(...invitationLimits.map((limit) => limit.windowMs));

/** The limit that is full and when it has room again, or null when an invitation may go now. */
export function invitationWait(sentAt: Date[], now: Date): { limit: SendingLimit; until: Date } | null {
  let wait: { limit: SendingLimit; until: Date } | null = null;
  for (const limit of invitationLimits) {
    const inWindow = sentAt
      .map((at) => at.getTime())
      .filter((at) => at > now.getTime() - limit.windowMs)
      .sort((a, b) => b - a);
    if (inWindow.length < limit.count) continue;
    // Room for one more once the count-th newest leaves the window.
    const until = new Date(inWindow[limit.count - 1] + limit.windowMs);
    if (!wait || until > wait.until) wait = { limit, until };
  }
  return wait;
}

/** Refuses the invitation with a 429 saying when more may be sent. */
export function requireInvitationRoom(sentAt: Date[], now: Date): void {
  const wait = invitationWait(sentAt, now);
  if (!wait) return;
  const seconds = Math.max(1, Math.ceil((wait.until.getTime() - now.getTime()) / 1000));
  throw tooManyRequests(
    `This studio has sent ${wait.limit.count} invitations in the last ${wait.limit.window}, the most it may; more may be sent in ${waitInWords(seconds)}`,
    seconds,
  );
}
