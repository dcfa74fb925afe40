import { describe, expect, test } from "vitest";
import {
  backoffMs,
  describeWait,
  SIGN_IN_THROTTLE,
  signInWait,
  type SignInHistory,
} from "./sign-in-throttle";

/*
 * The throttle policy, after OWASP's Authentication Cheat Sheet ("Protect against automated attacks": delays
 * that grow rather than a hard lockout, which an attacker can turn against the owner) and Credential Stuffing
 * Prevention Cheat Sheet (limits per account and per address; trust a known device).
 */
const at = (s: number) => new Date(Date.UTC(2026, 0, 1) + s * 1000);
const none = { failures: 0, lastFailureAt: null };
const history = (patch: Partial<SignInHistory>): SignInHistory => ({
  pair: none,
  account: none,
  address: none,
  knownClient: false,
  ...patch,
});

describe("backoffMs", () => {
  test("nothing within the free failures, then a delay that doubles up to the cap", () => {
    const rule = SIGN_IN_THROTTLE.pair;
    const delays = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 50, 1e9].map(
      (n) => backoffMs(n, rule) / 1000,
    );
    expect(delays).toEqual([
      0, 0, 0, 0, 0, 30, 60, 120, 240, 480, 900, 900, 900, 900,
    ]);
  });
});

describe("signInWait", () => {
  test("a pair past its free failures waits from its last failure", () => {
    const h = history({ pair: { failures: 5, lastFailureAt: at(0) } });
    expect(signInWait(h, at(10))).toEqual({ waitMs: 20_000, reason: "pair" });
    expect(signInWait(h, at(30))).toEqual({ waitMs: 0, reason: null });
  });

  test("within the free failures there is no wait, even when a concurrent attempt was recorded after `now`", () => {
    // Four sign-ins at once from one address: each sees the others' rows, a few ms newer than its own clock.
    const h = history({
      pair: { failures: 1, lastFailureAt: at(0.005) },
      address: { failures: 3, lastFailureAt: at(0.005) },
    });
    expect(signInWait(h, at(0))).toEqual({ waitMs: 0, reason: null });
  });

  test("the account ceiling slows unknown clients only; a known client of the account goes ahead", () => {
    const account = { failures: 20, lastFailureAt: at(0) };
    expect(signInWait(history({ account }), at(1))).toEqual({
      waitMs: 4_000,
      reason: "account",
    });
    expect(signInWait(history({ account, knownClient: true }), at(1))).toEqual({
      waitMs: 0,
      reason: null,
    });
    // Slowed, never locked: the longest wait is a minute.
    expect(
      signInWait(
        history({ account: { failures: 10_000, lastFailureAt: at(0) } }),
        at(0),
      ).waitMs,
    ).toBe(60_000);
  });

  test("the address ceiling (spraying) slows unknown clients only", () => {
    const address = { failures: 51, lastFailureAt: at(0) };
    expect(signInWait(history({ address }), at(0))).toEqual({
      waitMs: 10_000,
      reason: "address",
    });
    expect(
      signInWait(history({ address, knownClient: true }), at(0)).waitMs,
    ).toBe(0);
  });

  test("a known client is still held by the failures of its own pair", () => {
    const h = history({
      pair: { failures: 6, lastFailureAt: at(0) },
      knownClient: true,
    });
    expect(signInWait(h, at(0))).toEqual({ waitMs: 60_000, reason: "pair" });
  });

  test("the longest of the waits applies", () => {
    const h = history({
      pair: { failures: 5, lastFailureAt: at(0) },
      account: { failures: 25, lastFailureAt: at(0) },
    });
    expect(signInWait(h, at(0))).toEqual({ waitMs: 60_000, reason: "account" });
  });
});

test("describeWait says seconds below a minute, else whole minutes rounded up", () => {
  expect([1, 30, 59, 60, 61, 900].map(describeWait)).toEqual([
    "1 second",
    "30 seconds",
    "59 seconds",
    "1 minute",
    "2 minutes",
    "15 minutes",
  ]);
});
