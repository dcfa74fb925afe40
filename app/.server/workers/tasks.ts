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
  readLookupText,
  runLookup,
  type LookupErrorCode,
  type LookupOptions,
  type LookupPoints,
  type LookupResult,
  type LookupText,
} from "~/core/lookup";
import {
  buildBlackOilTable,
  isTableError,
  TableError,
  type BlackOilTable,
  type BlackOilTableInput,
  type TableErrorCode,
} from "~/core/tables";

/** The API lookup: points as two columns (Float64Array, transferred, not copied), the answer as JSON text. */
export type ApiLookupInput = {
  grid: Grid;
  pressures: Float64Array;
  temperatures: Float64Array;
  options: LookupOptions;
};

export type ApiLookupOutput = {
  methodDescription: string;
  degree: LookupResult["degree"];
  /** Unit symbols of the output. */
  units: { pressure: string; temperature: string; value: string };
  /**
   * The `results` array of the API response, serialised (see serialiseResults) and encoded as UTF-8 here, so
   * the main thread sends the bytes as they are (encoding 15 MB of JSON for 100,000 points cost it ~300 ms).
   */
  resultsUtf8: Uint8Array;
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
  "api-lookup": ({ grid, pressures, temperatures, options }) => {
    const result = runLookup(grid, { pressures, temperatures }, options);
    return {
      methodDescription: result.methodDescription,
      degree: result.degree,
      units: {
        pressure: result.units.pressure.symbol,
        temperature: result.units.temperature.symbol,
        value: result.units.value.symbol,
      },
      resultsUtf8: new TextEncoder().encode(serialiseResults(result.results)),
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
 * The API's results array, written by hand rather than through JSON.stringify of one object per point:
 * stencils and warning lists are shared between points (the engine reuses them), so each is serialised once.
 * For 10,000 points this is several times faster than building and stringifying 10,000 objects.
 */
/**
 * The refusal of a point whose value cannot be computed: value and errorEstimate null and this refusal; the
 * other points of the request are served as usual.
 */
export const NOT_COMPUTABLE_REFUSAL = {
  code: "not_computable",
  message:
    "The value at this point cannot be computed: the interpolation did not give a finite number (the point lies too far outside the measured data). Choose a point nearer the measured range.",
} as const;
const REFUSAL_JSON = JSON.stringify(NOT_COMPUTABLE_REFUSAL);

export function serialiseResults(results: LookupResult["results"]): string {
  const stencilJson = new Map<object, string>();
  const warningsJson = new Map<object, string>();
  const parts: string[] = new Array(results.length);
  for (let i = 0; i < results.length; i++) {
    const r = results[i]!;
    let stencil = stencilJson.get(r.stencil);
    if (stencil === undefined) {
      stencil = JSON.stringify({
        pressure: r.stencil.pressures,
        temperature: r.stencil.temperatures,
      });
      stencilJson.set(r.stencil, stencil);
    }
    let warnings = warningsJson.get(r.warnings);
    if (warnings === undefined) {
      warnings = JSON.stringify(r.warnings);
      warningsJson.set(r.warnings, warnings);
    }
    const bubble =
      r.bubblePointPressure !== null && Number.isFinite(r.bubblePointPressure)
        ? `,"bubblePointPressure":${r.bubblePointPressure}`
        : "";
    const branch = r.branch ? `,"branch":"${r.branch}"` : "";
    // A point whose value cannot be computed (NaN or ±Infinity, e.g. far outside the data with extrapolation
    // allowed) is refused on its own; no non-finite number is ever written.
    parts[i] =
      Number.isFinite(r.value) && Number.isFinite(r.errorEstimate)
        ? `{"value":${r.value},"errorEstimate":${r.errorEstimate},"warnings":${warnings},"method":"${r.method}","stencil":${stencil}${branch}${bubble}}`
        : `{"value":null,"errorEstimate":null,"refusal":${REFUSAL_JSON},"warnings":${warnings},"method":"${r.method}","stencil":${stencil}${branch}${bubble}}`;
  }
  return `[${parts.join(",")}]`;
}
