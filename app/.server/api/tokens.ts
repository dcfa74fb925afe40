import { createSecretKey, randomUUID, type KeyObject } from "node:crypto";
import jwt from "jsonwebtoken";
import { recordAudit } from "~/.server/db/queries/audit";
import {
  getApiTokenForUse,
  insertApiToken,
  touchApiToken,
  type TokenRestriction,
} from "~/.server/db/queries/api-tokens";
import type { ApiScope } from "~/.server/db/schema";
import type { OutputSystem } from "~/core/units";
import type { Role } from "~/utils/permissions";
import { getEnv } from "~/.server/env";

/*
 * API tokens are JWTs signed with HS256 and the server secret API_TOKEN_SECRET. The JWT's `jti` names a row of
 * api_tokens, which is checked on every request: revocation, expiry and a disabled owner take effect at once.
 * The JWT itself is shown once and never stored.
 */
const ISSUER = "isopleth";
const AUDIENCE = "isopleth-api";
export const MAX_TOKEN_LIFETIME_DAYS = 365;

// The secret as a KeyObject, made once: given a string, jsonwebtoken first tries to read it as a PEM public key
// on every call, and that failed parse was the largest cost of a single-point API request.
let secretKey: KeyObject | undefined;
function tokenKey(): KeyObject {
  secretKey ??= createSecretKey(Buffer.from(getEnv().API_TOKEN_SECRET, "utf8"));
  return secretKey;
}

export async function issueApiToken(input: {
  userId: number;
  name: string;
  scopes: ApiScope[];
  restriction: TokenRestriction;
  expiresInDays: number;
  ipAddress: string;
}): Promise<{ id: string; token: string; expiresAt: Date }> {
  const days = Math.min(
    Math.max(1, Math.floor(input.expiresInDays)),
    MAX_TOKEN_LIFETIME_DAYS,
  );
  const id = randomUUID();
  const expiresAt = new Date(Date.now() + days * 86_400_000);
  await insertApiToken({
    id,
    userId: input.userId,
    name: input.name,
    scopes: input.scopes,
    restriction: input.restriction,
    expiresAt,
  });
  const token = jwt.sign({ scope: input.scopes.join(" ") }, tokenKey(), {
    algorithm: "HS256",
    jwtid: id,
    subject: String(input.userId),
    issuer: ISSUER,
    audience: AUDIENCE,
    expiresIn: Math.floor((expiresAt.getTime() - Date.now()) / 1000),
  });
  await recordAudit({
    action: "api_token_created",
    userId: input.userId,
    apiTokenId: id,
    entityType: "api_token",
    entityId: id,
    details: {
      name: input.name,
      scopes: input.scopes,
      restriction: input.restriction,
      expiresAt: expiresAt.toISOString(),
    },
    ipAddress: input.ipAddress,
  });
  return { id, token, expiresAt };
}

export type TokenCaller = {
  tokenId: string;
  scopes: ApiScope[];
  restriction: TokenRestriction;
  user: {
    id: number;
    email: string;
    name: string;
    role: Role;
    unitSystem: OutputSystem;
  };
};

export type TokenCheck =
  { ok: true; caller: TokenCaller } | { ok: false; detail: string };

/** Verifies signature, algorithm, issuer, audience and expiry, then the token record and its owner. */
export async function verifyApiToken(
  token: string,
  ipAddress: string,
): Promise<TokenCheck> {
  let payload: jwt.JwtPayload;
  try {
    const decoded = jwt.verify(token, tokenKey(), {
      algorithms: ["HS256"],
      issuer: ISSUER,
      audience: AUDIENCE,
    });
    if (typeof decoded === "string")
      return { ok: false, detail: "The token is not valid." };
    payload = decoded;
  } catch (error) {
    if (error instanceof jwt.TokenExpiredError)
      return { ok: false, detail: "The token has expired. Create a new one." };
    return { ok: false, detail: "The token is not valid." };
  }
  if (typeof payload.jti !== "string")
    return { ok: false, detail: "The token is not valid." };
  const record = await getApiTokenForUse(payload.jti);
  if (!record || String(record.user.id) !== payload.sub)
    return { ok: false, detail: "The token is not valid." };
  if (record.revokedAt)
    return { ok: false, detail: "The token has been revoked." };
  if (record.expiresAt.getTime() <= Date.now())
    return { ok: false, detail: "The token has expired. Create a new one." };
  if (record.user.disabledAt)
    return {
      ok: false,
      detail:
        "The token's owner can no longer sign in, so the token no longer works.",
    };
  noteUse(record.id, record.user.id, ipAddress);
  const { disabledAt: _d, ...user } = record.user;
  return {
    ok: true,
    caller: {
      tokenId: record.id,
      scopes: record.scopes,
      restriction: record.restriction ?? null,
      user,
    },
  };
}

/*
 * Use of a token: `last used` is updated on use (without making the request wait, at most one write in flight
 * and one per second per token). The audit trail is sampled per minute: the first use of a token in each minute (per app
 * process) writes one "api_token_used" entry, which also states how many requests the token made in its
 * previous active minute — so the log stays complete in count without one row per request.
 */
const inFlight = new Set<string>();
const minuteCounts = new Map<string, { minute: number; count: number }>();

const lastTouched = new Map<string, number>();

function noteUse(tokenId: string, userId: number, ipAddress: string) {
  const now = Date.now();
  // `last used` has one-second resolution: under load a token is written at most once a second.
  if (
    !inFlight.has(tokenId) &&
    now - (lastTouched.get(tokenId) ?? 0) >= 1_000
  ) {
    lastTouched.set(tokenId, now);
    inFlight.add(tokenId);
    touchApiToken(tokenId)
      .catch((error: unknown) =>
        console.warn("could not update last use of token", tokenId, error),
      )
      .finally(() => inFlight.delete(tokenId));
  }
  const minute = Math.floor(Date.now() / 60_000);
  const previous = minuteCounts.get(tokenId);
  if (previous && previous.minute === minute) {
    previous.count += 1;
    return;
  }
  minuteCounts.set(tokenId, { minute, count: 1 });
  recordAudit({
    action: "api_token_used",
    userId,
    apiTokenId: tokenId,
    entityType: "api_token",
    entityId: tokenId,
    details: previous
      ? {
          previousMinute: new Date(previous.minute * 60_000).toISOString(),
          requestsInPreviousMinute: previous.count,
        }
      : { note: "first use since this app process started" },
    ipAddress,
  }).catch((error: unknown) =>
    console.warn("could not record token use", tokenId, error),
  );
}
