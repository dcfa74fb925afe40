import { data } from "react-router";

/** The one error shape of every API route: `{ error: { code, message, issues? } }`. */
export function apiError(status: number, code: string, message: string, issues?: unknown): Response {
  return Response.json(
    { error: issues === undefined ? { code, message } : { code, message, issues } },
    { status, headers: { "Cache-Control": "no-store" } },
  );
}

export function isApiPath(request: Request): boolean {
  return new URL(request.url).pathname.startsWith("/api/");
}

/** Throws a 404 for a missing record (pages) — expected failures are responses, not exceptions. */
export function invariantResponse(condition: unknown, message: string, status = 404): asserts condition {
  if (!condition) throw data(message, { status });
}
