import { problem } from "~/.server/http";
import type { RevisionData } from "~/.server/samples/revision-data";
import { runHeavy } from "~/.server/workers/pool";
import {
  formatTableCsv,
  formatTableJson,
  formatTableText,
  isTableError,
  parsePressureSpec,
  tableBasisLines,
  type TableErrorCode,
} from "~/core/tables";
import { etagOf, json, notModified, respondWithEtag } from "./respond";
import { draftWarning, isApprovedStatus } from "./samples";
import type { TableQuery } from "./schemas";
import { fromInputPressureOn, fromInputTemperature } from "~/core/units";
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
  /** The report's base of Rs and Bg, and its barometric pressure (gauge pressures). */
  standardPressurePsia: number;
  standardTemperatureF: number;
  barometricPressurePsia: number;
};

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
  try {
    const spec = parsePressureSpec(q.pressures);
    const basis = {
      reportStandardConditions: reportBaseOf(sample),
      pressureBasis: q.pressureBasis,
      barometricPressurePsia: sample.barometricPressurePsia,
    };
    const etag = `W/${etagOf("table", data.revisionId, data.status, q.format, q.units, q.method, String(q.extrapolate), q.temperature, spec.pressures.join(","), JSON.stringify(basis))}`;
    const revision = { number: data.number, status: data.status };
    const unchanged = notModified(request, etag, { revision });
    if (unchanged) return unchanged;
    // Large tables are built in a worker thread (app/.server/workers), small ones inline.
    const table = await runHeavy("table", {
      grids: data.grids,
      temperature: fromInputTemperature(q.temperature, q.units),
      pressures: spec.pressures.map((p) =>
        fromInputPressureOn(p, q.units, basis),
      ),
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
      return problem(status, code, error.message);
    }
    throw error;
  }
}
