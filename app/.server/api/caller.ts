import type { RouterContextProvider } from "react-router";
import { callerContext } from "~/.server/auth/context";
import { getEnv } from "~/.server/env";
import { problem } from "~/.server/http";
import { apiAccess, type ApiOperation } from "~/utils/api-scopes";
import { can, type Role } from "~/utils/permissions";
import { noteCaller } from "~/.server/ops/request-store";
import type { OutputSystem } from "~/core/units";
import { RateLimiter } from "./rate-limit";
import { verifyApiToken, type TokenCaller } from "./tokens";

/** Who calls the API: a bearer token (scopes and restriction apply) or a signed-in browser (role applies). */
export type ApiCaller = {
  user: {
    id: number;
    email: string;
    name: string;
    role: Role;
    unitSystem: OutputSystem;
  };
  token: Omit<TokenCaller, "user"> | null;
};

let limiter: RateLimiter | undefined;

/**
 * Authenticates an API request and checks that the caller may perform `operation`, by the one table of scope
 * rules (app/utils/api-scopes.ts), on every request. Throws a problem-details Response: 401 (missing,
 * invalid, expired or revoked token), 403 `insufficient_scope` (the token lacks the scope), 403
 * `insufficient_role` (the token's owner's current role lacks the permission: a demotion binds existing
 * tokens at once), 403 `forbidden` (a signed-in person's role), 429 (over the token's budget).
 */
export async function requireApiCaller(
  {
    request,
    context,
  }: { request: Request; context: Readonly<RouterContextProvider> },
  operation: ApiOperation,
): Promise<ApiCaller> {
  const caller = context.get(callerContext);
  const authorization = request.headers.get("Authorization");
  if (authorization) {
    const match = /^Bearer\s+(\S+)$/i.exec(authorization);
    if (!match?.[1])
      throw problem(
        401,
        "invalid_token",
        "Send the token as `Authorization: Bearer <token>`.",
        { headers: { "WWW-Authenticate": 'Bearer realm="isopleth"' } },
      );
    const check = await verifyApiToken(match[1], caller.ipAddress);
    if (!check.ok)
      throw problem(401, "invalid_token", check.detail, {
        headers: {
          "WWW-Authenticate": 'Bearer realm="isopleth", error="invalid_token"',
        },
      });
    const { user, ...token } = check.caller;
    const access = apiAccess(token.scopes, user.role, operation);
    if (!access.ok) {
      // RFC 6750 §3.1: insufficient_scope, with the scope needed.
      throw access.reason === "scope"
        ? problem(403, "insufficient_scope", access.message, {
            headers: {
              "WWW-Authenticate":
                'Bearer realm="isopleth", error="insufficient_scope"',
            },
          })
        : problem(403, "insufficient_role", access.message);
    }
    limiter ??= new RateLimiter(getEnv().API_RATE_LIMIT_PER_MINUTE);
    const wait = limiter.take(token.tokenId);
    if (wait !== null) {
      throw problem(
        429,
        "rate_limited",
        `This token is over its budget of ${getEnv().API_RATE_LIMIT_PER_MINUTE} requests per minute; retry in ${wait} s.`,
        { headers: { "Retry-After": String(wait) } },
      );
    }
    noteCaller(`token:${token.tokenId}`);
    return { user, token };
  }
  if (!caller.user) {
    throw problem(
      401,
      "unauthenticated",
      "Send a bearer token, or sign in to Isopleth in this browser.",
      { headers: { "WWW-Authenticate": 'Bearer realm="isopleth"' } },
    );
  }
  const access = apiAccess(null, caller.user.role, operation);
  if (!access.ok)
    throw problem(
      403,
      "forbidden",
      operation === "export-table"
        ? "Your role may look at tables in the app but not export them."
        : access.message,
    );
  return { user: caller.user, token: null };
}

/** True when the caller may read draft (unapproved) revisions: a signed-in person whose role allows it, never a token. */
export function callerMayReadDrafts(caller: ApiCaller): boolean {
  return caller.token === null && can(caller.user, "read:draft-revisions");
}

/** True when the caller's token restriction (if any) lets it read this sample. */
export function callerMayReadSample(
  caller: ApiCaller,
  sample: { id: number; fieldId: number },
): boolean {
  const r = caller.token?.restriction;
  if (!r) return true;
  const byField = r.fieldIds?.includes(sample.fieldId) ?? false;
  const bySample = r.sampleIds?.includes(sample.id) ?? false;
  if (!r.fieldIds?.length && !r.sampleIds?.length) return true;
  return byField || bySample;
}
