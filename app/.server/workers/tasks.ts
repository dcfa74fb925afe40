/**
 * The heavy tasks: pure computation over app/core, run either in a worker thread (heavy-worker.ts) or inline
 * (pool.ts decides). This module imports only app/core: no framework, database, node built-ins or
 * environment, so the worker bundle stays small and a worker can never touch shared state.
 *
 * What crosses the thread boundary is structured-cloned, so every input and output here is plain data
 * (objects, arrays, numbers, strings, typed arrays): no class instances, functions or prototypes. Errors of
 * the core library do not survive a clone (a clone of a LookupError is a plain Error without `code`), so they
 * travel as `{ error: EncodedError }` and pool.ts rebuilds the real class on the main thread.
 */
import type { Grid } from "~/core/interpolation";
import {
  parseUpload,
  runQc,
  type Finding,
  type ParsedDataset,
  type PropertyGrid,
  type QcMeta,
} from "~/core/lab-data";
import {
  isLabDataError,
  LabDataError,
  type LabDataErrorCode,
} from "~/core/lab-data";
import {
  isLookupError,
  LookupError,
  lookupWarningsFromFlags,
  METHOD_CODES,
  readLookupText,
  runLookup,
  runLookupColumns,
  LOOKUP_REFUSAL_CODES,
  type LookupColumnsResult,
  type LookupErrorCode,
  type LookupOptions,
  type LookupPoints,
  type LookupResult,
  type LookupStencil,
  type LookupText,
} from "~/core/lookup";
import { csvCell } from "~/core/csv";
import {
  buildBlackOilTable,
  isTableError,
  TableError,
  type BlackOilTable,
  type BlackOilTableInput,
  type TableErrorCode,
} from "~/core/tables";

/**
 * The API lookup of one property: points as two columns (Float64Array, transferred, not copied), the answer as
 * JSON text (per point or per field) or CSV cells.
 */
export type ApiLookupInput = {
  grid: Grid;
  pressures: Float64Array;
  temperatures: Float64Array;
  options: LookupOptions;
  /** Default "points". */
  format?: ApiLookupFormat;
};

export type ApiLookupOutput = {
  methodDescription: string;
  degree: LookupResult["degree"];
  /** Unit symbols of the output. */
  units: {
    pressure: string;
    temperature: string;
    value: string;
    standardConditions: string;
    reportStandardConditions: string;
    pressureBasis: "absolute" | "gauge";
    barometricPressurePsia: number;
  };
  summary: ApiLookupSummary;
  /**
   * The property's answer as JSON, serialised (see serialiseResults, serialiseColumns) and encoded as UTF-8
   * here, so the main thread sends the bytes as they are (encoding 15 MB of JSON for 100,000 points cost it
   * ~300 ms): the `results` array (points), or the members count, columns and stencils (columns); empty for
   * CSV.
   */
  resultsUtf8: Uint8Array;
  /** CSV: the property's cells per point (csvCellsOf); null otherwise. */
  csvCells: string[] | null;
};

export type CheckUploadInput = {
  filename: string;
  bytes: Uint8Array;
  meta: QcMeta;
};

/**
 * parseUpload's outcome, plus the QC findings (runQc) when the file parsed. The dataset comes back without
 * its per-cell `sources` (where each number was read): the checks inside the job use them, nothing after
 * does, and they are one object per cell — most of what a clone back to the main thread would cost.
 */
export type CheckUploadOutput =
  | { ok: false; errors: readonly Finding[]; warnings: readonly Finding[] }
  | {
      ok: true;
      dataset: ParsedDataset;
      warnings: readonly Finding[];
      findings: Finding[];
    };

/** Every heavy task: its input and its output. */
export type HeavyTasks = {
  "api-lookup": { input: ApiLookupInput; output: ApiLookupOutput };
  /** A lookup request's JSON text parsed, bounded and its points checked into columns (readLookupText). */
  "read-lookup-body": {
    input: { text: string; maxDepth: number };
    output: LookupText;
  };
  lookup: {
    input: { grid: Grid; points: LookupPoints; options: LookupOptions };
    output: LookupResult;
  };
  table: { input: BlackOilTableInput; output: BlackOilTable };
  "check-upload": { input: CheckUploadInput; output: CheckUploadOutput };
};
export type HeavyTask = keyof HeavyTasks;
export type HeavyInput<T extends HeavyTask> = HeavyTasks[T]["input"];
export type HeavyOutput<T extends HeavyTask> = HeavyTasks[T]["output"];

export const HEAVY_TASKS: readonly HeavyTask[] = [
  "api-lookup",
  "read-lookup-body",
  "lookup",
  "table",
  "check-upload",
];

const TASKS: {
  [T in HeavyTask]: (
    input: HeavyInput<T>,
  ) => HeavyOutput<T> | Promise<HeavyOutput<T>>;
} = {
  "api-lookup": ({ grid, pressures, temperatures, options, format }) => {
    if (format === "columns") {
      const columns = runLookupColumns(
        grid,
        { pressures, temperatures },
        options,
      );
      const { json, summary } = serialiseColumns(columns);
      return {
        methodDescription: columns.methodDescription,
        degree: columns.degree,
        units: {
          pressure: columns.units.pressure.symbol,
          temperature: columns.units.temperature.symbol,
          value: columns.units.value.symbol,
          standardConditions: columns.units.standardConditions,
          reportStandardConditions: columns.units.reportStandardConditions,
          pressureBasis: columns.units.pressureBasis,
          barometricPressurePsia: columns.units.barometricPressurePsia,
        },
        summary,
        resultsUtf8: new TextEncoder().encode(json),
        csvCells: null,
      };
    }
    const result = runLookup(grid, { pressures, temperatures }, options);
    const head = {
      methodDescription: result.methodDescription,
      degree: result.degree,
      units: {
        pressure: result.units.pressure.symbol,
        temperature: result.units.temperature.symbol,
        value: result.units.value.symbol,
        standardConditions: result.units.standardConditions,
        reportStandardConditions: result.units.reportStandardConditions,
        pressureBasis: result.units.pressureBasis,
        barometricPressurePsia: result.units.barometricPressurePsia,
      },
    };
    if (format === "csv") {
      const { cells, summary } = csvCellsOf(result.results);
      return {
        ...head,
        summary,
        resultsUtf8: new Uint8Array(0),
        csvCells: cells,
      };
    }
    const { json, summary } = serialiseResults(result.results);
    return {
      ...head,
      summary,
      resultsUtf8: new TextEncoder().encode(json),
      csvCells: null,
    };
  },
  "read-lookup-body": ({ text, maxDepth }) => readLookupText(text, maxDepth),
  lookup: ({ grid, points, options }) => runLookup(grid, points, options),
  table: (input) => buildBlackOilTable(input),
  "check-upload": async ({ filename, bytes, meta }) => {
    // gauge pressures are made absolute with the sample's barometric pressure (QcMeta.barometricPsia)
    const parsed = await parseUpload(
      { filename, bytes },
      meta.barometricPsia !== undefined
        ? { barometricPsia: meta.barometricPsia }
        : {},
    );
    if (!parsed.ok)
      return { ok: false, errors: parsed.errors, warnings: parsed.warnings };
    const findings = runQc(parsed.dataset, meta);
    return {
      ok: true,
      dataset: withoutSources(parsed.dataset),
      warnings: parsed.warnings,
      findings,
    };
  },
};

function withoutSources(dataset: ParsedDataset): ParsedDataset {
  const properties: Record<string, PropertyGrid> = {};
  for (const [key, grid] of Object.entries(dataset.properties)) {
    const { sources: _sources, ...rest } = grid;
    properties[key] = rest;
  }
  return {
    ...dataset,
    properties,
    bubblePoints: dataset.bubblePoints.map(
      ({ source: _source, ...rest }) => rest,
    ),
  };
}

/** A core library error as plain data. */
export type EncodedError =
  | {
      kind: "lookup";
      code: LookupErrorCode;
      message: string;
      details: Record<string, unknown>;
    }
  | {
      kind: "table";
      code: TableErrorCode;
      message: string;
      details: Record<string, unknown>;
    }
  | { kind: "lab-data"; code: LabDataErrorCode; message: string };

/** What a task answers across the boundary: its output, or the core error it threw. */
export type TaskOutcome<T extends HeavyTask> =
  { value: HeavyOutput<T> } | { error: EncodedError };

/** Runs one task; core library errors become `{ error }`, anything else (a bug) is thrown as it is. */
export async function runTask<T extends HeavyTask>(
  task: T,
  input: HeavyInput<T>,
): Promise<TaskOutcome<T>> {
  const run = TASKS[task] as
    | ((input: HeavyInput<T>) => HeavyOutput<T> | Promise<HeavyOutput<T>>)
    | undefined;
  if (!run) throw new Error(`Unknown heavy task ${JSON.stringify(task)}.`);
  try {
    return { value: await run(input) };
  } catch (error) {
    if (isLookupError(error))
      return {
        error: {
          kind: "lookup",
          code: error.code,
          message: error.message,
          details: { ...error.details },
        },
      };
    if (isTableError(error))
      return {
        error: {
          kind: "table",
          code: error.code,
          message: error.message,
          details: { ...error.details },
        },
      };
    if (isLabDataError(error))
      return {
        error: { kind: "lab-data", code: error.code, message: error.message },
      };
    throw error;
  }
}

/** The error class a task threw, rebuilt on the caller's side. */
export function decodeError(
  error: EncodedError,
): LookupError | TableError | LabDataError {
  if (error.kind === "lookup")
    return new LookupError(error.code, error.message, error.details);
  if (error.kind === "table")
    return new TableError(error.code, error.message, error.details);
  return new LabDataError(error.code, error.message);
}

/*
 * The API's answer for one property, written by hand rather than through JSON.stringify of one object per
 * point: stencils and warning lists are shared between points (the engine reuses them), so each is serialised
 * once. For 10,000 points this is several times faster than building and stringifying 10,000 objects.
 *
 * A refused point (the engine's `refused`) is written in place: value, errorEstimate, method and stencil null,
 * and `refused: { code, message }`. A served point whose value is not a finite number is refused here too
 * (`impossible-value`), so no NaN or Infinity is ever written; an error estimate that is not a finite number
 * is written null (the table says nothing about the error there).
 */

/** Forms of the API's lookup answer: JSON objects per point, JSON arrays per field, or CSV cells. */
export type ApiLookupFormat = "points" | "columns" | "csv";

/** A refusal as the API writes it. */
export type ApiRefusal = { code: string; message: string };

/** How many points were sent, refused (and why), served per method, and flagged per warning. */
export type ApiLookupSummary = {
  count: number;
  refusedCount: number;
  refusalCounts: Record<string, number>;
  methodCounts: Record<string, number>;
  warningCounts: Record<string, number>;
};

/**
 * A point's result as the API reads it: today's engine result, and the per-point refusal of the shared
 * contract (value, errorEstimate, method and stencil null, `refused` present) both fit.
 */
type PointResult = {
  value: number | null;
  errorEstimate: number | null;
  warnings: readonly string[];
  method: string | null;
  stencil: LookupStencil | null;
  branch: string | null;
  bubblePointPressure: number | null;
  refused?: ApiRefusal;
};

function notFinite(index: number): ApiRefusal {
  return {
    code: "impossible-value",
    message: `Point ${index + 1}: the interpolation did not give a finite number here (the point lies too far outside the measured data). Choose a point nearer the measured range.`,
  };
}

/** The point's refusal, if it is refused (by the engine, or here for a value that is not a finite number). */
function refusalOf(r: PointResult, index: number): ApiRefusal | undefined {
  if (r.refused) return r.refused;
  return typeof r.value === "number" && Number.isFinite(r.value)
    ? undefined
    : notFinite(index);
}

const finiteOrNull = (x: number | null): string =>
  x !== null && Number.isFinite(x) ? String(x) : "null";

/**
 * A stencil as the API writes it: the measured pressures and temperatures of the zone (output units) and, when
 * its temperature columns used different rows (missing cells, bubble points), `columns`: per column its grid
 * column index and the grid rows it used (every listed cell a measured one), `bubblePointNode: true` where the
 * column's zone also used its bubble point.
 */
function stencilJsonOf(stencil: LookupStencil): string {
  const zone = {
    pressure: stencil.pressures,
    temperature: stencil.temperatures,
  };
  const { columns } = stencil;
  const all = stencil.pressureIndices;
  const differ = columns.some(
    (c) =>
      c.bubblePointNode === true ||
      c.pressureIndices.length !== all.length ||
      c.pressureIndices.some((r, k) => r !== all[k]),
  );
  return JSON.stringify(
    differ
      ? {
          ...zone,
          columns: columns.map((c) => ({
            temperature: c.temperatureIndex,
            pressure: c.pressureIndices,
            ...(c.bubblePointNode ? { bubblePointNode: true } : {}),
          })),
        }
      : zone,
  );
}

function emptySummary(count: number): ApiLookupSummary {
  return {
    count,
    refusedCount: 0,
    refusalCounts: {},
    methodCounts: {},
    warningCounts: {},
  };
}

/** Counts one point into the summary (warning lists are shared arrays: counted per list, expanded at the end). */
function countPoint(
  summary: ApiLookupSummary,
  listCounts: Map<readonly string[], number>,
  r: PointResult,
  refused: ApiRefusal | undefined,
) {
  if (refused) {
    summary.refusedCount++;
    summary.refusalCounts[refused.code] =
      (summary.refusalCounts[refused.code] ?? 0) + 1;
  } else if (r.method !== null) {
    summary.methodCounts[r.method] = (summary.methodCounts[r.method] ?? 0) + 1;
  }
  if (r.warnings.length)
    listCounts.set(r.warnings, (listCounts.get(r.warnings) ?? 0) + 1);
}

function finishSummary(
  summary: ApiLookupSummary,
  listCounts: Map<readonly string[], number>,
): ApiLookupSummary {
  for (const [list, n] of listCounts)
    for (const code of list)
      summary.warningCounts[code] = (summary.warningCounts[code] ?? 0) + n;
  return summary;
}

/** The `results` array of the per-point answer, and the summary. */
export function serialiseResults(results: readonly PointResult[]): {
  json: string;
  summary: ApiLookupSummary;
} {
  const stencilJson = new Map<object, string>();
  const warningsJson = new Map<object, string>();
  const listCounts = new Map<readonly string[], number>();
  const summary = emptySummary(results.length);
  const parts: string[] = new Array<string>(results.length);
  for (let i = 0; i < results.length; i++) {
    const r = results[i]!;
    let warnings = warningsJson.get(r.warnings);
    if (warnings === undefined) {
      warnings = JSON.stringify(r.warnings);
      warningsJson.set(r.warnings, warnings);
    }
    const refused = refusalOf(r, i);
    countPoint(summary, listCounts, r, refused);
    const bubble =
      r.bubblePointPressure !== null && Number.isFinite(r.bubblePointPressure)
        ? `,"bubblePointPressure":${r.bubblePointPressure}`
        : "";
    const branch = r.branch ? `,"branch":"${r.branch}"` : "";
    if (refused) {
      parts[i] =
        `{"value":null,"errorEstimate":null,"refused":${JSON.stringify(refused)},"warnings":${warnings},"method":null,"stencil":null${branch}${bubble}}`;
      continue;
    }
    let stencil = r.stencil ? stencilJson.get(r.stencil) : "null";
    if (stencil === undefined) {
      stencil = stencilJsonOf(r.stencil!);
      stencilJson.set(r.stencil!, stencil);
    }
    parts[i] =
      `{"value":${r.value},"errorEstimate":${finiteOrNull(r.errorEstimate)},"warnings":${warnings},"method":"${r.method}","stencil":${stencil}${branch}${bubble}}`;
  }
  return {
    json: `[${parts.join(",")}]`,
    summary: finishSummary(summary, listCounts),
  };
}

/**
 * The columnar answer's members `"count":…,"columns":{…}` (no braces around them), and the summary, straight
 * from the engine's typed arrays (runLookupColumns: no object per point). Numbers are written by
 * JSON.stringify of plain arrays, which writes NaN (refused, or no estimate) as null. No stencils: the
 * per-point form gives them.
 */
export function serialiseColumns(result: LookupColumnsResult): {
  json: string;
  summary: ApiLookupSummary;
} {
  const n = result.count;
  const summary = emptySummary(n);
  const values = Array.from(result.values);
  const errorEstimates = Array.from(result.errorEstimates);
  const method: (string | null)[] = new Array<string | null>(n);
  const refused: string[] = new Array<string>(n);
  const warnings: string[] = new Array<string>(n);
  const maskJson = new Map<number, string>();
  const maskCounts = new Map<number, number>();
  const { refusals, refusalMessages } = result;
  let anyRefused = false;
  for (let i = 0; i < n; i++) {
    const mask = result.warnings[i]!;
    let w = maskJson.get(mask);
    if (w === undefined) {
      w = JSON.stringify(lookupWarningsFromFlags(mask));
      maskJson.set(mask, w);
    }
    warnings[i] = w;
    if (mask !== 0) maskCounts.set(mask, (maskCounts.get(mask) ?? 0) + 1);
    const k = refusals ? refusals[i]! : 0;
    const v = values[i]!;
    const why: ApiRefusal | undefined =
      k > 0
        ? {
            code: LOOKUP_REFUSAL_CODES[k - 1] ?? "impossible-value",
            message: refusalMessages?.[i] ?? `Point ${i + 1} was refused.`,
          }
        : Number.isFinite(v)
          ? undefined
          : notFinite(i);
    if (why) {
      anyRefused = true;
      values[i] = NaN;
      errorEstimates[i] = NaN;
      method[i] = null;
      refused[i] = JSON.stringify(why);
      summary.refusedCount++;
      summary.refusalCounts[why.code] =
        (summary.refusalCounts[why.code] ?? 0) + 1;
      continue;
    }
    const m = METHOD_CODES[result.methods[i]!]!;
    method[i] = m;
    summary.methodCounts[m] = (summary.methodCounts[m] ?? 0) + 1;
    refused[i] = "null";
  }
  for (const [mask, c] of maskCounts)
    for (const code of lookupWarningsFromFlags(mask))
      summary.warningCounts[code] = (summary.warningCounts[code] ?? 0) + c;
  const columns = [
    `"value":${JSON.stringify(values)}`,
    `"errorEstimate":${JSON.stringify(errorEstimates)}`,
    `"method":${JSON.stringify(method)}`,
    `"warnings":[${warnings.join(",")}]`,
    `"refused":${anyRefused ? `[${refused.join(",")}]` : JSON.stringify(new Array<null>(n).fill(null))}`,
  ];
  if (result.branches) {
    const branch = new Array<string | null>(n);
    for (let i = 0; i < n; i++)
      branch[i] =
        result.branches[i] === 1
          ? "saturated"
          : result.branches[i] === 2
            ? "undersaturated"
            : null;
    columns.push(`"branch":${JSON.stringify(branch)}`);
  }
  if (result.bubblePointPressures)
    columns.push(
      `"bubblePointPressure":${JSON.stringify(Array.from(result.bubblePointPressures))}`,
    );
  return {
    json: `"count":${n},"columns":{${columns.join(",")}}`,
    summary,
  };
}

/**
 * The CSV cells of one property, one string per point (value, error estimate, method, warnings, refusal;
 * joined by commas, written by the one CSV cell writer), and the summary. The main thread puts the points'
 * conditions and the properties side by side.
 */
export function csvCellsOf(results: readonly PointResult[]): {
  cells: string[];
  summary: ApiLookupSummary;
} {
  const warningsCell = new Map<object, string>();
  const listCounts = new Map<readonly string[], number>();
  const summary = emptySummary(results.length);
  const cells: string[] = new Array<string>(results.length);
  for (let i = 0; i < results.length; i++) {
    const r = results[i]!;
    let w = warningsCell.get(r.warnings);
    if (w === undefined) {
      w = csvCell(r.warnings.join(" "));
      warningsCell.set(r.warnings, w);
    }
    const why = refusalOf(r, i);
    countPoint(summary, listCounts, r, why);
    cells[i] = why
      ? `,,,${w},${csvCell(`${why.code}: ${why.message}`)}`
      : `${r.value},${r.errorEstimate !== null && Number.isFinite(r.errorEstimate) ? r.errorEstimate : ""},${r.method},${w},`;
  }
  return { cells, summary: finishSummary(summary, listCounts) };
}
