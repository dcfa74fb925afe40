import mysql from "mysql2/promise";
import { afterAll, beforeAll, beforeEach, expect, test } from "vitest";
import {
  changePassword,
  SIGN_IN_FAILED_MESSAGE,
  signIn,
} from "~/.server/auth/accounts";
import { hashPassword, verifyPassword } from "~/.server/auth/password";
import { createSession, validateSessionToken } from "~/.server/auth/session";
import { hashToken } from "~/.server/auth/tokens";
import { createUser, setUserDisabled } from "~/.server/db/queries/users";
import { useFreshMigratedDatabase } from "../support/app-database";

/*
 * Sessions and disabled accounts against the real MariaDB.
 * Reference for the session design: common practice for database sessions — the cookie holds a random token,
 * the database only its SHA-256, so a leaked table cannot be replayed.
 */
let cleanup: () => Promise<void>;
let engineerId: number;
const PASSWORD = "correct-horse-battery";

beforeAll(async () => {
  const fresh = await useFreshMigratedDatabase();
  pool = mysql.createPool({ uri: fresh.url, timezone: "Z" });
  cleanup = async () => {
    await pool.end();
    await fresh.cleanup();
  };
  const passwordHash = await hashPassword(PASSWORD);
  engineerId = await createUser({
    email: "eng@example.test",
    name: "Eng",
    role: "engineer",
    passwordHash,
  });
  await createUser({
    email: "other@example.test",
    name: "Other",
    role: "viewer",
    passwordHash,
  });
}, 60_000);

afterAll(async () => cleanup?.());

let pool: mysql.Pool;
async function sql<T>(query: string, params: unknown[] = []): Promise<T[]> {
  const [rows] = await pool.query(query, params);
  return rows as T[];
}

function tokenFromCookie(setCookie: string): string {
  // The cookie value is signed by react-router's createCookie; the token sits base64-JSON-encoded inside.
  const value = decodeURIComponent(
    setCookie.split(";")[0]!.split("=").slice(1).join("="),
  );
  return JSON.parse(
    Buffer.from(value.split(".")[0]!, "base64").toString("utf8"),
  ) as string;
}

beforeEach(async () => {
  await sql("DELETE FROM sign_in_attempts");
  await sql("DELETE FROM sessions");
  await sql("UPDATE users SET disabled_at = NULL");
});

test("the database stores only the SHA-256 of a session token, never the token", async () => {
  const { sessionId, setCookie } = await createSession(engineerId, {
    ipAddress: "10.0.0.1",
    userAgent: "test",
  });
  const token = tokenFromCookie(setCookie);
  expect(token).toMatch(/^[a-z2-7]{32}$/);
  expect(sessionId).toBe(hashToken(token));
  const rows = await sql<Record<string, unknown>>("SELECT * FROM sessions");
  expect(rows).toHaveLength(1);
  expect(JSON.stringify(rows)).not.toContain(token);
  // The stored id cannot be used as a token.
  expect(await validateSessionToken(sessionId.slice(0, 32))).toBeNull();
  expect((await validateSessionToken(token))?.user.id).toBe(engineerId);
  expect(setCookie).toMatch(/HttpOnly/);
  expect(setCookie).toMatch(/SameSite=Lax/);
});

test("an expired session is refused and deleted; a session with under 15 days left slides to 30 days", async () => {
  const { sessionId, setCookie } = await createSession(engineerId, {
    ipAddress: "x",
    userAgent: null,
  });
  const token = tokenFromCookie(setCookie);
  const day = 24 * 3600 * 1000;

  // 20 days left: valid, not renewed.
  await sql("UPDATE sessions SET expires_at = ? WHERE id = ?", [
    new Date(Date.now() + 20 * day),
    sessionId,
  ]);
  expect((await validateSessionToken(token))?.renewedCookie).toBeNull();

  // 10 days left: renewed in the database and in the cookie.
  await sql("UPDATE sessions SET expires_at = ? WHERE id = ?", [
    new Date(Date.now() + 10 * day),
    sessionId,
  ]);
  const renewed = await validateSessionToken(token);
  expect(renewed?.renewedCookie).toMatch(/Max-Age=2592000/);
  const [row] = await sql<{ expires_at: Date }>(
    "SELECT expires_at FROM sessions WHERE id = ?",
    [sessionId],
  );
  expect(
    Math.abs(new Date(row!.expires_at).getTime() - (Date.now() + 30 * day)),
  ).toBeLessThan(60_000);

  // Expired: refused and removed.
  await sql("UPDATE sessions SET expires_at = ? WHERE id = ?", [
    new Date(Date.now() - 1000),
    sessionId,
  ]);
  expect(await validateSessionToken(token)).toBeNull();
  expect(
    await sql("SELECT id FROM sessions WHERE id = ?", [sessionId]),
  ).toEqual([]);
});

test("disabling an account stops its sessions at once; a password change ends the other sessions", async () => {
  const a = await createSession(engineerId, {
    ipAddress: "x",
    userAgent: null,
  });
  const b = await createSession(engineerId, {
    ipAddress: "x",
    userAgent: null,
  });
  const changed = await changePassword({
    userId: engineerId,
    sessionId: a.sessionId,
    currentPassword: PASSWORD,
    newPassword: PASSWORD,
    ipAddress: "x",
  });
  expect(changed).toEqual({ ok: true });
  expect(
    await validateSessionToken(tokenFromCookie(a.setCookie)),
  ).not.toBeNull();
  expect(await validateSessionToken(tokenFromCookie(b.setCookie))).toBeNull();

  await setUserDisabled(engineerId, true);
  expect(await validateSessionToken(tokenFromCookie(a.setCookie))).toBeNull();
  const disabledSignIn = await signIn({
    email: "eng@example.test",
    password: PASSWORD,
    ipAddress: "10.1.1.1",
    userAgent: null,
  });
  expect(disabledSignIn).toMatchObject({ ok: false, reason: "invalid" });
});

test("unknown address and wrong password get the same message", async () => {
  const unknown = await signIn({
    email: "nobody@example.test",
    password: "whatever-it-is",
    ipAddress: "10.2.0.1",
    userAgent: null,
  });
  const wrong = await signIn({
    email: "eng@example.test",
    password: "not-the-password",
    ipAddress: "10.2.0.2",
    userAgent: null,
  });
  expect(unknown).toEqual(wrong);
  expect(unknown).toEqual({
    ok: false,
    reason: "invalid",
    message: SIGN_IN_FAILED_MESSAGE,
  });
});

// Throttling (which replaced the lockout): tests/integration/sign-in-throttle.db.test.ts.

test("password hashes are argon2id with the documented parameters", async () => {
  const hash = await hashPassword("some password");
  expect(hash).toMatch(/^\$argon2id\$v=19\$m=65536,t=3,p=1\$/);
  expect(await verifyPassword(hash, "some password")).toBe(true);
  expect(await verifyPassword(hash, "some passwore")).toBe(false);
});
