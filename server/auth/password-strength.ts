import type { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { AppError } from '../http/app-error';

/**
 * The lowest zxcvbn score we accept. The scale is the estimator's own (zxcvbn's README, "Usage", and
 * zxcvbn-ts's TimeEstimates): 0 under 10^3 guesses, 1 under 10^6, 2 under 10^8, 3 under 10^10
 * ("safely unguessable: moderate protection from an offline slow-hash scenario"), 4 beyond.
 */
export const minimumScore = 3;

// The dictionaries are a few megabytes: loaded on the first check, once per process, never in the browser.
let estimator: Promise<ZxcvbnFactory> | null = null;
function loadEstimator(): Promise<ZxcvbnFactory> {
  estimator ??= Promise.all([import('@zxcvbn-ts/core'), import('@zxcvbn-ts/language-common'), import('@zxcvbn-ts/language-en')]).then(
    ([core, common, english]) =>
      new core.ZxcvbnFactory({
        translations: english.translations,
        graphs: common.adjacencyGraphs,
        dictionary: { ...common.dictionary, ...english.dictionary },
      }),
  );
  return estimator;
}

/** Why the password is too easy to guess, in the estimator's words, or null when it is strong enough. */
export async function passwordWeakness(password: string, userInputs: string[]): Promise<string | null> {
  const zxcvbn = await loadEstimator();
  // A name run together, each of its words, and the address's local part are what a guesser tries first.
  const inputs = userInputs
    .flatMap((input) => [input, input.replace(/\s+/g, ''), ...input.split(/[\s@._-]+/)])
    .filter((word) => word.length > 2);
  const result = zxcvbn.check(password, inputs);
  if (result.score >= minimumScore) return null;
  const advice = [result.feedback.warning, ...result.feedback.suggestions].filter(Boolean).join(' ');
  return `This password is too easy to guess. ${advice || 'Add more words that are less common.'}`;
}

/** Refuses a weak password with a 400 on the `password` field, as a schema check would. */
export async function requireStrongPassword(password: string, userInputs: string[]): Promise<void> {
  const weakness = await passwordWeakness(password, userInputs);
  if (weakness) throw new AppError('weak_password', 400, `password: ${weakness}`, [{ path: ['password'], message: weakness }]);
}
