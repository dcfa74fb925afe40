/**
 * The browser's client of our own HTTP API (/api/v1), typed from the OpenAPI document: the request and
 * response types come from app/utils/api/openapi-types.ts, generated from the same zod schemas the server
 * validates with and the API page documents, so the three cannot drift. Same-origin, with the session cookie.
 */
import createClient from "openapi-fetch";
import type { components, paths } from "./openapi-types";

type Schemas = components["schemas"];
type LookupRequest = Schemas["LookupRequest"];
export type LookupResponse = Schemas["LookupResponse"];
export type LookupResult = Schemas["LookupResult"];
export type SampleDetail = Schemas["SampleDetail"];
export type SampleSummary = Schemas["SampleSummary"];
export type ApiGrid = Schemas["Grid"];
export type Problem = Schemas["Problem"];

const api = createClient<paths>({
  credentials: "same-origin",
  headers: { Accept: "application/json" },
});

/** The server's own computation time from its Server-Timing header (ms), NaN when absent. */
export function serverTimingMs(response: Response): number {
  const timing = response.headers.get("Server-Timing");
  return Number(/dur=([\d.]+)/.exec(timing ?? "")?.[1] ?? NaN);
}

/** POST /api/v1/samples/{sampleId}/lookup. */
export function postLookup(
  sampleId: number,
  body: LookupRequest,
  signal?: AbortSignal,
) {
  return api.POST("/api/v1/samples/{sampleId}/lookup", {
    params: { path: { sampleId: String(sampleId) } },
    body,
    signal,
  });
}

/** GET /api/v1/samples/{sampleId}: the measured grids of a revision in a unit system. */
export function getSampleDetail(
  sampleId: number,
  query: { units: "field" | "metric"; revision?: number },
  signal?: AbortSignal,
) {
  return api.GET("/api/v1/samples/{sampleId}", {
    params: {
      path: { sampleId: String(sampleId) },
      query: {
        units: query.units,
        revision:
          query.revision === undefined ? undefined : String(query.revision),
      },
    },
    signal,
  });
}
