import { createCookie } from "react-router";
import {
  deleteSession,
  extendSession,
  getSessionWithUser,
  insertSession,
} from "~/.server/db/queries/sessions";
import { getDb, type Executor } from "~/.server/db/client";
import { recordAudit } from "~/.server/db/queries/audit";
import { getEnv } from "~/.server/env";
import type { OutputSystem } from "~/core/units";
import type { Role } from "~/utils/permissions";
import { generateToken, hashToken } from "./tokens";

/*
 * Sessions live in MariaDB. The cookie carries a random token; the database holds only hex(SHA-256(token)),
 * so a copy of the sessions table cannot be used to sign in. Expiry slides: 30 days from the last use,
 * renewed (in the database and the cookie) once less than 15 days are left.
 */
const SESSION_TTL_MS = 30 * 24 * 60 * 60 * 1000;
const SESSION_RENEW_BELOW_MS = 15 * 24 * 60 * 60 * 1000;

export type SessionUser = {
  id: number;
  email: string;
  name: string;
  role: Role;
  unitSystem: OutputSystem;
};

let cookie: ReturnType<typeof createCookie> | undefined;
function sessionCookie() {
  if (!cookie) {
    const env = getEnv();
    cookie = createCookie("isopleth_session", {
      httpOnly: true,
      sameSite: "lax",
      secure: env.APP_BASE_URL.startsWith("https://"),
      path: "/",
      maxAge: SESSION_TTL_MS / 1000,
      secrets: [env.SESSION_SECRET],
    });
  }
  return cookie;
}

export async function readSessionToken(
  request: Request,
): Promise<string | null> {
  const value: unknown = await sessionCookie().parse(
    request.headers.get("Cookie"),
  );
  return typeof value === "string" && /^[a-z2-7]{32}$/.test(value)
    ? value
    : null;
}

/** Opens a session; `db` is the transaction of the sign-in that opens it (and writes its audit row). */
export async function createSession(
  userId: number,
  meta: { ipAddress: string | null; userAgent: string | null },
  db: Executor = getDb(),
): Promise<{ sessionId: string; setCookie: string }> {
  const token = generateToken();
  const sessionId = hashToken(token);
  await insertSession(
    {
      id: sessionId,
      userId,
      expiresAt: new Date(Date.now() + SESSION_TTL_MS),
      ipAddress: meta.ipAddress,
      userAgent: meta.userAgent?.slice(0, 255) ?? null,
    },
    db,
  );
  return { sessionId, setCookie: await sessionCookie().serialize(token) };
}

type ValidatedSession = {
  sessionId: string;
  user: SessionUser;
  renewedCookie: string | null;
};

/** Looks the token up; refuses expired sessions and disabled accounts (deleting the session); renews when due. */
export async function validateSessionToken(
  token: string,
  now = Date.now(),
): Promise<ValidatedSession | null> {
  const sessionId = hashToken(token);
  const row = await getSessionWithUser(sessionId);
  if (!row) return null;
  if (row.expiresAt.getTime() <= now || row.user.disabledAt) {
    await deleteSession(sessionId);
    return null;
  }
  let renewedCookie: string | null = null;
  if (row.expiresAt.getTime() - now < SESSION_RENEW_BELOW_MS) {
    await extendSession(sessionId, new Date(now + SESSION_TTL_MS));
    renewedCookie = await sessionCookie().serialize(token);
  }
  const { disabledAt: _disabled, ...user } = row.user;
  return { sessionId, user, renewedCookie };
}

/** Signing out: ends the session and records it, in one transaction; gives the cookie that clears the browser's. */
export async function signOut(
  input: {
    sessionId: string;
    userId: number;
    ipAddress: string;
  },
  db: Executor = getDb(),
): Promise<string> {
  await db.transaction(async (tx) => {
    await deleteSession(input.sessionId, tx);
    await recordAudit(
      { action: "sign_out", userId: input.userId, ipAddress: input.ipAddress },
      tx,
    );
  });
  return clearSessionCookie();
}

export function clearSessionCookie(): Promise<string> {
  return sessionCookie().serialize("", { maxAge: 0 });
}
