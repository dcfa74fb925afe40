import { createHash } from "node:crypto";
import { isLookupError, type LookupError } from "~/core/lookup";
import { problem } from "~/.server/http";
import { lookupPointsServed } from "~/.server/ops/metrics";
import {
  runHeavyTimed,
  type HeavyRun,
  type HeavySurface,
} from "~/.server/workers/pool";
import type { RevisionData } from "~/.server/samples/revision-data";
import { BUILD_ID, finiteJson, refuseNonFinite } from "./respond";
import { isApprovedStatus } from "./samples";
import type { LookupBody } from "./schemas";
import { formatMilliseconds } from "~/core/format";
import { outputUnitSystem, standardConditionsLabel } from "~/core/units";

/** What a lookup needs to know of the sample: its report's standard conditions and barometric pressure. */
type SampleBasis = {
  standardPressurePsia: number;
  standardTemperatureF: number;
  barometricPressurePsia: number;
};

/** A validated lookup request: the body's fields, its points as two columns (pressure, temperature). */
export type LookupRequest = Omit<LookupBody, "points" | "pressureBasis"> & {
  pressures: Float64Array;
  temperatures: Float64Array;
  /** Points and pressures out as absolute (default) or gauge, with the sample's barometric pressure. */
  pressureBasis?: LookupBody["pressureBasis"];
  /** Rs and Bg are rebased from the sample's standard conditions to those of `units`. */
  sample: SampleBasis;
};

/** The lookup options that come from the sample (and the request's pressure basis). */
function sampleBasisOptions(body: LookupRequest) {
  return {
    standardConditions: {
      pressurePsia: body.sample.standardPressurePsia,
      temperatureF: body.sample.standardTemperatureF,
    },
    pressureBasis: body.pressureBasis ?? "absolute",
    barometricPressurePsia: body.sample.barometricPressurePsia,
  };
}

/** The bases of a lookup's numbers, named in the response's units block. */
function basisLabels(body: LookupRequest) {
  const o = sampleBasisOptions(body);
  return {
    standardConditions: outputUnitSystem(body.units).standardConditions.label,
    reportStandardConditions: standardConditionsLabel(o.standardConditions),
    pressureBasis: o.pressureBasis,
    barometricPressurePsia: o.barometricPressurePsia,
  };
}

/**
 * The one lookup computation: a validated request against a revision, in a worker thread when large
 * (app/.server/workers), the results already serialised as the API's `results` array. Used by the API and by the
 * runs of saved lookup sets. Gives null when the revision has no grid of the property; the engine's LookupError
 * (a point out of range, options it refuses) is thrown.
 */
export async function computeLookup(
  data: RevisionData,
  body: LookupRequest,
  options: { surface?: HeavySurface } = {},
): Promise<HeavyRun<"api-lookup"> | null> {
  const grid = data.grids[body.property];
  if (!grid) return null;
  const { pressures, temperatures } = body;
  return runHeavyTimed(
    "api-lookup",
    {
      grid,
      pressures,
      temperatures,
      options: {
        property: body.property,
        method: body.method,
        degree: body.degree,
        extrapolate: body.extrapolate,
        units: body.units,
        messages: false,
        ...sampleBasisOptions(body),
      },
    },
    options,
  );
}

/** An engine refusal as the API's problem response. */
function lookupProblem(error: LookupError): Response {
  const status =
    error.code === "OUT_OF_RANGE" || error.code === "NO_VALID_ZONE"
      ? 422
      : error.code === "INVALID_GRID"
        ? 500
        : 400;
  const code =
    status === 422
      ? "out_of_range"
      : status === 500
        ? "internal_error"
        : "invalid_body";
  const index =
    typeof error.details.pointIndex === "number"
      ? error.details.pointIndex
      : undefined;
  return problem(
    status,
    code,
    error.message,
    index === undefined
      ? undefined
      : { issues: [{ path: ["points", index], message: error.message }] },
  );
}

/**
 * `startedAt` (performance.now() when the request arrived) gives the Server-Timing header. The ETag of a lookup
 * is derived from what determines its answer — the revision, the validated request and the build — so the
 * multi-megabyte body need not be hashed.
 */
export async function lookupResponse(
  request: Request,
  sampleId: number,
  data: RevisionData,
  body: LookupRequest,
  startedAt: number,
  readMs: number,
  bodyText: string,
): Promise<Response> {
  const computeStarted = performance.now();
  let run: HeavyRun<"api-lookup"> | null;
  try {
    run = await computeLookup(data, body);
  } catch (error) {
    if (isLookupError(error)) return lookupProblem(error);
    throw error;
  }
  const computeMs = performance.now() - computeStarted;
  if (!run)
    return problem(
      404,
      "property_not_measured",
      `Revision ${data.number} has no ${body.property} grid.`,
    );
  const result = run.value;
  let head: string;
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
        pressure: result.units.pressure,
        temperature: result.units.temperature,
        value: result.units.value,
        ...basisLabels(body),
      },
    });
  } catch (error) {
    return refuseNonFinite(error);
  }
  lookupPointsServed.inc({ outcome: "answered" }, body.pressures.length);
  const writeStarted = performance.now();
  const payload = Buffer.concat([
    Buffer.from(`${head.slice(0, -1)},"results":`),
    result.resultsUtf8,
    Buffer.from("}"),
  ]);
  const writeMs = performance.now() - writeStarted;
  const etagStarted = performance.now();
  const etag = `"${createHash("sha1")
    .update(
      `${BUILD_ID}|${data.revisionId}|${data.status}|${JSON.stringify(sampleBasisOptions(body))}|`,
    )
    .update(bodyText)
    .digest("base64url")}"`;
  const etagMs = performance.now() - etagStarted;
  return new Response(payload, {
    status: 200,
    headers: {
      "Content-Type": "application/json; charset=utf-8",
      ETag: etag,
      "Cache-Control": "private, no-cache",
      "Isopleth-Revision": String(data.number),
      "Isopleth-Revision-Status": data.status,
      // app = the whole request in the server; read = body read and JSON parse; compute = interpolation and
      // the results' JSON, with where it ran (a worker thread or inline) and how long it waited for a worker.
      "Server-Timing": `app;dur=${formatMilliseconds(performance.now() - startedAt)}, read;dur=${formatMilliseconds(readMs)}, compute;dur=${formatMilliseconds(computeMs)};desc="${run.where === "worker" ? `worker thread ${run.thread}` : "inline"}", queue;dur=${formatMilliseconds(run.waitMs)}, write;dur=${formatMilliseconds(writeMs)}, etag;dur=${formatMilliseconds(etagMs)}`,
    },
  });
}
