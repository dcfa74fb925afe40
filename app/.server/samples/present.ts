import {
  depthUnitLabel,
  getUnit,
  type OutputSystem,
  PROPERTIES,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  type PropertyKey,
  type ReferenceConditions,
  toOutputDepth,
  toOutputPressure,
  toOutputTemperature,
  toOutputValue,
  unitLabel,
} from "~/core/units";
import type { Finding, QcRuleInfo } from "~/core/lab-data";
import { QC_RULES } from "~/core/lab-data";
import type {
  CellMark,
  DisplayBubblePoints,
  DisplayFinding,
  DisplayGrid,
  Severity,
} from "~/components/samples/types";
import { formatPlain, roundSignificant } from "~/core/format";
import { standardLabel } from "./sample-input";

/*
 * Presenting a sample in output units: the one place that turns a sample's canonical numbers (psia, °F, ft,
 * canonical property units) into the reader's unit system, for the pages and the API alike.
 *
 * ## The one rounding rule
 *
 * Every number given out here is the canonical value converted with app/core/units (output.ts) and rounded to
 * OUTPUT_SIGNIFICANT_DIGITS (10) significant digits (`outputNumber`): more than any measurement carries, and
 * it drops the binary noise of a conversion (4650 psia is served as 320.6062141 bara, 204 °F as
 * 95.55555556 °C; field units, the canonical ones, pass through unchanged). The API serves these numbers as
 * they are, the same on every route (a sample, the listing, the grids); pages keep them in their loader data
 * and format them only for display, with a named format of app/core/format (`formatMeasured` on the sample
 * and revision pages, `formatListed` in the samples list). Numbers inside sentences (the cells a finding
 * names) are written with `formatPlain`.
 */

/** Significant digits of every number presented in output units (see the rule above). */
export const OUTPUT_SIGNIFICANT_DIGITS = 10;

/** A converted value as presented: rounded to OUTPUT_SIGNIFICANT_DIGITS significant digits. */
export function outputNumber(value: number): number {
  return roundSignificant(value, OUTPUT_SIGNIFICANT_DIGITS);
}

/** A pressure (psia) as presented in the output system. */
export const outputPressure = (psia: number, system: OutputSystem) =>
  outputNumber(toOutputPressure(psia, system));
/** A temperature (°F) as presented in the output system. */
const outputTemperature = (degF: number, system: OutputSystem) =>
  outputNumber(toOutputTemperature(degF, system));

const orNull = <T>(v: T | null, f: (x: T) => number) =>
  v === null ? null : f(v);

/**
 * The fields of a sample record the presenter reads, in canonical units. A listing that does not read the
 * depth or the standard conditions leaves them out, and gets null for them.
 */
type SampleConditions = {
  samplingDepthFt?: number | null;
  reservoirPressurePsia: number | null;
  reservoirTemperatureF: number | null;
  standardPressurePsia?: number;
  standardTemperatureF?: number;
  barometricPressurePsia?: number;
};

/** A sample's conditions in the reader's unit system, with the unit symbols beside them. */
type SampleInOutputUnits = {
  units: { pressure: string; temperature: string; depth: string };
  samplingDepth: number | null;
  reservoirPressure: number | null;
  reservoirTemperature: number | null;
  /** The barometric pressure that makes the report's gauge readings absolute, in the output (absolute) unit. */
  barometricPressure: number | null;
  /**
   * Standard conditions are a fact of the laboratory report, not a reading: they keep their canonical values
   * (the API names them in psia and °F) and are shown by their preset's name.
   */
  standardConditions: {
    pressurePsia: number;
    temperatureF: number;
    label: string;
  } | null;
  /** The bubble points given, in their order. */
  bubblePoints: { temperature: number; pressure: number }[];
  /**
   * The bubble point at (or measured nearest to) the reservoir temperature; the last one given when the
   * reservoir temperature is not recorded; null without bubble points.
   */
  bubblePoint: number | null;
};

/** The one presenter of a sample in output units (see the rounding rule above). */
export function presentSample(
  sample: SampleConditions,
  system: OutputSystem,
  bubblePoints: readonly CanonicalBubblePoint[] = [],
): SampleInOutputUnits {
  const reservoirT = sample.reservoirTemperatureF;
  const nearest =
    reservoirT === null
      ? bubblePoints[bubblePoints.length - 1]
      : bubblePoints
          .slice()
          .sort(
            (a, b) =>
              Math.abs(a.temperatureF - reservoirT) -
              Math.abs(b.temperatureF - reservoirT),
          )[0];
  const pressure = (psia: number) => outputPressure(psia, system);
  const temperature = (degF: number) => outputTemperature(degF, system);
  return {
    units: {
      pressure: unitLabel(system, "pressure"),
      temperature: unitLabel(system, "temperature"),
      depth: depthUnitLabel(system),
    },
    samplingDepth: orNull(sample.samplingDepthFt ?? null, (ft) =>
      outputNumber(toOutputDepth(ft, system)),
    ),
    reservoirPressure: orNull(sample.reservoirPressurePsia, pressure),
    reservoirTemperature: orNull(reservoirT, temperature),
    barometricPressure: orNull(sample.barometricPressurePsia ?? null, pressure),
    standardConditions:
      sample.standardPressurePsia === undefined ||
      sample.standardTemperatureF === undefined
        ? null
        : {
            pressurePsia: sample.standardPressurePsia,
            temperatureF: sample.standardTemperatureF,
            label: standardLabel({
              standardPressurePsia: sample.standardPressurePsia,
              standardTemperatureF: sample.standardTemperatureF,
            }),
          },
    bubblePoints: bubblePoints.map((b) => ({
      temperature: temperature(b.temperatureF),
      pressure: pressure(b.bubblePointPsia),
    })),
    bubblePoint: nearest ? pressure(nearest.bubblePointPsia) : null,
  };
}

/** The standard conditions a sample's report gives its gas volumes on (Rs and Bg are stored on them). */
export function reportBaseOf(sample: {
  standardPressurePsia: number;
  standardTemperatureF: number;
}): ReferenceConditions {
  return {
    pressurePsia: sample.standardPressurePsia,
    temperatureF: sample.standardTemperatureF,
  };
}

/**
 * A grid's axes and values in output units (the API's grids and the pages' grids). Rs and Bg are rebased from
 * the report's standard conditions (`reported`, the sample's; default 60 °F, 14.696 psia) to the output's.
 */
export function gridInOutputUnits(
  grid: Pick<
    CanonicalGrid,
    "property" | "pressures" | "temperatures" | "values"
  >,
  system: OutputSystem,
  reported?: ReferenceConditions,
) {
  return {
    pressures: grid.pressures.map((v) => outputPressure(v, system)),
    temperatures: grid.temperatures.map((v) => outputTemperature(v, system)),
    values: grid.values.map((row) =>
      row.map((v) =>
        v === null
          ? null
          : outputNumber(toOutputValue(v, grid.property, system, reported)),
      ),
    ),
  };
}

/** A grid in canonical units, from a parsed upload or read back from the database. */
export type CanonicalGrid = {
  property: PropertyKey;
  /** Catalogue id of the unit the laboratory used, when known. */
  sourceUnit: string | null;
  pressures: readonly number[];
  temperatures: readonly number[];
  values: ReadonlyArray<ReadonlyArray<number | null>>;
};

export type CanonicalBubblePoint = {
  temperatureF: number;
  bubblePointPsia: number;
};

const TEMPERATURE_TOLERANCE = 0.01;
const samePressure = (a: number, b: number) =>
  Math.abs(a - b) <= 1e-6 * Math.max(Math.abs(a), Math.abs(b), 1);
const RANK: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

function symbolOf(property: PropertyKey, unitId: string | null): string | null {
  if (!unitId) return null;
  try {
    return getUnit(PROPERTY_QUANTITIES[property], unitId).symbol;
  } catch {
    return unitId;
  }
}

function addMark(
  marks: Record<string, CellMark>,
  key: string,
  severity: Severity,
  n: number,
) {
  const mark = marks[key];
  if (!mark) {
    marks[key] = { severity, findings: [n] };
    return;
  }
  if (RANK[severity] < RANK[mark.severity]) mark.severity = severity;
  if (!mark.findings.includes(n)) mark.findings.push(n);
}

/** Findings numbered 1, 2, 3… in the order given (errors first from runQc), with their cells in display units. */
export function presentFindings(
  findings: readonly Finding[],
  system: OutputSystem,
  firstNumber = 1,
): DisplayFinding[] {
  const p = unitLabel(system, "pressure");
  const t = unitLabel(system, "temperature");
  return findings.map((f, index) => {
    const rule = f.rule
      ? (QC_RULES as Record<string, QcRuleInfo>)[f.rule]
      : undefined;
    return {
      n: firstNumber + index,
      code: f.code,
      severity: f.severity,
      message: f.message,
      ...(f.rule ? { rule: f.rule } : {}),
      ...(rule ? { ruleTitle: rule.title } : {}),
      ...(f.source ? { source: f.source } : {}),
      ...(f.location ? { location: { ...f.location } } : {}),
      cells: (f.cells ?? []).map((c) => {
        const name =
          c.property === "bubble_point"
            ? "Bubble point"
            : PROPERTIES[c.property].symbol;
        const at = `${formatPlain(toOutputTemperature(c.temperature, system))} ${t}`;
        return c.property === "bubble_point"
          ? `${name} ${formatPlain(toOutputPressure(c.pressure, system))} ${p} at ${at}`
          : `${name} at ${formatPlain(toOutputPressure(c.pressure, system))} ${p}, ${at}`;
      }),
    };
  });
}

/**
 * Grids in display units, in the usual property order, with the cells that `findings` point at marked.
 * Finding n is findings[n - firstNumber].
 */
export function presentGrids(
  grids: readonly CanonicalGrid[],
  bubblePoints: readonly CanonicalBubblePoint[],
  findings: readonly Finding[],
  system: OutputSystem,
  firstNumber = 1,
  reported?: ReferenceConditions,
): DisplayGrid[] {
  const ordered = PROPERTY_KEYS.map((key) =>
    grids.find((g) => g.property === key),
  ).filter((g): g is CanonicalGrid => !!g);
  const display = ordered.map((g): DisplayGrid => {
    const unit = unitLabel(system, g.property);
    const source = symbolOf(g.property, g.sourceUnit);
    return {
      property: g.property,
      unit,
      sourceUnit: source && source !== unit ? source : null,
      pressureUnit: unitLabel(system, "pressure"),
      temperatureUnit: unitLabel(system, "temperature"),
      ...gridInOutputUnits(g, system, reported),
      bubblePoints: g.temperatures.map((temperature) => {
        const b = bubblePoints.find(
          (bp) =>
            Math.abs(bp.temperatureF - temperature) <= TEMPERATURE_TOLERANCE,
        );
        return b ? outputPressure(b.bubblePointPsia, system) : null;
      }),
      marks: {},
    };
  });
  findings.forEach((f, index) => {
    for (const c of f.cells ?? []) {
      if (c.property === "bubble_point") continue;
      const k = ordered.findIndex((g) => g.property === c.property);
      const grid = ordered[k];
      const shown = display[k];
      if (!grid || !shown) continue;
      const i = grid.pressures.findIndex((pv) => samePressure(pv, c.pressure));
      const j = grid.temperatures.findIndex(
        (tv) => Math.abs(tv - c.temperature) <= TEMPERATURE_TOLERANCE,
      );
      if (i >= 0 && j >= 0)
        addMark(shown.marks, `${i}:${j}`, f.severity, firstNumber + index);
    }
  });
  return display;
}

/** Bubble points in display units, with the ones findings point at marked. */
export function presentBubblePoints(
  bubblePoints: readonly CanonicalBubblePoint[],
  findings: readonly Finding[],
  system: OutputSystem,
  firstNumber = 1,
): DisplayBubblePoints {
  const rows = [...bubblePoints]
    .sort((a, b) => a.temperatureF - b.temperatureF)
    .map((b) => {
      const marks: Record<string, CellMark> = {};
      findings.forEach((f, index) => {
        for (const c of f.cells ?? []) {
          if (
            c.property === "bubble_point" &&
            Math.abs(c.temperature - b.temperatureF) <= TEMPERATURE_TOLERANCE
          ) {
            addMark(marks, "bp", f.severity, firstNumber + index);
          }
        }
      });
      return {
        temperature: outputTemperature(b.temperatureF, system),
        pressure: outputPressure(b.bubblePointPsia, system),
        mark: marks.bp ?? null,
      };
    });
  return {
    pressureUnit: unitLabel(system, "pressure"),
    temperatureUnit: unitLabel(system, "temperature"),
    rows,
  };
}
