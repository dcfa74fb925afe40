import mysql from "mysql2/promise";
import { afterAll, beforeAll, beforeEach, expect, test } from "vitest";
import { startSmtpCapture } from "../support/smtp-capture";
import * as accounts from "~/.server/auth/accounts";
import * as background from "~/.server/auth/background";
import { hashPassword } from "~/.server/auth/password";
import { createUser } from "~/.server/db/queries/users";
import { useFreshMigratedDatabase } from "../support/app-database";

/*
 * Sign-in throttling against the real MariaDB, with the clock injected. The policy follows OWASP's
 * Authentication Cheat Sheet ("Protect against automated attacks": growing delays, not a lockout an attacker
 * can aim at the owner) and Credential Stuffing Prevention Cheat Sheet (per-account and per-address limits,
 * known devices trusted, the owner told of the attack). Mail goes through nodemailer to a real SMTP server.
 */
let cleanup: () => Promise<void>;
let pool: mysql.Pool;
let smtp: Awaited<ReturnType<typeof startSmtpCapture>>;
const PASSWORD = "correct-horse-battery";
const OWNER = "owner@example.test";
const T0 = Date.UTC(2026, 2, 1, 9, 0, 0);
const at = (seconds: number) => new Date(T0 + seconds * 1000);

beforeAll(async () => {
  smtp = await startSmtpCapture();
  process.env.SMTP_PORT = String(smtp.port);
  const fresh = await useFreshMigratedDatabase();
  pool = mysql.createPool({ uri: fresh.url, timezone: "Z" });
  await createUser({
    email: OWNER,
    name: "Owner",
    role: "engineer",
    passwordHash: await hashPassword(PASSWORD),
  });
  for (let i = 0; i < 3; i++)
    await createUser({
      email: `member${i}@example.test`,
      name: `Member ${i}`,
      role: "viewer",
      passwordHash: await hashPassword(PASSWORD),
    });
  cleanup = async () => {
    await pool.end();
    await fresh.cleanup();
    await smtp.close();
  };
}, 60_000);
afterAll(async () => cleanup?.());

beforeEach(async () => {
  await pool.query("DELETE FROM sign_in_attempts");
  await pool.query("UPDATE users SET sign_in_alert_at = NULL");
  smtp.messages.length = 0;
});

const attempt = (input: {
  email?: string;
  password?: string;
  ip: string;
  at: Date;
}) =>
  accounts.signIn({
    email: input.email ?? OWNER,
    password: input.password ?? "a-wrong-guess",
    ipAddress: input.ip,
    userAgent: null,
    now: input.at,
  });

test("one client guessing one account: 5 free failures, then waits that double (30 s … 15 min) and are never a lock", async () => {
  let t = 0;
  for (let i = 0; i < 5; i++)
    expect(await attempt({ ip: "203.0.113.5", at: at(t++) })).toMatchObject({
      reason: "invalid",
    });
  // The sixth try at once is refused before the password is checked, even the right one, with the wait.
  const refused = await attempt({
    ip: "203.0.113.5",
    password: PASSWORD,
    at: at(t),
  });
  expect(refused).toMatchObject({
    ok: false,
    reason: "throttled",
    limit: "pair",
    retryAfterSeconds: 29,
  });
  if (refused.ok) throw new Error("unreachable");
  expect(refused.message).toBe(
    "Too many failed sign-in attempts from here. Wait 29 seconds and try again, or reset your password.",
  );

  // Each wait, taken exactly, lets one more guess through; the next wait is twice as long, up to 15 minutes.
  const waits: number[] = [];
  let last = t - 1;
  for (let i = 0; i < 7; i++) {
    const early = await attempt({ ip: "203.0.113.5", at: at(last + 1) });
    if (early.ok || early.reason !== "throttled")
      throw new Error(`expected a wait, got ${JSON.stringify(early)}`);
    waits.push(early.retryAfterSeconds + 1);
    last = last + early.retryAfterSeconds + 1;
    expect(await attempt({ ip: "203.0.113.5", at: at(last) })).toMatchObject({
      reason: "invalid",
    });
  }
  expect(waits).toEqual([30, 60, 120, 240, 480, 900, 900]);

  // After the wait the owner's right password works from that same client, and success clears the pair.
  expect(
    await attempt({
      ip: "203.0.113.5",
      password: PASSWORD,
      at: at(last + 900),
    }),
  ).toMatchObject({ ok: true });
  expect(
    await attempt({ ip: "203.0.113.5", at: at(last + 901) }),
  ).toMatchObject({ reason: "invalid" });
});

test("someone else's failures do not stop the owner: other addresses sign in at once", async () => {
  for (let i = 0; i < 5; i++) await attempt({ ip: "198.51.100.66", at: at(i) });
  expect(await attempt({ ip: "198.51.100.66", at: at(5) })).toMatchObject({
    reason: "throttled",
  });
  // Never signed in from 192.0.2.10 before, and still not held up.
  expect(
    await attempt({ ip: "192.0.2.10", password: PASSWORD, at: at(5) }),
  ).toMatchObject({ ok: true });
});

test("an unknown address gets exactly the same throttling as a known one (no account enumeration)", async () => {
  const results = [];
  for (const email of [OWNER, "nobody@example.test"]) {
    await pool.query("DELETE FROM sign_in_attempts");
    const run = [];
    for (let i = 0; i < 7; i++)
      run.push(await attempt({ email, ip: "203.0.113.9", at: at(i) }));
    results.push(run);
  }
  expect(results[0]).toEqual(results[1]);
});

test("past the account ceiling new devices are slowed, the owner's known device is not, and the owner is told once per window", async () => {
  // The owner signed in from 192.0.2.1 last week: a known client.
  expect(
    await attempt({ ip: "192.0.2.1", password: PASSWORD, at: at(-7 * 86_400) }),
  ).toMatchObject({ ok: true });
  // A botnet: 20 addresses, one guess each, within a minute.
  for (let i = 0; i < 20; i++)
    expect(await attempt({ ip: `198.51.100.${i}`, at: at(i) })).toMatchObject({
      reason: "invalid",
    });
  await background.settleBackgroundJobs();
  expect(smtp.messages).toHaveLength(1);
  expect(smtp.messages[0]).toMatchObject({
    to: [OWNER],
    subject: "Failed sign-in attempts on your Isopleth account",
  });
  expect(smtp.messages[0]!.text).toContain(
    "There were 20 failed attempts to sign in to your Isopleth account in the last 60 minutes.",
  );

  // A 21st address is slowed (until 5 s after the latest failure, at 19 s), not locked out.
  const slowed = await attempt({
    ip: "198.51.100.200",
    password: PASSWORD,
    at: at(20),
  });
  expect(slowed).toMatchObject({
    ok: false,
    reason: "throttled",
    limit: "account",
    retryAfterSeconds: 4,
  });
  if (slowed.ok) throw new Error("unreachable");
  expect(slowed.message).toBe(
    "There have been many failed sign-in attempts, so sign-in from new devices is slowed down. Wait 4 seconds and try again.",
  );
  // The owner on the known device gets in at once.
  expect(
    await attempt({ ip: "192.0.2.1", password: PASSWORD, at: at(20) }),
  ).toMatchObject({ ok: true });
  // Someone on a new device gets in after the short wait.
  expect(
    await attempt({ ip: "192.0.2.77", password: PASSWORD, at: at(24) }),
  ).toMatchObject({ ok: true });

  // More guesses in the same window: no second message.
  for (let i = 0; i < 5; i++)
    await attempt({ ip: `198.51.100.${100 + i}`, at: at(200 + i * 60) });
  await background.settleBackgroundJobs();
  expect(smtp.messages).toHaveLength(1);
  // An hour after the first message, the attack goes on: a second message.
  for (let i = 0; i < 21; i++)
    await attempt({ ip: `198.51.100.${150 + i}`, at: at(3_700 + i * 61) });
  await background.settleBackgroundJobs();
  expect(smtp.messages).toHaveLength(2);
});

test("one address spraying many accounts is slowed for accounts it has never signed in to", async () => {
  expect(
    await attempt({
      email: "member0@example.test",
      ip: "203.0.113.50",
      password: PASSWORD,
      at: at(0),
    }),
  ).toMatchObject({ ok: true });
  for (let i = 0; i < 50; i++)
    await attempt({
      email: `guess${i}@example.test`,
      ip: "203.0.113.50",
      at: at(1 + i),
    });
  expect(
    await attempt({
      email: "member1@example.test",
      ip: "203.0.113.50",
      password: PASSWORD,
      at: at(51),
    }),
  ).toMatchObject({ reason: "throttled", limit: "address" });
  // The account this address already signed in to is not held up (an office behind one address keeps working).
  expect(
    await attempt({
      email: "member0@example.test",
      ip: "203.0.113.50",
      password: PASSWORD,
      at: at(51),
    }),
  ).toMatchObject({ ok: true });
});

test("concurrent guesses cannot slip past the limit: ten at once, at most five passwords are checked", async () => {
  const results = await Promise.all(
    Array.from({ length: 10 }, () =>
      attempt({ ip: "203.0.113.77", at: at(0) }),
    ),
  );
  const checked = results.filter((r) => !r.ok && r.reason === "invalid").length;
  expect(checked).toBeLessThanOrEqual(5);
  expect(results.filter((r) => !r.ok && r.reason === "throttled").length).toBe(
    10 - checked,
  );
  // Refused attempts are not counted as failures.
  const [rows] = await pool.query(
    "SELECT COUNT(*) AS n FROM sign_in_attempts WHERE ip_address = '203.0.113.77'",
  );
  expect((rows as { n: number }[])[0]!.n).toBe(checked);
});
