import mysql from "mysql2/promise";
import { afterAll, beforeAll, beforeEach, expect, test } from "vitest";
import { startSmtpCapture } from "../support/smtp-capture";
import * as accounts from "~/.server/auth/accounts";
import * as background from "~/.server/auth/background";
import * as session from "~/.server/auth/session";
import { hashPassword } from "~/.server/auth/password";
import { createUser } from "~/.server/db/queries/users";
import { hashToken, generateToken } from "~/.server/auth/tokens";
import { useFreshMigratedDatabase } from "../support/app-database";

/*
 * Password reset against the real MariaDB and a real SMTP server, after OWASP's Forgot Password Cheat Sheet
 * (same answer for every address, reset messages rate-limited, a link that works once, sessions ended after a
 * reset) and Session Management Cheat Sheet (renew sessions on a password change).
 */
let cleanup: () => Promise<void>;
let pool: mysql.Pool;
let smtp: Awaited<ReturnType<typeof startSmtpCapture>>;
let userId: number;
const EMAIL = "reset@example.test";
const PASSWORD = "correct-horse-battery";
// Link expiry is checked against the real clock, so the injected clock starts now.
const T0 = Date.now();
const at = (minutes: number) => new Date(T0 + minutes * 60_000);

beforeAll(async () => {
  smtp = await startSmtpCapture();
  process.env.SMTP_PORT = String(smtp.port);
  const fresh = await useFreshMigratedDatabase();
  pool = mysql.createPool({ uri: fresh.url, timezone: "Z" });
  const hash = await hashPassword(PASSWORD);
  userId = await createUser({
    email: EMAIL,
    name: "Reset",
    role: "engineer",
    passwordHash: hash,
  });
  for (let i = 0; i < 12; i++)
    await createUser({
      email: `team${i}@example.test`,
      name: `Team ${i}`,
      role: "viewer",
      passwordHash: hash,
    });
  cleanup = async () => {
    await pool.end();
    await fresh.cleanup();
    await smtp.close();
  };
}, 60_000);
afterAll(async () => cleanup?.());

beforeEach(async () => {
  await pool.query("DELETE FROM password_reset_requests");
  await pool.query("DELETE FROM link_tokens");
  await pool.query("DELETE FROM sessions");
  smtp.messages.length = 0;
});

function linkToken(text: string): string {
  const token = text.match(/\/reset-password\/([a-z2-7]+)/)?.[1];
  if (!token) throw new Error(`no reset link in ${text}`);
  return token;
}
const tokenFromCookie = (setCookie: string) =>
  JSON.parse(
    Buffer.from(
      decodeURIComponent(
        setCookie.split(";")[0]!.split("=").slice(1).join("="),
      ).split(".")[0]!,
      "base64",
    ).toString("utf8"),
  ) as string;

test("the request itself does no work: a known and an unknown address return alike, the message follows in the background", async () => {
  expect(
    accounts.requestPasswordReset({ email: EMAIL, ipAddress: "192.0.2.1" }),
  ).toBeUndefined();
  expect(
    accounts.requestPasswordReset({
      email: "nobody@example.test",
      ipAddress: "192.0.2.1",
    }),
  ).toBeUndefined();
  await background.settleBackgroundJobs();
  expect(smtp.messages.map((m) => m.to)).toEqual([[EMAIL]]);
  const [rows] = await pool.query(
    "SELECT email, sent FROM password_reset_requests ORDER BY id",
  );
  expect(rows).toEqual([
    { email: EMAIL, sent: 1 },
    { email: "nobody@example.test", sent: 0 },
  ]);
});

test("a new reset link kills the older one; completing a reset kills every link and ends every session", async () => {
  const a = await session.createSession(userId, {
    ipAddress: "x",
    userAgent: null,
  });
  const b = await session.createSession(userId, {
    ipAddress: "x",
    userAgent: null,
  });
  await accounts.processPasswordResetRequest({
    email: EMAIL,
    ipAddress: "192.0.2.1",
    now: at(0),
  });
  await accounts.processPasswordResetRequest({
    email: EMAIL,
    ipAddress: "192.0.2.1",
    now: at(1),
  });
  const [first, second] = smtp.messages.map((m) => linkToken(m.text));
  expect(await accounts.getPasswordReset(first!)).toBeNull();
  expect(await accounts.getPasswordReset(second!)).not.toBeNull();
  const refused = await accounts.resetPassword({
    token: first!,
    password: "another-long-password",
    ipAddress: "x",
    userAgent: null,
  });
  expect(refused).toEqual({
    ok: false,
    message:
      "This reset link has expired or has already been used. Ask for a new one.",
  });

  // A live link made before this rule existed (written directly) dies too when a reset is completed.
  const legacy = generateToken();
  await pool.query(
    "INSERT INTO link_tokens (kind, token_hash, email, user_id, expires_at) VALUES ('password_reset', ?, ?, ?, ?)",
    [hashToken(legacy), EMAIL, userId, new Date(Date.now() + 3_600_000)],
  );
  const done = await accounts.resetPassword({
    token: second!,
    password: "another-long-password",
    ipAddress: "x",
    userAgent: null,
  });
  expect(done.ok).toBe(true);
  expect(await accounts.getPasswordReset(legacy)).toBeNull();
  // Every session that existed is gone; only the one the reset just made is valid.
  expect(
    await session.validateSessionToken(tokenFromCookie(a.setCookie)),
  ).toBeNull();
  expect(
    await session.validateSessionToken(tokenFromCookie(b.setCookie)),
  ).toBeNull();
  if (!done.ok) throw new Error("unreachable");
  expect(
    (await session.validateSessionToken(tokenFromCookie(done.setCookie)))?.user
      .id,
  ).toBe(userId);

  // Back to the original password through a change on the account page, which also kills live reset links.
  await accounts.processPasswordResetRequest({
    email: EMAIL,
    ipAddress: "192.0.2.1",
    now: at(2),
  });
  const third = linkToken(smtp.messages.at(-1)!.text);
  const keep = await session.createSession(userId, {
    ipAddress: "x",
    userAgent: null,
  });
  const other = await session.createSession(userId, {
    ipAddress: "x",
    userAgent: null,
  });
  expect(
    await accounts.changePassword({
      userId,
      sessionId: keep.sessionId,
      currentPassword: "another-long-password",
      newPassword: PASSWORD,
      ipAddress: "x",
    }),
  ).toEqual({ ok: true });
  expect(await accounts.getPasswordReset(third)).toBeNull();
  expect(
    await session.validateSessionToken(tokenFromCookie(keep.setCookie)),
  ).not.toBeNull();
  expect(
    await session.validateSessionToken(tokenFromCookie(other.setCookie)),
  ).toBeNull();
});

test("reset messages are limited quietly: 3 an hour to one address, 10 an hour on requests from one client", async () => {
  const sent = [];
  for (let i = 0; i < 5; i++)
    sent.push(
      (
        await accounts.processPasswordResetRequest({
          email: EMAIL,
          ipAddress: `192.0.2.${i}`,
          now: at(i),
        })
      ).sent,
    );
  expect(sent).toEqual([true, true, true, false, false]);
  // The newest message's link is the one that works (an attacker's extra requests cannot leave the owner without one).
  expect(
    await accounts.getPasswordReset(linkToken(smtp.messages.at(-1)!.text)),
  ).not.toBeNull();
  // After the hour, messages go out again.
  expect(
    (
      await accounts.processPasswordResetRequest({
        email: EMAIL,
        ipAddress: "192.0.2.9",
        now: at(61),
      })
    ).sent,
  ).toBe(true);

  const fromOneClient = [];
  for (let i = 0; i < 12; i++)
    fromOneClient.push(
      (
        await accounts.processPasswordResetRequest({
          email: `team${i}@example.test`,
          ipAddress: "203.0.113.3",
          now: at(100 + i),
        })
      ).sent,
    );
  expect(fromOneClient.filter(Boolean)).toHaveLength(10);
  expect(fromOneClient.slice(10)).toEqual([false, false]);
  // Requests for unknown addresses from that client send nothing and do not use up its allowance.
  await pool.query("DELETE FROM password_reset_requests");
  for (let i = 0; i < 20; i++)
    await accounts.processPasswordResetRequest({
      email: `unknown${i}@example.test`,
      ipAddress: "203.0.113.4",
      now: at(200),
    });
  expect(
    (
      await accounts.processPasswordResetRequest({
        email: "team0@example.test",
        ipAddress: "203.0.113.4",
        now: at(200),
      })
    ).sent,
  ).toBe(true);
});
