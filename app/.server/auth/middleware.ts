import type { MiddlewareFunction } from "react-router";
import { getEnv } from "~/.server/env";
import { apiError, isApiPath } from "~/.server/http";
import { noteCaller } from "~/.server/ops/request-store";
import { clientAddress } from "./client-address";
import { callerContext } from "./context";
import {
  clearSessionCookie,
  readSessionToken,
  validateSessionToken,
} from "./session";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Mutating requests are accepted only from our own origin (Origin, else Referer), on top of SameSite cookies.
 * A request that carries a bearer token and no cookie cannot be forged by a browser, so it is exempt.
 */
export const originGuard: MiddlewareFunction<Response> = async (
  { request },
  next,
) => {
  if (SAFE_METHODS.has(request.method)) return next();
  const bearerOnly =
    /^Bearer\s/i.test(request.headers.get("Authorization") ?? "") &&
    !request.headers.get("Cookie");
  if (bearerOnly) return next();
  const allowed = new Set([
    new URL(request.url).origin,
    new URL(getEnv().APP_BASE_URL).origin,
  ]);
  const origin =
    request.headers.get("Origin") ??
    refererOrigin(request.headers.get("Referer"));
  if (origin && allowed.has(origin)) return next();
  const message =
    "This request did not come from an Isopleth page, so it was refused (cross-origin requests may not change data).";
  if (isApiPath(request)) return apiError(403, "cross_origin", message);
  return new Response(message, {
    status: 403,
    headers: { "Content-Type": "text/plain; charset=utf-8" },
  });
};

function refererOrigin(referer: string | null): string | null {
  if (!referer) return null;
  try {
    return new URL(referer).origin;
  } catch {
    return null;
  }
}

/** Reads the session cookie once per request, puts the caller in context, renews or clears the cookie. */
export const sessionMiddleware: MiddlewareFunction<Response> = async (
  { request, context },
  next,
) => {
  const ipAddress = clientAddress(request);
  const token = await readSessionToken(request);
  const session = token ? await validateSessionToken(token) : null;
  context.set(callerContext, {
    user: session?.user ?? null,
    sessionId: session?.sessionId ?? null,
    ipAddress,
  });
  if (session?.user) noteCaller(`user:${session.user.id}`);
  const response = await next();
  let setCookie: string | null = null;
  if (session?.renewedCookie) setCookie = session.renewedCookie;
  else if (token && !session) setCookie = await clearSessionCookie();
  if (setCookie && !response.headers.has("Set-Cookie")) {
    try {
      response.headers.append("Set-Cookie", setCookie);
    } catch {
      // Immutable headers (e.g. a fetched response passed through): skip the renewal this time.
    }
  }
  return response;
};
