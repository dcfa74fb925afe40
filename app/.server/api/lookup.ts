import { createHash } from "node:crypto";
import { csvCommentLine, csvRow } from "~/core/csv";
import { formatMilliseconds } from "~/core/format";
import { isLookupError, type LookupError } from "~/core/lookup";
import { PROPERTIES, type PropertyKey } from "~/core/units";
import { problem } from "~/.server/http";
import { lookupPointsServed } from "~/.server/ops/metrics";
import type { RevisionData } from "~/.server/samples/revision-data";
import {
  runHeavyTimed,
  type HeavyRun,
  type HeavySurface,
} from "~/.server/workers/pool";
import type { ApiLookupFormat } from "~/.server/workers/tasks";
import { BUILD_ID, finiteJson, refuseNonFinite } from "./respond";
import { draftWarning, isApprovedStatus } from "./samples";
import type { LookupBody, LookupFormat } from "./schemas";

/** What a lookup needs to know of the sample: its report's standard conditions and barometric pressure. */
type SampleBasis = {
  standardPressurePsia: number;
  standardTemperatureF: number;
  barometricPressurePsia: number;
};

/** A validated lookup request of one property: the body's fields, its points as two columns. */
export type LookupRequest = Omit<
  LookupBody,
  "points" | "property" | "properties" | "format" | "pressureBasis"
> & {
  property: PropertyKey;
  pressures: Float64Array;
  temperatures: Float64Array;
  /** Points and pressures out as absolute (default) or gauge, with the sample's barometric pressure. */
  pressureBasis?: LookupBody["pressureBasis"];
  /** Rs and Bg are rebased from the sample's standard conditions to those of `units`. */
  sample: SampleBasis;
};

/** A validated lookup request as the API receives it: one property or several. */
type ApiLookupRequest = Omit<LookupBody, "points" | "pressureBasis"> & {
  pressures: Float64Array;
  temperatures: Float64Array;
  pressureBasis?: LookupBody["pressureBasis"];
  sample: SampleBasis;
};

/** The lookup options that come from the sample (and the request's pressure basis). */
function sampleBasisOptions(body: {
  sample: SampleBasis;
  pressureBasis?: LookupBody["pressureBasis"];
}) {
  return {
    standardConditions: {
      pressurePsia: body.sample.standardPressurePsia,
      temperatureF: body.sample.standardTemperatureF,
    },
    pressureBasis: body.pressureBasis ?? "absolute",
    barometricPressurePsia: body.sample.barometricPressurePsia,
  };
}

/** Media types of the lookup's answers. */
export const LOOKUP_MEDIA_TYPES = {
  points: "application/json",
  columns: "application/vnd.isopleth.columns+json",
  csv: "text/csv",
} as const satisfies Record<ApiLookupFormat, string>;

const CAUTION =
  "Interpolated and extrapolated values are estimates: check them against the laboratory report, and follow local regulations and licensed engineering practice for well control, facility design and reserves.";

/**
 * The one lookup computation: a validated request of one property against a revision, in a worker thread when
 * large (app/.server/workers), the answer already serialised (see the task `api-lookup`). Used by the API and
 * by the runs of saved lookup sets. Gives null when the revision has no grid of the property. Points that
 * cannot be served are refused in place; the engine's LookupError (a malformed request) is thrown.
 */
export async function computeLookup(
  data: RevisionData,
  body: LookupRequest,
  options: { surface?: HeavySurface; format?: ApiLookupFormat } = {},
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
      format: options.format ?? "points",
    },
    { surface: options.surface },
  );
}

/**
 * The form of the answer: `format` of the body, else the Accept header (RFC 9110 §12.5.1, media ranges with
 * q-values; the first of the types we serve with the highest q wins), else one object per point.
 */
export function negotiateLookupFormat(
  accept: string | null,
  format: LookupFormat | undefined,
): ApiLookupFormat {
  if (format === "columns") return "columns";
  if (format === "points" || !accept) return "points";
  let best: ApiLookupFormat = "points";
  let bestQ = -1;
  for (const part of accept.split(",")) {
    const [range = "", ...params] = part.split(";").map((x) => x.trim());
    const q = Number(
      /^q=([0-9.]+)$/i.exec(params.find((p) => /^q=/i.test(p)) ?? "")?.[1] ?? 1,
    );
    const type = range.toLowerCase();
    const which: ApiLookupFormat | null =
      type === LOOKUP_MEDIA_TYPES.columns
        ? "columns"
        : type === LOOKUP_MEDIA_TYPES.csv
          ? "csv"
          : type === "application/json" || type === "*/*"
            ? "points"
            : null;
    if (which && q > 0 && q > bestQ) {
      best = which;
      bestQ = q;
    }
  }
  return best;
}

/** A malformed request the engine found (a point that is not a point, options it refuses) as a problem. */
function lookupProblem(error: LookupError): Response {
  const status = error.code === "INVALID_GRID" ? 500 : 400;
  const index =
    typeof error.details.pointIndex === "number"
      ? error.details.pointIndex
      : undefined;
  return problem(
    status,
    status === 500 ? "internal_error" : "invalid_body",
    error.message,
    index === undefined
      ? undefined
      : { issues: [{ path: ["points", index], message: error.message }] },
  );
}

type Computed = { property: PropertyKey; run: HeavyRun<"api-lookup"> };

/**
 * The lookup's answer. One property (`property`): the request's facts and the property's block at the top
 * level; several (`properties`): the facts and `lookups`, one block per property in the order asked. Refused
 * points are in place in every form. `startedAt` (performance.now() when the request arrived) gives the
 * Server-Timing header. The ETag of a lookup is derived from what determines its answer — the revision, the
 * request's text, the form and the build — so the multi-megabyte body need not be hashed.
 */
export async function lookupResponse(
  request: Request,
  sampleId: number,
  data: RevisionData,
  body: ApiLookupRequest,
  startedAt: number,
  readMs: number,
  bodyText: string,
): Promise<Response> {
  const format = negotiateLookupFormat(
    request.headers.get("Accept"),
    body.format,
  );
  const properties = body.properties ?? [body.property!];
  const missing = properties.filter((p) => !data.grids[p]);
  if (missing.length)
    return problem(
      404,
      "property_not_measured",
      `Revision ${data.number} has no ${missing.join(", ")} grid${missing.length > 1 ? "s" : ""}; nothing was computed.`,
    );
  const computeStarted = performance.now();
  let computed: Computed[];
  try {
    computed = await Promise.all(
      properties.map(async (property) => ({
        property,
        run: (await computeLookup(
          data,
          {
            property,
            // A large job's columns are moved to its worker thread (detached here), so each property gets its
            // own copy and the request keeps the points for the CSV rows.
            pressures: body.pressures.slice(),
            temperatures: body.temperatures.slice(),
            method: body.method,
            degree: body.degree,
            extrapolate: body.extrapolate,
            units: body.units,
            revision: body.revision,
            pressureBasis: body.pressureBasis,
            sample: body.sample,
          },
          { format },
        ))!,
      })),
    );
  } catch (error) {
    if (isLookupError(error)) return lookupProblem(error);
    throw error;
  }
  const computeMs = performance.now() - computeStarted;
  for (const { run } of computed) {
    const { count, refusedCount } = run.value.summary;
    lookupPointsServed.inc({ outcome: "answered" }, count - refusedCount);
    if (refusedCount)
      lookupPointsServed.inc({ outcome: "refused" }, refusedCount);
  }
  const writeStarted = performance.now();
  let payload: Buffer<ArrayBuffer> | string;
  try {
    payload =
      format === "csv"
        ? lookupCsv(sampleId, data, body, computed)
        : lookupJson(sampleId, data, body, computed, format);
  } catch (error) {
    return refuseNonFinite(error);
  }
  const writeMs = performance.now() - writeStarted;
  const etagStarted = performance.now();
  const etag = `"${createHash("sha1")
    .update(
      `${BUILD_ID}|${data.revisionId}|${data.status}|${format}|${JSON.stringify(sampleBasisOptions(body))}|`,
    )
    .update(bodyText)
    .digest("base64url")}"`;
  const etagMs = performance.now() - etagStarted;
  const where = computed
    .map(({ run }) =>
      run.where === "worker" ? `worker thread ${run.thread}` : "inline",
    )
    .join(", ");
  const queueMs = Math.max(...computed.map(({ run }) => run.waitMs));
  return new Response(payload, {
    status: 200,
    headers: {
      "Content-Type":
        format === "csv"
          ? "text/csv; charset=utf-8; header=present"
          : `${LOOKUP_MEDIA_TYPES[format]}; charset=utf-8`,
      ETag: etag,
      "Cache-Control": "private, no-cache",
      Vary: "Accept, Authorization, Cookie",
      "Isopleth-Revision": String(data.number),
      "Isopleth-Revision-Status": data.status,
      // app = the whole request in the server; read = body read and JSON parse; compute = interpolation and
      // the answer's serialisation, with where it ran (worker threads or inline) and how long it waited for a
      // worker; write = putting the answer together.
      "Server-Timing": `app;dur=${formatMilliseconds(performance.now() - startedAt)}, read;dur=${formatMilliseconds(readMs)}, compute;dur=${formatMilliseconds(computeMs)};desc="${where}", queue;dur=${formatMilliseconds(queueMs)}, write;dur=${formatMilliseconds(writeMs)}, etag;dur=${formatMilliseconds(etagMs)}`,
    },
  });
}

/** The JSON answer: the facts as JSON.stringify writes them, the blocks' serialised bytes spliced in. */
function lookupJson(
  sampleId: number,
  data: RevisionData,
  body: ApiLookupRequest,
  computed: Computed[],
  format: "points" | "columns",
): Buffer<ArrayBuffer> {
  const facts = {
    sampleId,
    revision: data.number,
    revisionStatus: data.status,
    approved: isApprovedStatus(data.status),
    method: body.method,
    ...(format === "columns" ? { format } : {}),
  };
  const blocks = computed.map(({ property, run }) => {
    const head = finiteJson({
      property,
      methodDescription: run.value.methodDescription,
      degree: run.value.degree,
      units: { system: body.units, ...run.value.units },
      summary: run.value.summary,
    }).slice(0, -1);
    return format === "columns"
      ? [Buffer.from(`${head},`), run.value.resultsUtf8]
      : [Buffer.from(`${head},"results":`), run.value.resultsUtf8];
  });
  const open = finiteJson(facts).slice(0, -1);
  if (body.properties === undefined) {
    // one property: its block's members beside the facts
    const [head, results] = blocks[0]!;
    return Buffer.concat([
      Buffer.from(`${open},${head!.subarray(1).toString()}`),
      results!,
      Buffer.from("}"),
    ]);
  }
  const parts: Uint8Array[] = [Buffer.from(`${open},"lookups":[`)];
  blocks.forEach(([head, results], k) => {
    parts.push(k ? Buffer.from(`,${head!.toString()}`) : head!, results!);
    parts.push(Buffer.from("}"));
  });
  parts.push(Buffer.from("]}"));
  return Buffer.concat(parts);
}

/**
 * The CSV answer (RFC 4180, UTF-8 with a byte-order mark so spreadsheets read °F and m³): comment lines
 * (`# …`) with the sample, revision, method and the caution, then a header row and one row per point — the
 * conditions as sent, then per property its value, error estimate, method, warnings and refusal.
 */
function lookupCsv(
  sampleId: number,
  data: RevisionData,
  body: ApiLookupRequest,
  computed: Computed[],
): string {
  const first = computed[0]!.run.value;
  const lines: string[] = [];
  const draft = draftWarning(data, sampleId);
  if (draft) lines.push(csvCommentLine(draft));
  lines.push(
    csvCommentLine(
      `Isopleth lookup: sample ${sampleId}, revision ${data.number} (${data.status}), ${first.methodDescription}, ${body.units} units, pressures ${body.pressureBasis === "gauge" ? `gauge (barometric pressure ${body.sample.barometricPressurePsia} psia)` : "absolute"}.`,
    ),
    csvCommentLine(`caution: ${CAUTION}`),
  );
  const header: string[] = [
    `Pressure (${first.units.pressure})`,
    `Temperature (${first.units.temperature})`,
  ];
  for (const { property, run } of computed) {
    const name = PROPERTIES[property].name;
    const unit = run.value.units.value;
    header.push(
      `${name} (${unit})`,
      `${name} error estimate (${unit})`,
      `${name} method`,
      `${name} warnings`,
      `${name} refused`,
    );
  }
  lines.push(csvRow(header));
  const cells = computed.map(({ run }) => run.value.csvCells!);
  const { pressures, temperatures } = body;
  for (let i = 0; i < pressures.length; i++) {
    let row = `${pressures[i]},${temperatures[i]}`;
    for (const c of cells) row += `,${c[i]}`;
    lines.push(row);
  }
  return `\uFEFF${lines.join("\r\n")}\r\n`;
}
