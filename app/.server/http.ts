import { data } from "react-router";

/**
 * Errors of the JSON API are problem details (RFC 9457, `application/problem+json`): type, title, status,
 * detail, plus our machine-readable `code` and, for invalid input, the zod `issues` with field paths.
 */
type Problem = {
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

/** A piece of the caller's input, cut to at most `max` characters for quoting in a message. */
export function clipInput(text: string, max = 60): string {
  return text.length <= max
    ? text
    : `${text.slice(0, Math.max(0, max - 20))}… (${text.length} characters)`;
}

/*
 * Problem bodies never reflect much of the request (OWASP Input Validation and Error Handling cheat sheets):
 * whatever a message quotes is cut here as a last line of defence — quoted runs to 60 characters, a detail to
 * 600, an issue message to 200, a path segment to 40, and at most 20 issues.
 */
const MAX_DETAIL_CHARS = 600;
const MAX_ISSUE_CHARS = 200;
const MAX_ISSUES = 20;

function clipQuoted(text: string): string {
  return text.replace(
    /"([^"]{61,})"/g,
    (_, inner: string) => `"${clipInput(inner)}"`,
  );
}

function clipMessage(text: string, max: number): string {
  const quoted = clipQuoted(text);
  return quoted.length <= max ? quoted : `${quoted.slice(0, max - 1)}…`;
}

export function problem(
  status: number,
  code: string,
  detail: string,
  extra?: { issues?: Problem["issues"]; headers?: HeadersInit },
): Response {
  const issues = extra?.issues?.slice(0, MAX_ISSUES).map((i) => ({
    path: i.path
      .slice(0, 8)
      .map((p) => (typeof p === "string" ? clipInput(p, 40) : p)),
    message: clipMessage(i.message, MAX_ISSUE_CHARS),
  }));
  const body: Problem = {
    type: `/api-docs#problem-${code}`,
    title: TITLES[status] ?? "Error",
    status,
    detail: clipMessage(detail, MAX_DETAIL_CHARS),
    code,
    ...(issues ? { issues } : {}),
  };
  const headers = new Headers(extra?.headers);
  headers.set("Content-Type", "application/problem+json; charset=utf-8");
  headers.set("Cache-Control", "no-store");
  return new Response(JSON.stringify(body), { status, headers });
}

/** Kept for API routes outside /api/v1 and guards: the same problem-details shape. */
export function apiError(
  status: number,
  code: string,
  message: string,
  issues?: Problem["issues"],
): Response {
  return problem(status, code, message, { issues });
}

export function isApiPath(request: Request): boolean {
  return new URL(request.url).pathname.startsWith("/api/");
}

/** Throws a 404 for a missing record (pages) — expected failures are responses, not exceptions. */
export function invariantResponse(
  condition: unknown,
  message: string,
  status = 404,
): asserts condition {
  if (!condition) throw data(message, { status });
}
