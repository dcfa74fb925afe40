import { createSecretKey, randomUUID, type KeyObject } from "node:crypto";
import jwt from "jsonwebtoken";
import type { SessionUser } from "~/.server/auth/session";
import { getDb, type Executor } from "~/.server/db/client";
import {
  getApiTokenForUse,
  getApiTokenOwner,
  insertApiToken,
  listApiTokens,
  revokeApiToken,
  touchApiToken,
  type TokenRestriction,
} from "~/.server/db/queries/api-tokens";
import { recordAudit } from "~/.server/db/queries/audit";
import type { ApiScope } from "~/.server/db/schema";
import type { OutputSystem } from "~/core/units";
import type { Role } from "~/utils/permissions";
import { getEnv } from "~/.server/env";
import { can } from "~/utils/permissions";

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

/*
 * Who may do what with tokens: everyone signed in may list and revoke their own tokens (a person demoted to
 * viewer keeps control of the tokens made before); creating one needs manage:own-tokens; seeing and revoking
 * everyone's needs revoke:any-token. What a token can do is bounded by its owner's current role on every request
 * (app/utils/api-scopes.ts).
 */

/**
 * Issues a token to its owner: at most MAX_TOKEN_LIFETIME_DAYS, restricted to the fields and samples given (none:
 * everything the owner may read). The record and its audit row are one transaction.
 */
export async function issueApiToken(
  input: {
    userId: number;
    name: string;
    scopes: ApiScope[];
    fieldIds?: number[];
    sampleIds?: number[];
    expiresInDays: number;
    ipAddress: string;
  },
  db: Executor = getDb(),
): Promise<{ id: string; token: string; expiresAt: Date }> {
  const days = Math.min(
    Math.max(1, Math.floor(input.expiresInDays)),
    MAX_TOKEN_LIFETIME_DAYS,
  );
  const fieldIds = input.fieldIds ?? [];
  const sampleIds = input.sampleIds ?? [];
  const restriction: TokenRestriction =
    fieldIds.length || sampleIds.length ? { fieldIds, sampleIds } : null;
  const id = randomUUID();
  const expiresAt = new Date(Date.now() + days * 86_400_000);
  await db.transaction(async (tx) => {
    await insertApiToken(
      {
        id,
        userId: input.userId,
        name: input.name,
        scopes: input.scopes,
        restriction,
        expiresAt,
      },
      tx,
    );
    await recordAudit(
      {
        action: "api_token_created",
        userId: input.userId,
        apiTokenId: id,
        entityType: "api_token",
        entityId: id,
        details: {
          name: input.name,
          scopes: input.scopes,
          restriction,
          expiresAt: expiresAt.toISOString(),
        },
        ipAddress: input.ipAddress,
      },
      tx,
    );
  });
  const token = jwt.sign({ scope: input.scopes.join(" ") }, tokenKey(), {
    algorithm: "HS256",
    jwtid: id,
    subject: String(input.userId),
    issuer: ISSUER,
    audience: AUDIENCE,
    expiresIn: Math.floor((expiresAt.getTime() - Date.now()) / 1000),
  });
  return { id, token, expiresAt };
}

/** The tokens the user may see (their own, or everyone's with revoke:any-token), each saying whether it expired. */
export async function listTokensFor(user: SessionUser, now = new Date()) {
  const seeAll = can(user, "revoke:any-token");
  const tokens = await listApiTokens(seeAll ? {} : { userId: user.id });
  return {
    seeAll,
    canCreate: can(user, "manage:own-tokens"),
    tokens: tokens.map((t) => ({
      ...t,
      expired: t.expiresAt.getTime() < now.getTime(),
    })),
  };
}

type RevokeOutcome =
  { ok: true; name: string } | { ok: false; reason: "not_found" | "forbidden" };

/**
 * Revokes a token of the user's own, or anyone's with revoke:any-token. Revoking a revoked token changes nothing
 * and records nothing; the first revocation and its audit row are one transaction.
 */
export async function revokeToken(
  input: {
    user: SessionUser;
    tokenId: string;
    ipAddress: string;
  },
  db: Executor = getDb(),
): Promise<RevokeOutcome> {
  return db.transaction(async (tx): Promise<RevokeOutcome> => {
    const owner = await getApiTokenOwner(input.tokenId, tx);
    if (!owner) return { ok: false, reason: "not_found" };
    if (owner.userId !== input.user.id && !can(input.user, "revoke:any-token"))
      return { ok: false, reason: "forbidden" };
    if (await revokeApiToken(input.tokenId, input.user.id, tx))
      await recordAudit(
        {
          action: "api_token_revoked",
          userId: input.user.id,
          apiTokenId: input.tokenId,
          entityType: "api_token",
          entityId: input.tokenId,
          details: { owner: owner.userId, name: owner.name },
          ipAddress: input.ipAddress,
        },
        tx,
      );
    return { ok: true, name: owner.name };
  });
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

type TokenCheck =
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
  // A use changes no row of its own (`last used` above is throttled apart), so its row is written alone.
  recordAudit(
    {
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
    },
    getDb(),
  ).catch((error: unknown) =>
    console.warn("could not record token use", tokenId, error),
  );
}
