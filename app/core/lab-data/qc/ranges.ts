/**
 * Rule plausible-range: values outside physical limits are errors, values outside the usual black-oil
 * bands are warnings. Bands in canonical units (psia, °F, rb/STB, scf/STB, cP, lb/ft³, rb/scf, –).
 */
import { PROPERTY_KEYS, type PropertyKey } from "../../units";
import { HEADER_LABELS } from "../header-names";
import type { QcCell, Severity } from "../types";
import { cell, type QcContext } from "./context";

const G_CM3 = 62.42796057614462; // lb/ft³ per g/cm³

interface Band {
  /** Values at or below `rejectAtOrBelow`, or below `rejectBelow`, or above `rejectAbove` are errors. */
  readonly rejectAtOrBelow?: number;
  readonly rejectBelow?: number;
  readonly rejectAbove?: number;
  readonly warnBelow?: number;
  readonly warnAbove?: number;
  /** Why the warning band matters, appended to the sentence. */
  readonly warnWhy?: string;
}

/** Common-practice bands for black oils and their gases (see rules.ts, plausible-range). */
export const PLAUSIBLE_BANDS: Readonly<Record<PropertyKey, Band>> = {
  oil_fvf: {
    rejectAtOrBelow: 0,
    warnBelow: 1.0,
    warnAbove: 2.5,
    warnWhy: "volatile oils can reach 2–3, but check the unit",
  },
  solution_gor: {
    rejectBelow: 0,
    warnAbove: 1750,
    warnWhy:
      "above about 1750 scf/STB the fluid is likely a volatile oil, and above 3300 a gas condensate",
  },
  oil_viscosity: { rejectAtOrBelow: 0, warnBelow: 0.05, warnAbove: 1000 },
  oil_density: {
    rejectAtOrBelow: 0,
    rejectAbove: 1.1 * G_CM3,
    warnBelow: 0.45 * G_CM3,
    warnAbove: 1.0 * G_CM3,
  },
  gas_fvf: { rejectAtOrBelow: 0 },
  gas_viscosity: { rejectAtOrBelow: 0, warnBelow: 0.008, warnAbove: 0.06 },
  z_factor: { rejectAtOrBelow: 0, warnBelow: 0.3, warnAbove: 2.0 },
};

const PRESSURE_BAND: Band = {
  rejectAtOrBelow: 0,
  warnBelow: 14.6,
  warnAbove: 20_000,
  warnWhy: "below one atmosphere or above the usual high-pressure range",
};
const TEMPERATURE_BAND: Band = {
  rejectBelow: -40,
  rejectAbove: 700,
  warnBelow: 40,
  warnAbove: 450,
};
const BUBBLE_POINT_BAND: Band = {
  rejectAtOrBelow: 0,
  warnAbove: 8000,
  warnWhy: "bubble points this high suggest a near-critical or volatile fluid",
};

function classify(value: number, band: Band): Severity | null {
  if (band.rejectAtOrBelow !== undefined && value <= band.rejectAtOrBelow)
    return "error";
  if (band.rejectBelow !== undefined && value < band.rejectBelow)
    return "error";
  if (band.rejectAbove !== undefined && value > band.rejectAbove)
    return "error";
  if (band.warnBelow !== undefined && value < band.warnBelow) return "warning";
  if (band.warnAbove !== undefined && value > band.warnAbove) return "warning";
  return null;
}

function bandText(
  band: Band,
  severity: Severity,
  show: (x: number) => string,
): string {
  if (severity === "error") {
    const parts: string[] = [];
    if (band.rejectAtOrBelow !== undefined)
      parts.push(`above ${show(band.rejectAtOrBelow)}`);
    if (band.rejectBelow !== undefined)
      parts.push(`at least ${show(band.rejectBelow)}`);
    if (band.rejectAbove !== undefined)
      parts.push(`at most ${show(band.rejectAbove)}`);
    return `physically it must be ${parts.join(" and ")}`;
  }
  const range =
    band.warnBelow !== undefined && band.warnAbove !== undefined
      ? `${show(band.warnBelow)} to ${show(band.warnAbove)}`
      : band.warnAbove !== undefined
        ? `up to ${show(band.warnAbove)}`
        : `from ${show(band.warnBelow ?? 0)}`;
  return `the usual range is ${range}${band.warnWhy ? ` (${band.warnWhy})` : ""}`;
}

export function checkRanges(ctx: QcContext): void {
  for (const key of PROPERTY_KEYS) {
    const grid = ctx.grid(key);
    if (!grid) continue;
    const band = PLAUSIBLE_BANDS[key];
    grid.temperatures.forEach((t, j) => {
      const groups = new Map<
        Severity,
        { cells: QcCell[]; values: number[]; pressures: number[] }
      >();
      grid.pressures.forEach((p, i) => {
        const v = grid.values[i]?.[j];
        if (typeof v !== "number") return;
        const severity = classify(v, band);
        if (!severity) return;
        const g = groups.get(severity) ?? {
          cells: [],
          values: [],
          pressures: [],
        };
        g.cells.push(cell(key, p, t));
        g.values.push(v);
        g.pressures.push(p);
        groups.set(severity, g);
      });
      for (const [severity, g] of groups) {
        const label = HEADER_LABELS[key];
        const why = bandText(band, severity, (x) => ctx.v(key, x));
        const first = g.values[0] ?? 0;
        const firstP = g.pressures[0] ?? 0;
        const message =
          g.cells.length === 1
            ? `The ${label} ${ctx.v(key, first)} at ${ctx.p(firstP, key)} and ${ctx.t(t, key)} is implausible: ${why}.`
            : `${g.cells.length} ${label} values at ${ctx.t(t, key)} (${ctx.v(key, Math.min(...g.values))} to ${ctx.v(key, Math.max(...g.values))}) are implausible: ${why}; check the unit in the header.`;
        ctx.add(
          "plausible-range",
          severity === "error" ? "OUT_OF_RANGE" : "IMPLAUSIBLE",
          severity,
          g.cells,
          message,
        );
      }
    });
  }

  // Axes: every distinct pressure and temperature once.
  const pressures = new Map<number, QcCell>();
  for (const key of PROPERTY_KEYS) {
    const grid = ctx.grid(key);
    if (!grid) continue;
    for (const p of grid.pressures)
      if (!pressures.has(p))
        pressures.set(p, cell(key, p, grid.temperatures[0] ?? 0));
  }
  for (const [p, c] of pressures) {
    const severity = classify(p, PRESSURE_BAND);
    if (severity) {
      ctx.add(
        "plausible-range",
        severity === "error" ? "OUT_OF_RANGE" : "IMPLAUSIBLE",
        severity,
        [c],
        `The pressure ${ctx.p(p)} is implausible: ${bandText(PRESSURE_BAND, severity, (x) => ctx.p(x))}.`,
      );
    }
  }
  for (const t of ctx.temperatures) {
    const severity = classify(t, TEMPERATURE_BAND);
    if (severity) {
      const owner = PROPERTY_KEYS.find((k) =>
        ctx.grid(k)?.temperatures.includes(t),
      );
      const first = owner ? ctx.grid(owner)?.pressures[0] : undefined;
      ctx.add(
        "plausible-range",
        severity === "error" ? "OUT_OF_RANGE" : "IMPLAUSIBLE",
        severity,
        owner && first !== undefined ? [cell(owner, first, t)] : [],
        `The temperature ${ctx.t(t)} is implausible for reservoir fluids: ${bandText(TEMPERATURE_BAND, severity, (x) => ctx.t(x))}.`,
      );
    }
  }
  for (const b of ctx.bubble.values()) {
    if (b.origin === "inferred") continue;
    const severity = classify(b.pressure, BUBBLE_POINT_BAND);
    if (severity) {
      ctx.add(
        "plausible-range",
        severity === "error" ? "OUT_OF_RANGE" : "IMPLAUSIBLE",
        severity,
        [cell("bubble_point", b.pressure, b.temperature)],
        `The bubble point ${ctx.p(b.pressure)} at ${ctx.t(b.temperature)} is implausible: ${bandText(BUBBLE_POINT_BAND, severity, (x) => ctx.p(x))}.`,
      );
    }
  }
}
