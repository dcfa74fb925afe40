/**
 * The pressures of a resampled table, written as a list "500,1000,1500" or a range "500:5000:250"
 * (start, stop, step; the stop is included when the steps land on it). Numbers are taken as written, in
 * the caller's pressure unit; converting them is the caller's business.
 */
import { affineToCanonical, toCanonicalWith } from "../lookup";
import { outputUnitSystem, type OutputSystem } from "../units";
import { TableError } from "./errors";
import { roundSignificant } from "../format";

/** Most rows a table may have (the bubble-point row comes on top). */
export const MAX_TABLE_ROWS = 10_000;

export type PressureSpec = { kind: "list" | "range"; pressures: number[] };

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

function parseNumber(text: string, what: string): number {
  const t = text.trim();
  if (t === "")
    throw new TableError("MALFORMED_PRESSURES", `${what} is empty.`, {
      entry: what,
    });
  if (!NUMBER.test(t)) {
    if (/^[+-]?(nan|inf|infinity)$/i.test(t)) {
      throw new TableError(
        "NOT_FINITE",
        `${what} is "${t}"; pressures must be finite numbers.`,
        { entry: what, text: t },
      );
    }
    throw new TableError(
      "INVALID_NUMBER",
      `${what} is "${t}", which is not a number (write e.g. 1500 or 1.5e3, without units or thousands separators).`,
      {
        entry: what,
        text: t,
      },
    );
  }
  const v = Number(t);
  if (!Number.isFinite(v)) {
    throw new TableError(
      "NOT_FINITE",
      `${what} is "${t}", too large to be a finite number.`,
      { entry: what, text: t },
    );
  }
  return v;
}

function positive(v: number, what: string): number {
  if (!(v > 0)) {
    throw new TableError(
      "NOT_POSITIVE",
      `${what} is ${v}; pressures are absolute and must be above zero.`,
      { entry: what, value: v },
    );
  }
  return v;
}

function tooMany(count: number): TableError {
  return new TableError(
    "TOO_MANY_ROWS",
    `That makes ${count} pressures; a table has at most ${MAX_TABLE_ROWS} rows. Use a larger step or a shorter range.`,
    {
      count,
      max: MAX_TABLE_ROWS,
    },
  );
}

/**
 * Parses "a,b,c" (commas, semicolons or whitespace between entries; strictly increasing) or
 * "start:stop:step". Throws TableError with a code from errors.ts and a message naming the entry at fault.
 */
export function parsePressureSpec(spec: string): PressureSpec {
  if (typeof spec !== "string") {
    throw new TableError(
      "MALFORMED_PRESSURES",
      'Pressures must be given as text, e.g. "500,1000,1500" or "500:5000:250".',
    );
  }
  const text = spec.trim();
  if (text === "") {
    throw new TableError(
      "MALFORMED_PRESSURES",
      'No pressures were given: write a list such as "500,1000,1500" or a range such as "500:5000:250".',
    );
  }
  if (text.includes(":")) return parseRange(text);
  const parts = text.split(/[\s,;]+/).filter((p) => p !== "");
  if (parts.length > MAX_TABLE_ROWS) throw tooMany(parts.length);
  const pressures: number[] = [];
  parts.forEach((part, i) => {
    const v = positive(
      parseNumber(part, `Pressure ${i + 1} of the list`),
      `Pressure ${i + 1} of the list`,
    );
    const prev = pressures[i - 1];
    if (prev !== undefined && !(v > prev)) {
      throw new TableError(
        "NOT_INCREASING",
        v === prev
          ? `Pressure ${v} is listed twice (entries ${i} and ${i + 1}); list each pressure once, in increasing order.`
          : `Pressures must be listed in increasing order, but ${prev} (entry ${i}) is followed by ${v} (entry ${i + 1}).`,
        { index: i, value: v, previous: prev },
      );
    }
    pressures.push(v);
  });
  return { kind: "list", pressures };
}

function parseRange(text: string): PressureSpec {
  const parts = text.split(":");
  if (parts.length !== 3) {
    throw new TableError(
      "MALFORMED_PRESSURES",
      `A range is written start:stop:step, e.g. "500:5000:250"; "${text}" has ${parts.length} part${parts.length === 1 ? "" : "s"}.`,
      { text },
    );
  }
  const start = positive(
    parseNumber(parts[0]!, "The start of the range"),
    "The start of the range",
  );
  const stop = positive(
    parseNumber(parts[1]!, "The stop of the range"),
    "The stop of the range",
  );
  const step = parseNumber(parts[2]!, "The step of the range");
  if (!(step > 0)) {
    throw new TableError(
      "INVALID_STEP",
      `The step of the range is ${step}; it must be above zero.`,
      { step },
    );
  }
  if (stop < start) {
    throw new TableError(
      "INVALID_RANGE",
      `The range stops at ${stop}, below its start ${start}; write start:stop:step with stop ≥ start.`,
      {
        start,
        stop,
      },
    );
  }
  // the stop counts as reached when the last step lands on it to rounding
  const steps = Math.floor((stop - start) / step + 1e-9);
  if (steps + 1 > MAX_TABLE_ROWS) throw tooMany(steps + 1);
  const pressures: number[] = [];
  for (let i = 0; i <= steps; i++) {
    // computed from the start each time (no accumulated rounding), trimmed to the digits of the inputs
    const p = roundSignificant(start + i * step, 15);
    if (pressures.length === 0 || p > pressures[pressures.length - 1]!)
      pressures.push(p);
  }
  return { kind: "range", pressures };
}

/**
 * The table's pressures and temperature, given in the caller's unit system (field: psia and °F; metric:
 * bara and °C), in canonical units (psia, °F) for buildBlackOilTable.
 */
export function tableConditionsToCanonical(
  conditions: { pressures: readonly number[]; temperature: number },
  units: OutputSystem,
): { pressures: number[]; temperature: number } {
  const system = outputUnitSystem(units);
  const p = affineToCanonical("pressure", system);
  const t = affineToCanonical("temperature", system);
  return {
    pressures: conditions.pressures.map((v) => toCanonicalWith(p, v)),
    temperature: toCanonicalWith(t, conditions.temperature),
  };
}
