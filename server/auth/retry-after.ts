import type { ErrorRequestHandler } from 'express';
import { AppError } from '../http/app-error';

/** A 429 that says when to come back, in its message, in the body and (through retryAfterHeader) in Retry-After. */
export function tooManyRequests(message: string, retryAfterSeconds: number): AppError {
  return new AppError('rate_limited', 429, message, undefined, { retryAfterSeconds });
}

/** Copies a 429's wait into the Retry-After header on its way to the error middleware. */
export const retryAfterHeader: ErrorRequestHandler = (error, _req, res, next) => {
  const seconds = error instanceof AppError ? error.details?.['retryAfterSeconds'] : undefined;
  if (typeof seconds === 'number') res.set('Retry-After', String(seconds));
  next(error);
};

/** A wait as a person says it: "1 second", "40 seconds", "12 minutes", "5 hours". */
export function waitInWords(seconds: number): string {
  const say = (count: number, unit: string) => `${count} ${unit}${count === 1 ? '' : 's'}`;
  if (seconds < 60) return say(Math.max(1, Math.ceil(seconds)), 'second');
  if (seconds < 90 * 60) return say(Math.ceil(seconds / 60), 'minute');
  return say(Math.ceil(seconds / 3600), 'hour');
}
