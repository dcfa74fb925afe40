import { data } from "react-router";

/**
 * Errors of the JSON API are problem details (RFC 9457, `application/problem+json`): type, title, status,
 * detail, plus our machine-readable `code` and, for invalid input, the zod `issues` with field paths.
 */
export type Problem = {
  type: string;
  title: string;
  status: number;
  detail: string;
  code: string;
  issues?: { path: (string | number)[]; message: string }[];
};

const TITLES: Record<number, string> = {
  400: "Invalid request",
  401: "Not authenticated",
  403: "Not allowed",
  404: "Not found",
  405: "Method not allowed",
  409: "Conflict",
  413: "Request too large",
  415: "Unsupported media type",
  422: "Cannot compute",
  429: "Too many requests",
  500: "Internal error",
  503: "Unavailable",
};

export function problem(
  status: number,
  code: string,
  detail: string,
  extra?: { issues?: Problem["issues"]; headers?: HeadersInit },
): Response {
  const body: Problem = {
    type: `/api-docs#problem-${code}`,
    title: TITLES[status] ?? "Error",
    status,
    detail,
    code,
    ...(extra?.issues ? { issues: extra.issues } : {}),
  };
  const headers = new Headers(extra?.headers);
  headers.set("Content-Type", "application/problem+json; charset=utf-8");
  headers.set("Cache-Control", "no-store");
  return new Response(JSON.stringify(body), { status, headers });
}

/** Kept for API routes outside /api/v1 and guards: the same problem-details shape. */
export function apiError(status: number, code: string, message: string, issues?: Problem["issues"]): Response {
  return problem(status, code, message, { issues });
}

export function isApiPath(request: Request): boolean {
  return new URL(request.url).pathname.startsWith("/api/");
}

/** Throws a 404 for a missing record (pages) — expected failures are responses, not exceptions. */
export function invariantResponse(condition: unknown, message: string, status = 404): asserts condition {
  if (!condition) throw data(message, { status });
}
