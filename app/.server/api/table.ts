import { problem } from "~/.server/http";
import { sheetDownload } from "~/.server/spreadsheet";
import type { RevisionData } from "~/.server/samples/revision-data";
import { runHeavy } from "~/.server/workers/pool";
import {
  formatTableCsv,
  formatTableJson,
  formatTableText,
  isTableError,
  measuredTablePressures,
  parsePressureSpec,
  tableSheet,
  type TableError,
  tableBasisLines,
  type TableErrorCode,
} from "~/core/tables";
import { etagOf, json, notModified, respondWithEtag } from "./respond";
import { draftWarning, isApprovedStatus } from "./samples";
import type { TableQuery } from "./schemas";
import {
  fromInputPressureOn,
  fromInputTemperature,
  toOutputTemperature,
  unitLabel,
} from "~/core/units";
import { formatSignificant } from "~/core/format";
import { reportBaseOf } from "~/.server/samples/present";

const STATUS: Record<TableErrorCode, [number, string]> = {
  MALFORMED_PRESSURES: [400, "invalid_pressures"],
  INVALID_NUMBER: [400, "invalid_pressures"],
  NOT_FINITE: [400, "invalid_pressures"],
  NOT_POSITIVE: [400, "invalid_pressures"],
  NOT_INCREASING: [400, "invalid_pressures"],
  INVALID_STEP: [400, "invalid_pressures"],
  INVALID_RANGE: [400, "invalid_pressures"],
  TOO_MANY_ROWS: [400, "invalid_pressures"],
  INVALID_OPTIONS: [400, "invalid_query"],
  NO_GRIDS: [404, "property_not_measured"],
  NO_BUBBLE_POINT: [422, "out_of_range"],
  OUT_OF_RANGE: [422, "out_of_range"],
  NO_VALID_ZONE: [422, "out_of_range"],
  NONPHYSICAL_COLUMN: [422, "out_of_range"],
  NOT_COMPUTABLE: [422, "not_computable"],
  INVALID_GRID: [500, "internal_error"],
};

type SampleForTable = {
  id: number;
  label: string;
  wellName: string;
  fieldName: string;
  /** °F; the table's temperature when the query names none. */
  reservoirTemperatureF: number | null;
  /** The report's base of Rs and Bg, and its barometric pressure (gauge pressures). */
  standardPressurePsia: number;
  standardTemperatureF: number;
  barometricPressurePsia: number;
};

/** The query parameter a table error is about, for the problem's `issues`. */
function parameterOf(error: TableError): "pressures" | "temperature" | null {
  if (STATUS[error.code]?.[1] === "invalid_pressures") return "pressures";
  const d = error.details as { field?: unknown; axis?: unknown };
  if (d.field === "temperature" || d.axis === "temperature")
    return "temperature";
  if (d.field === "pressures" || d.axis === "pressure") return "pressures";
  return null;
}

/**
 * The table's conditions in canonical units: the query's, or the defaults — the sample's reservoir
 * temperature and the measured pressures of the table's grids (app/core/tables/defaults.ts). A sample without
 * a reservoir temperature and a query without one is refused with a message that says what to give.
 */
function tableConditions(
  sample: SampleForTable,
  data: RevisionData,
  q: TableQuery,
  basis: Parameters<typeof fromInputPressureOn>[2],
):
  | { ok: true; temperatureF: number; pressuresPsia: number[]; key: string }
  | { ok: false; response: Response } {
  let temperatureF: number;
  if (q.temperature !== undefined)
    temperatureF = fromInputTemperature(q.temperature, q.units);
  else if (sample.reservoirTemperatureF !== null)
    temperatureF = sample.reservoirTemperatureF;
  else {
    const message = `No temperature was given and sample ${sample.id} has no reservoir temperature on record; give one, e.g. temperature=${q.units === "metric" ? "100" : "212"} (${unitLabel(q.units, "temperature")}).`;
    return {
      ok: false,
      response: problem(400, "invalid_query", `\`temperature\`: ${message}`, {
        issues: [{ path: ["temperature"], message }],
      }),
    };
  }
  const pressuresPsia =
    q.pressures === undefined
      ? measuredTablePressures(data.grids, q.extrapolate)
      : parsePressureSpec(q.pressures).pressures.map((p) =>
          fromInputPressureOn(p, q.units, basis),
        );
  return {
    ok: true,
    temperatureF,
    pressuresPsia,
    key: `${temperatureF}|${pressuresPsia.join(",")}`,
  };
}

/**
 * GET …/table: a black-oil table of a revision on the requested pressures, as JSON, CSV or text.
 * The ETag is derived from what determines the answer — the revision and its status, the normalised query
 * (the pressures as parsed, so `1000:2000:500` and `1000,1500,2000` are one table) and the output format and
 * units — so a fleet of simulators asking again gets 304 without the table being built. It is weak
 * (RFC 9110 §8.8.1): the body's `generatedAt` differs between two builds of the same table.
 */
export async function tableResponse(
  request: Request,
  sample: SampleForTable,
  data: RevisionData,
  q: TableQuery,
): Promise<Response> {
  const defaulted = q.temperature === undefined;
  try {
    const basis = {
      reportStandardConditions: reportBaseOf(sample),
      pressureBasis: q.pressureBasis,
      barometricPressurePsia: sample.barometricPressurePsia,
    };
    const conditions = tableConditions(sample, data, q, basis);
    if (!conditions.ok) return conditions.response;
    const etag = `W/${etagOf("table", data.revisionId, data.status, q.format, q.units, q.method, String(q.extrapolate), conditions.key, JSON.stringify(basis))}`;
    const revision = { number: data.number, status: data.status };
    const unchanged = notModified(request, etag, { revision });
    if (unchanged) return unchanged;
    // Large tables are built in a worker thread (app/.server/workers), small ones inline.
    const table = await runHeavy("table", {
      grids: data.grids,
      temperature: conditions.temperatureF,
      pressures: conditions.pressuresPsia,
      method: q.method,
      extrapolate: q.extrapolate,
      messageUnits: q.units,
      messageBasis: basis,
    });
    const options = {
      units: q.units,
      sampleLabel: `${sample.label} (${sample.wellName}, ${sample.fieldName}; sample id ${sample.id})`,
      revision: data.number,
      generatedAt: new Date(),
      ...basis,
    };
    const draft = draftWarning(data, sample.id);
    if (q.format === "csv") {
      // Comment lines before the header: the draft warning, and rows left out (CSV has no notes of its own).
      const lead = [
        draft,
        ...tableBasisLines(options),
        ...table.notes
          .filter((n) => n.code === "rows-not-computable")
          .map((n) => `note: ${n.message}`),
      ].filter((l) => l !== null);
      const body =
        lead.map((l) => `# ${l}\r\n`).join("") + formatTableCsv(table, options);
      return respondWithEtag(request, body, {
        contentType: "text/csv; charset=utf-8",
        revision,
        etag,
        headers: {
          "Content-Disposition": `inline; filename="isopleth-sample-${sample.id}-rev-${data.number}.csv"`,
        },
      });
    }
    if (q.format === "xlsx") {
      const json = formatTableJson(table, options);
      return sheetDownload(
        tableSheet(json, draft ? [draft] : []),
        "xlsx",
        `isopleth-sample-${sample.id}-rev-${data.number}-table`,
        {
          "Isopleth-Revision": String(data.number),
          "Isopleth-Revision-Status": data.status,
          ETag: etag,
        },
      );
    }
    if (q.format === "text") {
      const body =
        (draft ? `# ${draft}\n` : "") + formatTableText(table, options);
      return respondWithEtag(request, body, {
        contentType: "text/plain; charset=utf-8",
        revision,
        etag,
      });
    }
    return json(
      request,
      {
        sampleId: sample.id,
        revisionStatus: data.status,
        approved: isApprovedStatus(data.status),
        ...(draft ? { draftWarning: draft } : {}),
        ...formatTableJson(table, options),
      },
      revision,
      etag,
    );
  } catch (error) {
    if (isTableError(error)) {
      const [status, code] = STATUS[error.code] ?? [400, "invalid_query"];
      const parameter = parameterOf(error);
      const message =
        defaulted &&
        parameter === "temperature" &&
        sample.reservoirTemperatureF !== null
          ? `No temperature was given, so the sample's reservoir temperature (${formatSignificant(toOutputTemperature(sample.reservoirTemperatureF, q.units), 6)} ${unitLabel(q.units, "temperature")}) was used: ${error.message}`
          : error.message;
      return problem(
        status,
        code,
        parameter ? `\`${parameter}\`: ${message}` : message,
        parameter ? { issues: [{ path: [parameter], message }] } : undefined,
      );
    }
    throw error;
  }
}
