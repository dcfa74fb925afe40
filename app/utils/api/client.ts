/**
 * The browser's client of our own HTTP API (/api/v1), typed from the OpenAPI document: the request and
 * response types come from app/utils/api/openapi-types.ts, generated from the same zod schemas the server
 * validates with and the API page documents, so the three cannot drift. Same-origin, with the session cookie.
 */
import createClient from "openapi-fetch";
import type { components, paths } from "./openapi-types";

type Schemas = components["schemas"];
type LookupRequest = Schemas["LookupRequest"];
export type LookupsResponse = Schemas["LookupsResponse"];
export type LookupBlock = Schemas["LookupBlock"];
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

/**
 * POST /api/v1/samples/{sampleId}/lookup of one property (`property`): one result per point, refused points in
 * place. `data` is absent when the request was refused whole (`error` holds the problem, if the body had one).
 */
export async function postLookup(
  sampleId: number,
  body: Omit<LookupRequest, "properties"> & {
    property: LookupBlock["property"];
  },
  signal?: AbortSignal,
) {
  const { data, error, response } = await api.POST(
    "/api/v1/samples/{sampleId}/lookup",
    { params: { path: { sampleId: String(sampleId) } }, body, signal },
  );
  // the browser asks for JSON (the columnar and CSV forms are for other clients)
  const block =
    typeof data === "object" && "results" in data ? data : undefined;
  return { data: block, error, response };
}

/**
 * The same endpoint with several properties (`properties`) in one request: one block per property, in the
 * order asked, each as postLookup's answer would give it.
 */
export async function postLookups(
  sampleId: number,
  body: Omit<LookupRequest, "property"> & {
    properties: LookupBlock["property"][];
  },
  signal?: AbortSignal,
) {
  const { data, error, response } = await api.POST(
    "/api/v1/samples/{sampleId}/lookup",
    { params: { path: { sampleId: String(sampleId) } }, body, signal },
  );
  const blocks =
    typeof data === "object" && "lookups" in data && !("format" in data)
      ? data
      : undefined;
  return { data: blocks, error, response };
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
