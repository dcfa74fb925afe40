import { createHash } from "node:crypto";

/**
 * A response with a strong ETag computed from its bytes; a conditional GET (If-None-Match) that matches gets
 * 304 with no body. `revision` names the sample revision the body came from (also a header, for CSV and text).
 */
export function respondWithEtag(
  request: Request,
  body: string,
  init: { contentType: string; revision?: number | null; headers?: HeadersInit; status?: number },
): Response {
  const etag = `"${createHash("sha256").update(body).digest("base64url").slice(0, 32)}"`;
  const headers = new Headers(init.headers);
  headers.set("ETag", etag);
  headers.set("Cache-Control", "private, no-cache");
  headers.set("Vary", "Authorization, Cookie");
  if (init.revision !== undefined && init.revision !== null) headers.set("Isopleth-Revision", String(init.revision));
  const ifNoneMatch = request.headers.get("If-None-Match");
  if (ifNoneMatch && (request.method === "GET" || request.method === "HEAD")) {
    const tags = ifNoneMatch.split(",").map((t) => t.trim().replace(/^W\//, ""));
    if (tags.includes(etag) || tags.includes("*")) return new Response(null, { status: 304, headers });
  }
  headers.set("Content-Type", init.contentType);
  return new Response(body, { status: init.status ?? 200, headers });
}

export function json(request: Request, value: unknown, revision?: number | null): Response {
  return respondWithEtag(request, JSON.stringify(value), { contentType: "application/json; charset=utf-8", revision });
}
