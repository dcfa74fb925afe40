import type { RouterContextProvider } from "react-router";
import { callerContext } from "~/.server/auth/context";
import type { ApiScope } from "~/.server/db/schema";
import { getEnv } from "~/.server/env";
import { problem } from "~/.server/http";
import { can, type Role } from "~/utils/permissions";
import { RateLimiter } from "./rate-limit";
import { verifyApiToken, type TokenCaller } from "./tokens";

/** Who calls the API: a bearer token (scopes and restriction apply) or a signed-in browser (role applies). */
export type ApiCaller = {
  user: { id: number; email: string; name: string; role: Role; unitSystem: "field" | "metric" };
  token: Omit<TokenCaller, "user"> | null;
};

let limiter: RateLimiter | undefined;

/**
 * Authenticates an API request and checks the scope it needs. Throws a problem-details Response:
 * 401 (missing, invalid, expired or revoked token), 403 (scope or role), 429 (over the token's budget).
 * Scopes for tokens: `tables:read` for sample listings, grids and tables; `lookup` for lookups (and listings).
 * Browser sessions: every role may read and look up; tables (exports) need the engineer role or above.
 */
export async function requireApiCaller(
  { request, context }: { request: Request; context: Readonly<RouterContextProvider> },
  need: ApiScope | "read",
): Promise<ApiCaller> {
  const caller = context.get(callerContext);
  const authorization = request.headers.get("Authorization");
  if (authorization) {
    const match = /^Bearer\s+(\S+)$/i.exec(authorization);
    if (!match?.[1]) throw problem(401, "invalid_token", "Send the token as `Authorization: Bearer <token>`.", { headers: { "WWW-Authenticate": 'Bearer realm="isopleth"' } });
    const check = await verifyApiToken(match[1], caller.ipAddress);
    if (!check.ok) throw problem(401, "invalid_token", check.detail, { headers: { "WWW-Authenticate": 'Bearer realm="isopleth", error="invalid_token"' } });
    const { user, ...token } = check.caller;
    const allowed = need === "read" ? token.scopes.length > 0 : token.scopes.includes(need);
    if (!allowed) throw problem(403, "insufficient_scope", `This token lacks the \`${need}\` scope.`);
    limiter ??= new RateLimiter(getEnv().API_RATE_LIMIT_PER_MINUTE);
    const wait = limiter.take(token.tokenId);
    if (wait !== null) {
      throw problem(429, "rate_limited", `This token is over its budget of ${getEnv().API_RATE_LIMIT_PER_MINUTE} requests per minute; retry in ${wait} s.`, { headers: { "Retry-After": String(wait) } });
    }
    return { user, token };
  }
  if (!caller.user) {
    throw problem(401, "unauthenticated", "Send a bearer token, or sign in to Isopleth in this browser.", { headers: { "WWW-Authenticate": 'Bearer realm="isopleth"' } });
  }
  if (need === "tables:read" && !can(caller.user, "export:tables")) {
    throw problem(403, "forbidden", "Your role may look at tables in the app but not export them.");
  }
  return { user: caller.user, token: null };
}

/** True when the caller's token restriction (if any) lets it read this sample. */
export function callerMayReadSample(caller: ApiCaller, sample: { id: number; fieldId: number }): boolean {
  const r = caller.token?.restriction;
  if (!r) return true;
  const byField = r.fieldIds?.includes(sample.fieldId) ?? false;
  const bySample = r.sampleIds?.includes(sample.id) ?? false;
  if (!r.fieldIds?.length && !r.sampleIds?.length) return true;
  return byField || bySample;
}
