import {
  getUnit,
  type OutputSystem,
  PROPERTIES,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  type PropertyKey,
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
import { roundSignificant } from "~/core/format";

/*
 * Turns canonical grids and QC findings into what the sample components show: numbers in the reader's unit
 * system (rounded to 10 significant digits to drop conversion noise), and each flagged cell keyed by its place.
 */

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

const round = (v: number) => roundSignificant(v, 10);
/** Numbers inside sentences: 6 significant digits. */
const short = (v: number) => roundSignificant(v, 6);
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
        const at = `${short(toOutputTemperature(c.temperature, system))} ${t}`;
        return c.property === "bubble_point"
          ? `${name} ${short(toOutputPressure(c.pressure, system))} ${p} at ${at}`
          : `${name} at ${short(toOutputPressure(c.pressure, system))} ${p}, ${at}`;
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
      pressures: g.pressures.map((v) => round(toOutputPressure(v, system))),
      temperatures: g.temperatures.map((v) =>
        round(toOutputTemperature(v, system)),
      ),
      values: g.values.map((row) =>
        row.map((v) =>
          v === null ? null : round(toOutputValue(v, g.property, system)),
        ),
      ),
      bubblePoints: g.temperatures.map((temperature) => {
        const b = bubblePoints.find(
          (bp) =>
            Math.abs(bp.temperatureF - temperature) <= TEMPERATURE_TOLERANCE,
        );
        return b ? round(toOutputPressure(b.bubblePointPsia, system)) : null;
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
        temperature: round(toOutputTemperature(b.temperatureF, system)),
        pressure: round(toOutputPressure(b.bubblePointPsia, system)),
        mark: marks.bp ?? null,
      };
    });
  return {
    pressureUnit: unitLabel(system, "pressure"),
    temperatureUnit: unitLabel(system, "temperature"),
    rows,
  };
}
