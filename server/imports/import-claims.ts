// The claim an import holds while it is committed ('committing'), what frees a claim whose commit
// died, and what a commit answers when the database refuses it for reasons other than the file.
import type { Knex } from 'knex';
import { AppError } from '../http/app-error';
import { ImportRepository } from './import-repository';

/**
 * A claim whose commit has shown no progress for this long, and whose row no live transaction
 * holds, is released. Progress is written every 250 ms while rows flow, so ten minutes of silence
 * is a dead commit (a rule of thumb; time-outs run on the real clock, see DEVELOPERS.md).
 */
export const staleClaimSeconds = 10 * 60;

/**
 * At start-up this process runs no commit yet; another process's commit holds its row's lock from
 * its first statement, and the minute covers the moment between its claim and that statement.
 */
const startupGraceSeconds = 60;

export const interruptedFailure =
  'The commit was interrupted before it ended (the server or the database stopped); nothing was stored. Commit the import again or delete it.';

const internalFailure = 'The commit stopped on an error on our side; nothing was stored. Try again in a moment.';

/** MariaDB error numbers (MariaDB docs, "MariaDB Error Codes"): ER_LOCK_DEADLOCK is 1213. */
export function isDeadlock(error: unknown): boolean {
  const { errno, code } = (error ?? {}) as { errno?: unknown; code?: unknown };
  return errno === 1213 || code === 'ER_LOCK_DEADLOCK';
}

/** ER_LOCK_WAIT_TIMEOUT, 1205: a lock was waited for longer than innodb_lock_wait_timeout. */
export function isLockWaitTimeout(error: unknown): boolean {
  const { errno, code } = (error ?? {}) as { errno?: unknown; code?: unknown };
  return errno === 1205 || code === 'ER_LOCK_WAIT_TIMEOUT';
}

export function commitConflict(): AppError {
  const message = 'Another commit or deletion was writing the same series at the same moment; nothing of this file was stored. Commit it again.';
  return new AppError('commit_conflict', 409, message);
}

export function deleteConflict(): AppError {
  const message = 'A commit was writing the same series at the same moment; nothing was deleted. Delete the import again.';
  return new AppError('delete_conflict', 409, message);
}

export function commitRunning(): AppError {
  const minutes = staleClaimSeconds / 60;
  const message = `This import is being committed right now; if that commit was interrupted, the import is freed ${minutes} minutes after its last progress`;
  return new AppError('commit_running', 409, message);
}

/**
 * Runs a transaction, and once more when the database made it a deadlock's victim: MariaDB rolls
 * the victim back whole and lets the other side finish, so the second run starts clean (error 1213
 * itself says "try restarting transaction"; MySQL Reference Manual, "How to Minimize and Handle
 * Deadlocks": be prepared to re-issue it). A second deadlock, or a lock waited for too long, is a
 * 409 with `conflict`'s plain message.
 */
export async function retryOnDeadlock<T>(run: () => Promise<T>, conflict: () => AppError, onRetry?: (error: unknown) => void): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (isLockWaitTimeout(error)) throw conflict();
    if (!isDeadlock(error)) throw error;
    onRetry?.(error);
  }
  try {
    return await run();
  } catch (error) {
    if (isDeadlock(error) || isLockWaitTimeout(error)) throw conflict();
    throw error;
  }
}

/**
 * The failure an import keeps and shows: our own messages as they are, anything else (the SQL of a
 * driver error included) as a plain sentence; the error itself goes on to the log.
 */
export function failureOf(error: unknown): string {
  return error instanceof AppError ? error.message : internalFailure;
}

/**
 * For server/main.ts, once at start-up before listening: fails the claims of commits that died with
 * the previous process or the database (their writes were rolled back), so they can be committed
 * again or deleted at once rather than after the time-out. Returns the ids it released.
 */
export function releaseInterruptedCommits(db: Knex): Promise<number[]> {
  return new ImportRepository(db).releaseStaleClaims(startupGraceSeconds, interruptedFailure);
}
