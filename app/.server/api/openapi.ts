import { OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import {
  LookupBody,
  LookupResponse,
  ProblemSchema,
  registry,
  SampleDetailResponse,
  SampleIdParams,
  SampleListResponse,
  SampleQuery,
  TableQuery,
  UnitsParam,
} from "./schemas";

/** Problem codes the API answers with, documented on the API page (anchors `#problem-<code>`). */
export const PROBLEM_CODES: Record<string, string> = {
  invalid_body: "400 — the JSON body does not match the schema; `issues` lists each field path and what is wrong.",
  invalid_query: "400 — a query-string parameter is not valid; `issues` says which.",
  invalid_path: "400 — a path parameter is not valid.",
  invalid_pressures: "400 — the pressure list is not a list `a,b,c` or a range `start:stop:step` of positive numbers.",
  unsupported_media_type: "415 — send the body as application/json.",
  unauthenticated: "401 — no bearer token and no signed-in session.",
  invalid_token: "401 — the token is missing, malformed, wrongly signed, expired, revoked, or its owner is disabled.",
  insufficient_scope: "403 — the token lacks the scope the endpoint needs (tables:read or lookup).",
  forbidden: "403 — the signed-in person's role does not allow this.",
  outside_restriction: "403 — the token is restricted to other fields or samples.",
  cross_origin: "403 — a browser request from another site tried to change data.",
  sample_not_found: "404 — there is no such sample.",
  revision_not_found: "404 — the sample has no revision with that number.",
  no_approved_revision: "404 — the sample has no approved revision yet.",
  property_not_measured: "404 — the revision has no grid for that property.",
  payload_too_large: "413 — the body is larger than the API accepts (8 MB, about 100,000 points).",
  out_of_range: "422 — a point lies outside the measured range and extrapolation was not allowed, or no valid data zone exists.",
  rate_limited: "429 — the token is over its request budget; wait the seconds given in Retry-After.",
  server_busy: "503 — the server is at its limit of large computations at once (big lookups, tables); wait the seconds given in Retry-After.",
};

const problemResponses = (codes: number[]) =>
  Object.fromEntries(
    codes.map((status) => [
      status,
      { description: `Problem details (${status})`, content: { "application/problem+json": { schema: ProblemSchema } } },
    ]),
  );

const bearer = registry.registerComponent("securitySchemes", "bearerToken", {
  type: "http",
  scheme: "bearer",
  bearerFormat: "JWT",
  description: "An API token created on the API tokens page. A signed-in browser session works too.",
});
const security = [{ [bearer.name]: [] }];

registry.registerPath({
  method: "get",
  path: "/api/v1/samples",
  summary: "Samples the caller may read",
  description: "Field, well, reservoir conditions, bubble point, current approved revision and the properties it has.",
  security,
  request: { query: z.object({ units: UnitsParam }) },
  responses: { 200: { description: "The samples.", content: { "application/json": { schema: SampleListResponse } } }, ...problemResponses([400, 401, 403, 429]) },
});

registry.registerPath({
  method: "get",
  path: "/api/v1/samples/{sampleId}",
  summary: "A sample with the grids of one revision",
  description: "Metadata and measured grids of the current approved revision (or `revision`), converted to the unit system asked for. ETag and If-None-Match supported.",
  security,
  request: { params: SampleIdParams, query: SampleQuery },
  responses: { 200: { description: "The sample.", content: { "application/json": { schema: SampleDetailResponse } } }, 304: { description: "Not modified." }, ...problemResponses([400, 401, 403, 404, 429]) },
});

registry.registerPath({
  method: "post",
  path: "/api/v1/samples/{sampleId}/lookup",
  summary: "Interpolate a property at many conditions",
  description: "Up to 100,000 points per request. Each result carries its error estimate, warnings, the method used and the data zone (stencil). Needs the `lookup` scope.",
  security,
  request: { params: SampleIdParams, body: { content: { "application/json": { schema: LookupBody } } } },
  responses: { 200: { description: "One result per point, in order.", content: { "application/json": { schema: LookupResponse } } }, ...problemResponses([400, 401, 403, 404, 413, 415, 422, 429]) },
});

registry.registerPath({
  method: "get",
  path: "/api/v1/samples/{sampleId}/table",
  summary: "A black-oil table at one temperature, resampled on given pressures",
  description:
    "Pressure, Rs, Bo, oil viscosity (and Bg, gas viscosity, Z where measured); the bubble point is a row of its own; pressure strictly increasing, Rs non-decreasing, Bo decreasing above the bubble point; values corrected to keep that order are flagged. Formats: json, csv, text (comment lines starting with #, then whitespace-separated columns). Needs the `tables:read` scope.",
  security,
  request: { params: SampleIdParams, query: TableQuery },
  responses: {
    200: { description: "The table.", content: { "application/json": { schema: z.object({}).passthrough() }, "text/csv": { schema: z.string() }, "text/plain": { schema: z.string() } } },
    304: { description: "Not modified." },
    ...problemResponses([400, 401, 403, 404, 422, 429]),
  },
});

let cached: object | undefined;

export function openApiDocument(serverUrl: string): object {
  cached ??= new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Isopleth API",
      version: "1.0.0",
      description:
        "Approved reservoir fluid-property tables and interpolation for simulators and scripts. Interpolated and extrapolated values are estimates: check them against the laboratory report, and follow local regulations and licensed engineering practice for well control, facility design and reserves.",
    },
    servers: [{ url: serverUrl }],
  });
  return cached;
}
