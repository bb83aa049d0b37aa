import { tooManyRequests, waitInWords } from './retry-after';

/**
 * Sign-in throttling that slows guessing without letting anyone lock the rightful owner out.
 *
 * - Only failed sign-ins count, and they count per account *and* address: a stranger's wrong
 *   passwords from elsewhere never hold up the owner, and a success clears the pair.
 * - After `perAccount` failures for one pair, each further try waits: 1 s, then 2, 4, 8 ... up to
 *   15 minutes (answered 429 with Retry-After, before the password is looked at).
 * - Spraying (one password tried on many accounts from one address) is slowed per address: past
 *   `perAddress` failures in `windowMs`, that address's tries are taken one a second, each held
 *   until its turn. A studio's people share an office address, so an account that signed in from
 *   that address in the last 30 days skips this line: whoever sprays from the office network never
 *   slows the studio's own sign-ins. Other tries are only refused (429) when the line is 30 s long.
 *
 * In-process memory: each map keeps at most `maxEntries` keys, oldest first out. Real time, not the
 * app's clock: a pinned date must never freeze or lift a throttle.
 */
export interface SignInLimits {
  /** Failed sign-ins to one account from one address before each further try must wait. */
  perAccount: number;
  /** Failed sign-ins from one address, over all accounts, within `windowMs`, before its tries queue. */
  perAddress: number;
  /** How long an address's failures count. */
  windowMs: number;
}

export const defaultSignInLimits: SignInLimits = { perAccount: 5, perAddress: 50, windowMs: 15 * 60_000 };

const firstDelayMs = 1000;
const longestDelayMs = 15 * 60_000;
const forgetFailuresMs = 24 * 3600_000;
const trustedForMs = 30 * 24 * 3600_000;
const addressSpacingMs = 1000;
const longestLineMs = 30_000;
const maxEntries = 50_000;

interface PairState {
  failures: number;
  lastFailureAt: number;
  blockedUntil: number;
  lastSuccessAt: number;
}

interface AddressState {
  failures: number;
  windowStart: number;
  nextTurn: number;
}

/** Before the password is checked: go (after `holdMs`), or refuse for `retryAfterSeconds`. */
type Admission = { isAdmitted: true; holdMs: number } | { isAdmitted: false; retryAfterSeconds: number; message: string };

/** A Map that forgets its oldest key when full; `touch` moves a key to the young end. */
class BoundedMap<V> extends Map<string, V> {
  touch(key: string, value: V): void {
    this.delete(key);
    if (this.size >= maxEntries) this.delete(this.keys().next().value as string);
    this.set(key, value);
  }
}

export class SignInThrottle {
  private readonly pairs = new BoundedMap<PairState>();
  private readonly addresses = new BoundedMap<AddressState>();

  constructor(
    private readonly limits: SignInLimits,
    private readonly now: () => number = Date.now,
  ) {}

  /** Waits for this try's turn, or throws a 429 saying how long to wait. */
  async waitTurn(address: string, account: string): Promise<void> {
    const admission = this.admit(address, account);
    if (!admission.isAdmitted) throw tooManyRequests(admission.message, admission.retryAfterSeconds);
    if (admission.holdMs > 0) await new Promise((resolve) => setTimeout(resolve, admission.holdMs));
  }

  record(address: string, account: string, isSuccess: boolean): void {
    if (isSuccess) this.succeeded(address, account);
    else this.failed(address, account);
  }

  private admit(address: string, account: string): Admission {
    const now = this.now();
    const pair = this.pairs.get(pairKey(address, account));
    if (pair && now < pair.blockedUntil) {
      return refuse(pair.blockedUntil - now, 'Too many wrong passwords for this account from your network');
    }
    const place = this.addresses.get(address);
    const isTrusted = pair !== undefined && now - pair.lastSuccessAt < trustedForMs;
    if (!place || isTrusted || !this.isCrowded(place, now)) return { isAdmitted: true, holdMs: 0 };
    const turn = Math.max(now, place.nextTurn);
    if (turn - now > longestLineMs) return refuse(turn - now - longestLineMs, 'Too many sign-in attempts from your network');
    place.nextTurn = turn + addressSpacingMs;
    return { isAdmitted: true, holdMs: turn - now };
  }

  private failed(address: string, account: string): void {
    const now = this.now();
    const key = pairKey(address, account);
    const pair = this.pairs.get(key);
    const failures = pair && now - pair.lastFailureAt < forgetFailuresMs ? pair.failures + 1 : 1;
    const beyond = failures - this.limits.perAccount;
    const blockedUntil = beyond >= 0 ? now + Math.min(longestDelayMs, firstDelayMs * 2 ** Math.min(beyond, 20)) : 0;
    this.pairs.touch(key, { failures, lastFailureAt: now, blockedUntil, lastSuccessAt: pair?.lastSuccessAt ?? -Infinity });

    const place = this.addresses.get(address);
    if (place && now - place.windowStart < this.limits.windowMs) place.failures += 1;
    else this.addresses.touch(address, { failures: 1, windowStart: now, nextTurn: now });
  }

  private succeeded(address: string, account: string): void {
    const now = this.now();
    this.pairs.touch(pairKey(address, account), { failures: 0, lastFailureAt: -Infinity, blockedUntil: 0, lastSuccessAt: now });
  }

  private isCrowded(place: AddressState, now: number): boolean {
    return now - place.windowStart < this.limits.windowMs && place.failures >= this.limits.perAddress;
  }
}

function pairKey(address: string, account: string): string {
  return `${address}\n${account}`;
}

function refuse(waitMs: number, reason: string): Admission {
  const retryAfterSeconds = Math.max(1, Math.ceil(waitMs / 1000));
  return { isAdmitted: false, retryAfterSeconds, message: `${reason}; try again in ${waitInWords(retryAfterSeconds)}` };
}
