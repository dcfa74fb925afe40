import { createHash } from "node:crypto";
import { isLookupError, runLookup, type LookupResult } from "~/core/lookup";
import { problem } from "~/.server/http";
import type { RevisionData } from "~/.server/samples/revision-data";
import { BUILD_ID, finiteJson, refuseNonFinite } from "./respond";
import { isApprovedStatus } from "./samples";
import type { LookupBody } from "./schemas";

/**
 * A point whose value cannot be computed (the engine gave NaN or ±Infinity, e.g. far beyond the measured
 * range with extrapolation allowed) is refused on its own: value and errorEstimate null and this refusal;
 * the other points of the request are served as usual.
 */
export const NOT_COMPUTABLE_REFUSAL = {
  code: "not_computable",
  message:
    "The value at this point cannot be computed: the interpolation did not give a finite number (the point lies too far outside the measured data). Choose a point nearer the measured range.",
} as const;
const REFUSAL_JSON = JSON.stringify(NOT_COMPUTABLE_REFUSAL);

/** Runs a validated lookup against a revision and shapes the API response (or a problem). */
export function computeLookup(data: RevisionData, body: LookupBody): LookupResult | Response {
  const grid = data.grids[body.property];
  if (!grid) return problem(404, "property_not_measured", `Revision ${data.number} has no ${body.property} grid.`);
  try {
    return runLookup(grid, body.points, {
      property: body.property,
      method: body.method,
      degree: body.degree,
      extrapolate: body.extrapolate,
      units: body.units,
      messages: false,
    });
  } catch (error) {
    if (isLookupError(error)) {
      const status = error.code === "OUT_OF_RANGE" || error.code === "NO_VALID_ZONE" ? 422 : error.code === "INVALID_GRID" ? 500 : 400;
      const code = status === 422 ? "out_of_range" : status === 500 ? "internal_error" : "invalid_body";
      const index = typeof error.details.pointIndex === "number" ? error.details.pointIndex : undefined;
      return problem(status, code, error.message, index === undefined ? undefined : { issues: [{ path: ["points", index], message: error.message }] });
    }
    throw error;
  }
}

/*
 * The results are written by hand rather than through JSON.stringify of one object per point: stencils and
 * warning lists are shared between points (the engine reuses them), so each is serialised once. For 10,000
 * points this is several times faster than building and stringifying 10,000 objects.
 */
const stencilJson = new WeakMap<object, string>();
const warningsJson = new WeakMap<object, string>();

function serialiseResults(results: LookupResult["results"]): string {
  const parts: string[] = new Array(results.length);
  for (let i = 0; i < results.length; i++) {
    const r = results[i]!;
    let stencil = stencilJson.get(r.stencil);
    if (stencil === undefined) {
      stencil = finiteJson({ pressure: r.stencil.pressures, temperature: r.stencil.temperatures });
      stencilJson.set(r.stencil, stencil);
    }
    let warnings = warningsJson.get(r.warnings);
    if (warnings === undefined) {
      warnings = JSON.stringify(r.warnings);
      warningsJson.set(r.warnings, warnings);
    }
    const bubble = r.bubblePointPressure !== null && Number.isFinite(r.bubblePointPressure) ? `,"bubblePointPressure":${r.bubblePointPressure}` : "";
    const branch = r.branch ? `,"branch":"${r.branch}"` : "";
    parts[i] =
      Number.isFinite(r.value) && Number.isFinite(r.errorEstimate)
        ? `{"value":${r.value},"errorEstimate":${r.errorEstimate},"warnings":${warnings},"method":"${r.method}","stencil":${stencil}${branch}${bubble}}`
        : `{"value":null,"errorEstimate":null,"refusal":${REFUSAL_JSON},"warnings":${warnings},"method":"${r.method}","stencil":${stencil}${branch}${bubble}}`;
  }
  return `[${parts.join(",")}]`;
}

/**
 * `startedAt` (performance.now() when the request arrived) gives the Server-Timing header. The ETag of a lookup
 * is derived from what determines its answer — the revision, the validated request and the build — so the 
 * multi-megabyte body need not be hashed.
 */
export function lookupResponse(
  request: Request,
  sampleId: number,
  data: RevisionData,
  body: LookupBody,
  startedAt = performance.now(),
  readMs = 0,
  bodyText?: string,
): Response {
  const computeStarted = performance.now();
  const result = computeLookup(data, body);
  const computeMs = performance.now() - computeStarted;
  if (result instanceof Response) return result;
  const writeStarted = performance.now();
  let head: string;
  let results: string;
  try {
    head = finiteJson({
      sampleId,
      revision: data.number,
      revisionStatus: data.status,
      approved: isApprovedStatus(data.status),
      property: body.property,
      method: body.method,
      methodDescription: result.methodDescription,
      degree: result.degree,
      units: {
        system: body.units,
        pressure: result.units.pressure.symbol,
        temperature: result.units.temperature.symbol,
        value: result.units.value.symbol,
      },
    });
    results = serialiseResults(result.results);
  } catch (error) {
    return refuseNonFinite(error);
  }
  const payload = `${head.slice(0, -1)},"results":${results}}`;
  const writeMs = performance.now() - writeStarted;
  const etagStarted = performance.now();
  const etag = `"${createHash("sha1").update(`${BUILD_ID}|${data.revisionId}|${data.status}|`).update(bodyText ?? JSON.stringify(body)).digest("base64url")}"`;
  const etagMs = performance.now() - etagStarted;
  return new Response(payload, {
    status: 200,
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      ETag: etag,
      "Cache-Control": "private, no-cache",
      "Isopleth-Revision": String(data.number),
      "Isopleth-Revision-Status": data.status,
      // app = the whole request in the server; read = body read and JSON parse; compute = interpolation.
      "Server-Timing": `app;dur=${(performance.now() - startedAt).toFixed(1)}, read;dur=${readMs.toFixed(1)}, compute;dur=${computeMs.toFixed(1)}, write;dur=${writeMs.toFixed(1)}, etag;dur=${etagMs.toFixed(1)}`,
    },
  });
}
