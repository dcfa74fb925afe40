/*
 * Sign-in throttling that slows guessing without handing an attacker a way to lock the owner out
 * (OWASP Authentication Cheat Sheet, "Protect against automated attacks", and Credential Stuffing Prevention
 * Cheat Sheet): no hard lockout; delays that double up to a cap; the strict limit is per (account, client
 * address) pair; ceilings per account and per address only slow clients that have never signed in to that
 * account, so the owner on a known client is not held up by someone else's guesses.
 * Pure: the caller passes the counts (from sign_in_attempts) and the clock.
 */

const SECOND_MS = 1000;
const MINUTE_MS = 60 * SECOND_MS;
const HOUR_MS = 60 * MINUTE_MS;
const DAY_MS = 24 * HOUR_MS;

export const SIGN_IN_THROTTLE = {
  /** One (account, address) pair: 5 failures free, then 30 s, 1, 2, 4, 8 min… up to 15 min between tries. */
  pair: {
    freeFailures: 5,
    baseDelayMs: 30 * SECOND_MS,
    maxDelayMs: 15 * MINUTE_MS,
    windowMs: DAY_MS,
  },
  /** One account from any address: past 20 failures an hour, unknown clients wait 5 s, 10 s… up to 1 min. */
  account: {
    freeFailures: 20,
    baseDelayMs: 5 * SECOND_MS,
    maxDelayMs: MINUTE_MS,
    windowMs: HOUR_MS,
  },
  /** One address for any account (password spraying): past 50 failures an hour, the same slow-down. */
  address: {
    freeFailures: 50,
    baseDelayMs: 5 * SECOND_MS,
    maxDelayMs: MINUTE_MS,
    windowMs: HOUR_MS,
  },
  /** An address that signed in to the account within this time is a known client of it. */
  knownClientMs: 90 * DAY_MS,
  /** The owner is warned when the account ceiling is reached, at most once in this time. */
  alertWindowMs: HOUR_MS,
} as const;

type Rule = { freeFailures: number; baseDelayMs: number; maxDelayMs: number };
type FailureCount = { failures: number; lastFailureAt: Date | null };
export type SignInHistory = {
  pair: FailureCount;
  account: FailureCount;
  address: FailureCount;
  knownClient: boolean;
};
export type ThrottleReason = "pair" | "account" | "address";

/** The pause required after the latest failure: none within the free failures, then doubling up to the cap. */
export function backoffMs(failures: number, rule: Rule): number {
  if (failures < rule.freeFailures) return 0;
  const doublings = failures - rule.freeFailures;
  // 2 ** 40 is far past any cap; keeps the arithmetic finite for absurd counts.
  return Math.min(
    rule.baseDelayMs * 2 ** Math.min(doublings, 40),
    rule.maxDelayMs,
  );
}

/** How long this client must still wait before its password is checked (0: go ahead), and which limit holds it. */
export function signInWait(
  history: SignInHistory,
  now: Date,
): { waitMs: number; reason: ThrottleReason | null } {
  const rules: [ThrottleReason, FailureCount, Rule][] = [
    ["pair", history.pair, SIGN_IN_THROTTLE.pair],
  ];
  if (!history.knownClient) {
    rules.push(
      ["account", history.account, SIGN_IN_THROTTLE.account],
      ["address", history.address, SIGN_IN_THROTTLE.address],
    );
  }
  let result: { waitMs: number; reason: ThrottleReason | null } = {
    waitMs: 0,
    reason: null,
  };
  for (const [reason, count, rule] of rules) {
    const backoff = backoffMs(count.failures, rule);
    // Within the free failures there is no wait at all (a concurrent attempt's row may be a few ms newer than
    // `now`, which must not read as a wait).
    if (!count.lastFailureAt || backoff === 0) continue;
    const waitMs = count.lastFailureAt.getTime() + backoff - now.getTime();
    if (waitMs > result.waitMs) result = { waitMs, reason };
  }
  return result;
}

/** "30 seconds", "1 minute", "15 minutes": whole seconds below a minute, else whole minutes rounded up. */
export function describeWait(seconds: number): string {
  if (seconds < 60) return seconds === 1 ? "1 second" : `${seconds} seconds`;
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? "1 minute" : `${minutes} minutes`;
}

export function throttledMessage(
  reason: ThrottleReason,
  retryAfterSeconds: number,
): string {
  const wait = describeWait(retryAfterSeconds);
  if (reason === "pair") {
    return `Too many failed sign-in attempts from here. Wait ${wait} and try again, or reset your password.`;
  }
  return `There have been many failed sign-in attempts, so sign-in from new devices is slowed down. Wait ${wait} and try again.`;
}
