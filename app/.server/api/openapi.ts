import { OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import {
  API_SCOPE_RULES,
  apiScopeRule,
  type ApiOperation,
} from "~/utils/api-scopes";
import { MAX_JSON_DEPTH } from "./body";
import { MAX_QUERY_STRING_CHARS } from "./request";
import { LOOKUP_MEDIA_TYPES } from "./lookup";
import {
  LookupBody,
  LookupColumnsResponse,
  LookupResponse,
  LookupsColumnsResponse,
  LookupsResponse,
  ProblemSchema,
  registry,
  SampleDetailResponse,
  SampleIdParams,
  SampleListResponse,
  SampleListQuery,
  SampleQuery,
  TableQuery,
} from "./schemas";

/** Problem codes the API answers with, documented on the API page (anchors `#problem-<code>`). */
export const PROBLEM_CODES: Record<string, string> = {
  invalid_body: `400 — the JSON body does not match the schema, or nests deeper than ${MAX_JSON_DEPTH} levels, or (lookup) a point is not a point (not finite, an absolute pressure at or below zero, a temperature at or below absolute zero); \`issues\` lists each field path (points counted from 0, as JSON indices) and what is wrong, \`detail\` names the first in words.`,
  invalid_query: `400 — the query string is not valid: an unknown parameter, a parameter given twice, a value too long, or a number not written as a plain decimal (ids: digits only, so \`0x1\`, \`1e0\`, \`+1\`, \`01\` are refused); \`issues\` names each parameter. At most ${MAX_QUERY_STRING_CHARS} characters in all.`,
  invalid_path:
    "400 — a path parameter is not valid (the sample id is a whole number in decimal digits).",
  invalid_pressures:
    "400 — the pressure list is not a list `a,b,c` or a range `start:stop:step` of positive numbers.",
  unsupported_media_type: "415 — send the body as application/json.",
  unauthenticated: "401 — no bearer token and no signed-in session.",
  invalid_token:
    "401 — the token is missing, malformed, wrongly signed, expired, revoked, or its owner is disabled.",
  insufficient_scope:
    "403 — the token lacks the scope the endpoint needs (see the scope table in the description).",
  insufficient_role:
    "403 — the token has the scope, but its owner's current role does not allow the request (e.g. an owner who is now a viewer may not export tables). Checked on every request.",
  forbidden: "403 — the signed-in person's role does not allow this.",
  outside_restriction:
    "403 — the token is restricted to other fields or samples.",
  cross_origin:
    "403 — a browser request from another site tried to change data.",
  sample_not_found: "404 — there is no such sample.",
  revision_not_found:
    "404 — the sample has no revision with that number that the caller may read. A draft or rejected revision answers the same to a token or a role that may not read drafts (unreleased work is neither served nor revealed).",
  no_approved_revision: "404 — the sample has no approved revision yet.",
  property_not_measured:
    "404 — the revision has no grid for that property (a lookup of several properties names each one missing and computes nothing).",
  payload_too_large:
    "413 — the body is larger than the API accepts (8 MB, about 100,000 points).",
  out_of_range:
    "422 — (tables) the table's temperature or pressures lie outside the measured range and extrapolation was not allowed, or no valid data zone exists. Lookups never answer this: their points are refused one by one inside the 200 answer.",
  not_computable:
    "422 — a table with no row (or no bubble point) that can be computed: interpolation gives no finite value there. Lookup points are never refused this way: a point that cannot be served is refused in place inside the 200 answer (value null, `refused: { code, message }`).",
  internal_error:
    "500 — a fault of the server (logged); nothing computed wrongly is sent.",
  rate_limited:
    "429 — the token is over its request budget; wait the seconds given in Retry-After.",
  server_busy:
    "503 — the server is at its limit of large computations at once (big lookups, tables); wait the seconds given in Retry-After.",
};

const problemResponses = (codes: number[]) =>
  Object.fromEntries(
    codes.map((status) => [
      status,
      {
        description: `Problem details (${status})`,
        content: { "application/problem+json": { schema: ProblemSchema } },
      },
    ]),
  );

const bearer = registry.registerComponent("securitySchemes", "bearerToken", {
  type: "http",
  scheme: "bearer",
  bearerFormat: "JWT",
  description:
    "An API token created on the API tokens page. A signed-in browser session works too.",
});
const security = [{ [bearer.name]: [] }];

/** The scope rule of an operation, in words, for its description. */
function access(operation: ApiOperation): string {
  const rule = apiScopeRule(operation);
  return ` Token scope: ${rule.scopes.map((x) => `\`${x}\``).join(" or ")}; the owner's current role (or the signed-in person's role) needs \`${rule.permission}\`.`;
}

const STRICT =
  " Query strings are strict: unknown or repeated parameters and numbers not written as plain decimals are refused with 400 `invalid_query`.";

registry.registerPath({
  method: "get",
  path: "/api/v1/samples",
  summary: "Samples the caller may read",
  description:
    "Field, well, reservoir conditions, bubble point, current approved revision and the properties it has. ETag (hash of the body) and If-None-Match supported." +
    access("list-samples") +
    STRICT,
  security,
  request: { query: SampleListQuery },
  responses: {
    200: {
      description: "The samples.",
      content: { "application/json": { schema: SampleListResponse } },
    },
    ...problemResponses([400, 401, 403, 429]),
  },
});

registry.registerPath({
  method: "get",
  path: "/api/v1/samples/{sampleId}",
  summary: "A sample with the grids of one revision",
  description:
    "Metadata and measured grids of the current approved revision (or `revision`), converted to the unit system asked for. `revision.status` and `revision.approved` say whether it is approved (header Isopleth-Revision-Status too). ETag (hash of the body) and If-None-Match supported." +
    access("read-sample") +
    STRICT,
  security,
  request: { params: SampleIdParams, query: SampleQuery },
  responses: {
    200: {
      description: "The sample.",
      content: { "application/json": { schema: SampleDetailResponse } },
    },
    304: { description: "Not modified." },
    ...problemResponses([400, 401, 403, 404, 429]),
  },
});

registry.registerPath({
  method: "post",
  path: "/api/v1/samples/{sampleId}/lookup",
  summary: "Interpolate one or several properties at many conditions",
  description:
    "Up to 100,000 points per request. Give `property` for one property, or `properties` for several at the same points. " +
    "**Every point is answered or refused on its own**: the answer is 200 with one result per point, in the order sent; a point that cannot be served (outside the measured range without extrapolation, no measured values around it, extrapolated too far, a physically impossible value) comes back in its place with `value`, `errorEstimate`, `method` and `stencil` null and `refused: { code, message }` (see `Refused`); the block's `summary` counts them (`refusedCount`, `refusalCounts`). Only a malformed request is refused whole: 400 `invalid_body` (the schema not met, a point that is not finite, an absolute pressure at or below zero, a temperature at or below absolute zero; `issues` give the JSON path, counting points from 0), 404 (sample, revision or a property's grid missing: nothing is computed), 413, 415. Messages count points from 1 (`Point 3` is the third point sent). " +
    "Each result carries its error estimate (null where the table says nothing about the error: warning `estimate-unavailable`), warnings (computed on the server, including `near-bubble-point`), the method used and the data zone (stencil). " +
    "**Shapes.** With `property` the answer is `LookupResponse`: the request's facts (sample, revision, approval, method) and the property's block (property, methodDescription, degree, units, results, summary) at the top level. With `properties` it is `LookupsResponse`: the same facts and `lookups`, one block per property in the order asked, each block exactly what a one-property request answers. " +
    '**Large batches.** `format: "columns"` in the body, or `Accept: application/vnd.isopleth.columns+json`, answers arrays per field instead of an object per point (`LookupColumnsResponse` / `LookupsColumnsResponse`: `columns.value[i]`, `columns.errorEstimate[i]`, `columns.refused[i]` … for point i; no stencils); `Accept: text/csv` answers CSV (UTF-8 with a byte-order mark; `#` comment lines with the revision and the caution, an unapproved draft marked on the first line; a header row with units; per point its conditions as sent and per property value, error estimate, method, warnings and refusal). The Server-Timing header gives the server\'s time (`app` in all, `read`, `compute`, `write`). ' +
    "No NaN or Infinity is ever written. `revisionStatus` and `approved` say whether the revision used is approved; `revision` in the body names one (drafts only for signed-in people whose role may read them). ETag derived from the revision, the request and the form. No query parameters." +
    access("lookup"),
  security,
  request: {
    params: SampleIdParams,
    body: { content: { "application/json": { schema: LookupBody } } },
  },
  responses: {
    200: {
      description:
        "One result per point, in order, refused points in place: one block (`property`) or one block per property (`properties`).",
      content: {
        "application/json": {
          schema: z.union([LookupResponse, LookupsResponse]),
        },
        [LOOKUP_MEDIA_TYPES.columns]: {
          schema: z.union([LookupColumnsResponse, LookupsColumnsResponse]),
        },
        [LOOKUP_MEDIA_TYPES.csv]: {
          schema: z.string().openapi({
            description: "CSV: comment lines, a header row, one row per point.",
          }),
        },
      },
    },
    ...problemResponses([400, 401, 403, 404, 413, 415, 429, 503]),
  },
});

registry.registerPath({
  method: "get",
  path: "/api/v1/samples/{sampleId}/table",
  summary: "A black-oil table at one temperature, resampled on given pressures",
  description:
    "Pressure, Rs, Bo, oil viscosity (and Bg, gas viscosity, Z where measured); the bubble point is a row of its own; pressure strictly increasing, Rs non-decreasing, Bo decreasing above the bubble point; values corrected to keep that order are flagged. Formats: json, csv, text (comment lines starting with #, then whitespace-separated columns), xlsx (a spreadsheet download: headers in words with units, error estimates to two significant digits, the notes and the caution above the header). " +
    "Every parameter may be left out: `GET …/table?format=text` gives the table at the sample's reservoir temperature on the measured pressures of its grids (those every grid covers unless extrapolate=true) plus the bubble point. A refusal names the parameter at fault in plain words (`detail` starts with it, `issues[].path` holds it), e.g. a sample without a reservoir temperature and no `temperature` given. " +
    "A row that cannot be computed (interpolation gives no finite value, e.g. far beyond the data with extrapolation allowed) is left out, and a note `rows-not-computable` names its pressure (JSON `notes`, a `# note:` line in text and at the top of CSV); if no row can be computed the answer is 422 `not_computable`. No NaN or Infinity is ever written. " +
    "An unapproved revision (asked for by a signed-in engineer, lab lead or administrator) is marked: JSON `revisionStatus`, `approved: false` and `draftWarning`; CSV and text start with a line `# UNAPPROVED DRAFT: …`; header Isopleth-Revision-Status. " +
    "ETag: weak, derived from the revision and its status, the normalised query (pressures as parsed, defaults filled in), the format and the units — not from the bytes, which name their generation time — so repeating a request with If-None-Match answers 304 without building the table." +
    access("export-table") +
    STRICT,
  security,
  request: { params: SampleIdParams, query: TableQuery },
  responses: {
    200: {
      description: "The table.",
      content: {
        "application/json": { schema: z.object({}).passthrough() },
        "text/csv": { schema: z.string() },
        "text/plain": { schema: z.string() },
        "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet": {
          schema: z.string().openapi({ format: "binary" }),
        },
      },
    },
    304: { description: "Not modified." },
    ...problemResponses([400, 401, 403, 404, 422, 429]),
  },
});

/** How numbers are expressed: unit systems, standard conditions, gauge pressures. */
const UNITS_AND_BASES =
  "\n\nUnits and bases: `units=field` answers in psia, °F, rb/STB, scf/STB, ft³/scf, cP, lb/ft³ with gas volumes at 60 °F and 14.696 psia; `units=metric` in bara, °C, rm³/sm³, sm³/sm³, mPa·s, kg/m³ at 15 °C and 101.325 kPa. Rs and Bg are stored on the laboratory report's own standard conditions (recorded with the sample) and rebased to those of the output as an ideal gas (V ∝ T/p at standard conditions); the stock-tank oil volume is not rebased (the difference between 60 °F and 15 °C stock-tank oil is neglected, as is usual). A lookup's `units` and a table name both bases (`standardConditions`, `reportStandardConditions`). Pressures are absolute unless `pressureBasis=gauge` (psig in field, barg in metric units), made absolute with the sample's recorded barometric pressure (`barometricPressurePsia`, default 14.696 psia).";

let cached: object | undefined;

export function openApiDocument(serverUrl: string): object {
  cached ??= new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Isopleth API",
      version: "1.0.0",
      description:
        "Scopes of API tokens (a token's authority is its scopes AND its owner's current role, checked on every request):\n\n" +
        API_SCOPE_RULES.map(
          (r) =>
            `- ${r.method} ${r.path}: scope ${r.scopes.join(" or ")}; role permission ${r.permission}. ${r.description}`,
        ).join("\n") +
        UNITS_AND_BASES +
        "\n\nTokens read approved revisions only; a draft asked for with a token answers 404 `revision_not_found`, the same as a revision that does not exist, so a token learns nothing about unreleased work. Problem details never quote more than a short piece of the request.\n\n" +
        "Approved reservoir fluid-property tables and interpolation for simulators and scripts. Interpolated and extrapolated values are estimates: check them against the laboratory report, and follow local regulations and licensed engineering practice for well control, facility design and reserves.",
    },
    servers: [{ url: serverUrl }],
  });
  return cached;
}
