import { createHash } from "node:crypto";
import { statSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { getEnv } from "~/.server/env";
import { problem } from "~/.server/http";

/*
 * JSON has no NaN or Infinity (RFC 8259 §6): JSON.stringify quietly writes them as null, and a hand-written
 * body would write invalid JSON. Every API body goes through finiteJson(), which throws on a non-finite
 * number; respondJson() turns that into a loud failure in development and tests (the error is thrown) and,
 * in production, a 500 problem instead of a body with a number nobody computed. Values that legitimately
 * cannot be computed are refused earlier, point by point (lookups) or row by row (tables).
 */
export class NonFiniteNumberError extends Error {
  constructor(
    readonly key: string,
    readonly value: number,
  ) {
    super(
      `A non-finite number (${value}) was about to be written to JSON at "${key}".`,
    );
    this.name = "NonFiniteNumberError";
  }
}

/** JSON.stringify that refuses NaN and ±Infinity (throws NonFiniteNumberError naming the member). */
export function finiteJson(value: unknown): string {
  return JSON.stringify(value, (key, v: unknown) => {
    if (typeof v === "number" && !Number.isFinite(v))
      throw new NonFiniteNumberError(key, v);
    return v;
  });
}

/** Development and tests: rethrow (fail loudly). Production: log and answer a 500 problem. */
export function refuseNonFinite(
  error: unknown,
  mode: "throw" | "refuse" = getEnv().NODE_ENV === "production"
    ? "refuse"
    : "throw",
): Response {
  if (!(error instanceof NonFiniteNumberError) || mode === "throw") throw error;
  console.error(error.message);
  return problem(
    500,
    "internal_error",
    "The server computed a number it cannot write (not finite); nothing was sent. This is a fault of the server and has been logged.",
  );
}

// The time the server bundle was built (its file's mtime): the same in every process running one build, and
// different after any rebuild, so an ETag never outlives the code that computed the answer.
export const BUILD_ID = (() => {
  try {
    return String(statSync(fileURLToPath(import.meta.url)).mtimeMs);
  } catch {
    return String(Date.now());
  }
})();

/**
 * A strong ETag (RFC 9110 §8.8.3) derived from what determines a response — e.g. the revision, its status,
 * the normalised query, the format and units — rather than from its bytes, so a body that names its
 * generation time still gets the same tag, and a conditional request can be answered before any work.
 */
export function etagOf(
  ...parts: (string | number | null | undefined)[]
): string {
  const hash = createHash("sha256").update(BUILD_ID);
  for (const p of parts) hash.update(`|${p ?? ""}`);
  return `"${hash.digest("base64url").slice(0, 32)}"`;
}

type Init = {
  contentType: string;
  revision?: { number: number; status: string } | number | null;
  headers?: HeadersInit;
  status?: number;
  etag?: string;
};

function baseHeaders(
  etag: string,
  init: Pick<Init, "revision" | "headers">,
): Headers {
  const headers = new Headers(init.headers);
  headers.set("ETag", etag);
  headers.set("Cache-Control", "private, no-cache");
  headers.set("Vary", "Authorization, Cookie");
  const r = init.revision;
  if (typeof r === "number") headers.set("Isopleth-Revision", String(r));
  else if (r) {
    headers.set("Isopleth-Revision", String(r.number));
    headers.set("Isopleth-Revision-Status", r.status);
  }
  return headers;
}

/**
 * RFC 9110 §13.1.2: a GET or HEAD whose If-None-Match lists `etag` (or *) is answered 304 with no body.
 * If-None-Match uses the weak comparison (§8.8.3.2), so W/ is ignored on both sides.
 */
export function notModified(
  request: Request,
  etag: string,
  init: Pick<Init, "revision" | "headers"> = {},
): Response | null {
  const ifNoneMatch = request.headers.get("If-None-Match");
  if (!ifNoneMatch || (request.method !== "GET" && request.method !== "HEAD"))
    return null;
  const tags = ifNoneMatch.split(",").map((t) => t.trim().replace(/^W\//, ""));
  const opaque = etag.replace(/^W\//, "");
  if (!tags.includes(opaque) && !tags.includes("*")) return null;
  return new Response(null, { status: 304, headers: baseHeaders(etag, init) });
}

/**
 * A response with a strong ETag (given, or computed from its bytes); a conditional GET that matches gets 304
 * with no body. `revision` names the sample revision the body came from (headers Isopleth-Revision and
 * Isopleth-Revision-Status, for CSV and text too).
 */
export function respondWithEtag(
  request: Request,
  body: string,
  init: Init,
): Response {
  const etag =
    init.etag ??
    `"${createHash("sha256").update(body).digest("base64url").slice(0, 32)}"`;
  const unchanged = notModified(request, etag, init);
  if (unchanged) return unchanged;
  const headers = baseHeaders(etag, init);
  headers.set("Content-Type", init.contentType);
  return new Response(body, { status: init.status ?? 200, headers });
}

/** A JSON body (never with a non-finite number; see finiteJson) with an ETag. */
export function json(
  request: Request,
  value: unknown,
  revision?: Init["revision"],
  etag?: string,
): Response {
  let body: string;
  try {
    body = finiteJson(value);
  } catch (error) {
    return refuseNonFinite(error);
  }
  return respondWithEtag(request, body, {
    contentType: "application/json; charset=utf-8",
    revision,
    etag,
  });
}
