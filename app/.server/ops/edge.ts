import type { MiddlewareFunction } from "react-router";
import { isDatabaseUnavailable } from "~/.server/db/client";
import { isApiPath, problem } from "~/.server/http";
import { currentRequest } from "./request-store";

/** Seconds a client is asked to wait when the database is unavailable. */
const DATABASE_RETRY_AFTER_S = 5;

const CODES: Record<number, string> = {
  400: "bad_request",
  401: "unauthenticated",
  403: "forbidden",
  404: "not_found",
  405: "method_not_allowed",
  413: "too_large",
  415: "unsupported_media_type",
  422: "cannot_compute",
  500: "internal_error",
  503: "unavailable",
};

const DETAILS: Record<number, string> = {
  404: "There is no such API resource. See /api/v1/openapi.json.",
  405: "This method is not allowed on this API resource. See /api/v1/openapi.json for the methods each path takes.",
  500: "The server failed to answer this request. It has been logged; try again, or report the time of the request.",
};

/**
 * The outermost middleware of every route (pages and API):
 * - a request that met an unreachable or frozen database is answered 503 with Retry-After — problem details on
 *   the API, a plain "database unavailable" page for people — instead of a 500;
 * - every API answer of 400 or more is problem details, whatever produced it (the router's own 404/405 are
 *   text otherwise).
 */
export const edgeMiddleware: MiddlewareFunction<Response> = async (
  { request },
  next,
) => {
  let response: Response;
  try {
    response = await next();
  } catch (error) {
    if (error instanceof Response) response = error;
    else if (
      isDatabaseUnavailable(error) ||
      currentRequest()?.databaseUnavailable
    )
      return databaseUnavailable(request);
    else throw error;
  }
  if (response.status >= 500 && currentRequest()?.databaseUnavailable)
    return databaseUnavailable(request);
  if (response.status >= 400 && isApiPath(request) && !isProblem(response)) {
    const status = response.status;
    const headers = new Headers();
    const allow = response.headers.get("Allow");
    if (allow) headers.set("Allow", allow);
    return problem(
      status,
      CODES[status] ?? "error",
      DETAILS[status] ?? `The request was answered ${status}.`,
      { headers },
    );
  }
  return response;
};

function isProblem(response: Response): boolean {
  return (response.headers.get("Content-Type") ?? "").startsWith(
    "application/problem+json",
  );
}

function databaseUnavailable(request: Request): Response {
  const headers = { "Retry-After": String(DATABASE_RETRY_AFTER_S) };
  if (isApiPath(request)) {
    return problem(
      503,
      "database_unavailable",
      "The database is not answering at the moment; retry in a few seconds.",
      { headers },
    );
  }
  const html = `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Database unavailable — Isopleth</title></head>
<body style="font-family: system-ui, sans-serif; max-width: 40rem; margin: 3rem auto; padding: 0 1.5rem; color: #1f2933">
<h1 style="font-size: 1.5rem">Database unavailable</h1>
<p>Isopleth cannot reach its database at the moment, so this page cannot be shown. Nothing you sent was stored.
Try again in a few seconds; if it persists, tell the administrator of this installation.</p>
<p><a href="/">Back to Isopleth</a></p></body></html>`;
  return new Response(html, {
    status: 503,
    headers: {
      ...headers,
      "Content-Type": "text/html; charset=utf-8",
      "Cache-Control": "no-store",
    },
  });
}
