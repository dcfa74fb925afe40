/**
 * Trend rules, per temperature and split at the bubble point:
 *   rs-saturated-rising, rs-undersaturated-flat, bo-saturated-rising, bo-undersaturated-falling, bg-falling,
 *   oil-viscosity-saturated-falling, oil-viscosity-undersaturated-rising, oil-density-undersaturated-rising,
 *   gas-viscosity-rising,
 *   oil-viscosity-temperature, bubble-point-temperature, undersaturated-compressibility.
 */
import { PROPERTIES, type PropertyKey } from "../../units";
import type { QcCell, QcFindingCode, Severity } from "../types";
import {
  cell,
  samePressure,
  TEMPERATURE_TOLERANCE,
  type BubbleAt,
  type Point,
  type QcContext,
} from "./context";
import { formatReading } from "../../format";
import { pairWithUnit } from "./format";
import type { RuleId } from "./rules";

/** Points at or below pb (saturated) or at or above pb (undersaturated). */
export function branchOf(
  points: readonly Point[],
  bubble: BubbleAt,
  branch: "saturated" | "undersaturated",
): Point[] {
  const pb = bubble.pressure;
  return points.filter((pt) =>
    branch === "saturated"
      ? pt.pressure <= pb || samePressure(pt.pressure, pb)
      : pt.pressure >= pb || samePressure(pt.pressure, pb),
  );
}

interface TrendRule {
  readonly rule: RuleId;
  readonly code: QcFindingCode;
  readonly severity: Severity;
  readonly property: PropertyKey;
  readonly branch: "saturated" | "undersaturated" | "all";
  readonly direction: "rising" | "falling";
  /** Completes "…; <expectation>." */
  readonly expectation: string;
}

const TREND_RULES: readonly TrendRule[] = [
  {
    rule: "rs-saturated-rising",
    code: "RS_NOT_RISING_BELOW_PB",
    severity: "error",
    property: "solution_gor",
    branch: "saturated",
    direction: "rising",
    expectation:
      "below the bubble point Rs must rise with pressure as more gas dissolves",
  },
  {
    rule: "bo-saturated-rising",
    code: "BO_NOT_RISING_BELOW_PB",
    severity: "error",
    property: "oil_fvf",
    branch: "saturated",
    direction: "rising",
    expectation:
      "below the bubble point Bo must rise with pressure as the oil swells with dissolved gas",
  },
  {
    rule: "bo-undersaturated-falling",
    code: "BO_NOT_FALLING_ABOVE_PB",
    severity: "error",
    property: "oil_fvf",
    branch: "undersaturated",
    direction: "falling",
    expectation:
      "above the bubble point Bo must fall with pressure as the liquid is compressed",
  },
  {
    rule: "bg-falling",
    code: "BG_NOT_FALLING",
    severity: "error",
    property: "gas_fvf",
    branch: "all",
    direction: "falling",
    expectation: "Bg must fall as pressure rises",
  },
  {
    rule: "oil-viscosity-saturated-falling",
    code: "OIL_VISCOSITY_NOT_FALLING_BELOW_PB",
    severity: "warning",
    property: "oil_viscosity",
    branch: "saturated",
    direction: "falling",
    expectation:
      "below the bubble point oil viscosity should fall as pressure rises and more gas dissolves",
  },
  {
    rule: "oil-viscosity-undersaturated-rising",
    code: "OIL_VISCOSITY_NOT_RISING_ABOVE_PB",
    severity: "warning",
    property: "oil_viscosity",
    branch: "undersaturated",
    direction: "rising",
    expectation:
      "above the bubble point oil viscosity should rise with pressure",
  },
  {
    rule: "oil-density-undersaturated-rising",
    code: "OIL_DENSITY_NOT_RISING_ABOVE_PB",
    severity: "warning",
    property: "oil_density",
    branch: "undersaturated",
    direction: "rising",
    expectation:
      "above the bubble point the oil is only compressed, so its density should rise with pressure",
  },
  {
    rule: "gas-viscosity-rising",
    code: "GAS_VISCOSITY_NOT_RISING",
    severity: "warning",
    property: "gas_viscosity",
    branch: "all",
    direction: "rising",
    expectation: "gas viscosity should rise with pressure",
  },
];

export function checkPressureTrends(ctx: QcContext): void {
  for (const t of ctx.temperatures) {
    const bubble = ctx.bubbleAt(t);
    for (const r of TREND_RULES) {
      const all = ctx.series(r.property, t);
      if (all.length < 2) continue;
      let points: Point[];
      if (r.branch === "all") points = all;
      else if (!bubble) continue;
      else points = branchOf(all, bubble, r.branch);
      for (let i = 1; i < points.length; i++) {
        const a = points[i - 1];
        const b = points[i];
        if (!a || !b) continue;
        const delta = b.value - a.value;
        const wrong = r.direction === "rising" ? delta < 0 : delta > 0;
        if (!wrong) continue;
        const [va, vb] = pairWithUnit(
          a.value,
          b.value,
          ctx.grid(r.property)?.unit,
          ctx.meta.barometricPsia,
        );
        const where =
          r.branch === "all" || !bubble
            ? ""
            : ` (bubble point ${ctx.p(bubble.pressure, r.property)})`;
        ctx.add(
          r.rule,
          r.code,
          r.severity,
          [cell(r.property, a.pressure, t), cell(r.property, b.pressure, t)],
          `Between ${ctx.p(a.pressure, r.property)} and ${ctx.p(b.pressure, r.property)} at ${ctx.t(t, r.property)}, ${PROPERTIES[r.property].subject} ${delta < 0 ? "falls" : "rises"} from ${va} to ${vb}; ${r.expectation}${where}.`,
        );
      }
    }
    if (bubble) {
      checkRsFlat(ctx, t, bubble);
      checkUndersaturatedCompressibility(ctx, t, bubble);
    }
  }
  checkViscosityWithTemperature(ctx);
  checkBubblePointWithTemperature(ctx);
}

/** rs-undersaturated-flat: above pb every Rs equals Rsb. */
function checkRsFlat(ctx: QcContext, t: number, bubble: BubbleAt): void {
  if (bubble.lowerBound) return;
  const under = branchOf(
    ctx.series("solution_gor", t),
    bubble,
    "undersaturated",
  );
  const reference =
    under.find((pt) => samePressure(pt.pressure, bubble.pressure)) ?? under[0];
  if (!reference || under.length < 2) return;
  const rsb = reference.value;
  const tol = Math.max(0.005 * Math.abs(rsb), 1);
  const off = under.filter(
    (pt) => pt !== reference && Math.abs(pt.value - rsb) > tol,
  );
  const first = off[0];
  if (!first) return;
  const [v1, v0] = pairWithUnit(
    first.value,
    rsb,
    ctx.grid("solution_gor")?.unit,
  );
  ctx.add(
    "rs-undersaturated-flat",
    "RS_NOT_FLAT_ABOVE_PB",
    "warning",
    [
      cell("solution_gor", reference.pressure, t),
      ...off.map((pt) => cell("solution_gor", pt.pressure, t)),
    ],
    `At ${ctx.t(t, "solution_gor")}, Rs is ${v1} at ${ctx.p(first.pressure, "solution_gor")} but ${v0} at ${ctx.p(reference.pressure, "solution_gor")}${off.length > 1 ? ` (${off.length} values differ)` : ""}; above the bubble point (${ctx.p(bubble.pressure, "solution_gor")}) Rs should stay equal to Rsb, so check the bubble point or these values.`,
  );
}

/** Shortest pressure step (psi) over which co is computed; shorter steps are merged, so reading noise is not amplified. */
const MIN_COMPRESSIBILITY_STEP = 250;

/** undersaturated-compressibility: co from Bo above pb, over steps of at least 250 psi, within 2–60 × 10⁻⁶ 1/psi. */
function checkUndersaturatedCompressibility(
  ctx: QcContext,
  t: number,
  bubble: BubbleAt,
): void {
  if (bubble.lowerBound) return;
  const under = branchOf(ctx.series("oil_fvf", t), bubble, "undersaturated");
  let i = 0;
  while (i < under.length - 1) {
    const a = under[i];
    let k = i + 1;
    while (
      k < under.length - 1 &&
      (under[k]?.pressure ?? 0) - (a?.pressure ?? 0) < MIN_COMPRESSIBILITY_STEP
    )
      k++;
    const b = under[k];
    i = k;
    if (!a || !b || !(a.value > 0) || !(b.value > 0)) continue;
    const co = -Math.log(b.value / a.value) / (b.pressure - a.pressure);
    if (co <= 0) continue; // Bo rising: reported by bo-undersaturated-falling.
    if (co >= 2e-6 && co <= 60e-6) continue;
    ctx.add(
      "undersaturated-compressibility",
      "UNDERSATURATED_COMPRESSIBILITY",
      "warning",
      [cell("oil_fvf", a.pressure, t), cell("oil_fvf", b.pressure, t)],
      `Between ${ctx.p(a.pressure, "oil_fvf")} and ${ctx.p(b.pressure, "oil_fvf")} at ${ctx.t(t, "oil_fvf")}, Bo implies an oil compressibility of ${formatReading(co * 1e6, 3)} × 10⁻⁶ 1/psi, outside the usual 2 to 60 × 10⁻⁶ 1/psi above the bubble point.`,
    );
  }
}

/** oil-viscosity-temperature: at each pressure, μo falls from one temperature to the next. */
function checkViscosityWithTemperature(ctx: QcContext): void {
  const grid = ctx.grid("oil_viscosity");
  if (!grid || grid.temperatures.length < 2) return;
  for (let j = 1; j < grid.temperatures.length; j++) {
    const t0 = grid.temperatures[j - 1];
    const t1 = grid.temperatures[j];
    if (t0 === undefined || t1 === undefined) continue;
    const cells: QcCell[] = [];
    let example: { p: number; a: number; b: number } | undefined;
    grid.pressures.forEach((p, i) => {
      const a = grid.values[i]?.[j - 1];
      const b = grid.values[i]?.[j];
      if (typeof a !== "number" || typeof b !== "number" || !(b > a)) return;
      cells.push(cell("oil_viscosity", p, t0), cell("oil_viscosity", p, t1));
      example ??= { p, a, b };
    });
    if (!example) continue;
    const [va, vb] = pairWithUnit(example.a, example.b, grid.unit);
    const more =
      cells.length > 2
        ? ` (and at ${cells.length / 2 - 1} other pressure${cells.length > 4 ? "s" : ""})`
        : "";
    ctx.add(
      "oil-viscosity-temperature",
      "OIL_VISCOSITY_NOT_FALLING_WITH_T",
      "warning",
      cells,
      `At ${ctx.p(example.p, "oil_viscosity")}${more}, the oil viscosity rises from ${va} at ${ctx.t(t0, "oil_viscosity")} to ${vb} at ${ctx.t(t1, "oil_viscosity")}; oil viscosity should fall as temperature rises.`,
    );
  }
}

/** bubble-point-temperature: stated bubble points rise with temperature. */
function checkBubblePointWithTemperature(ctx: QcContext): void {
  const stated = [...ctx.bubble.values()]
    .filter((b) => b.origin !== "inferred")
    .sort((a, b) => a.temperature - b.temperature);
  for (let i = 1; i < stated.length; i++) {
    const a = stated[i - 1];
    const b = stated[i];
    if (!a || !b || b.temperature - a.temperature <= TEMPERATURE_TOLERANCE)
      continue;
    if (b.pressure >= a.pressure) continue;
    ctx.add(
      "bubble-point-temperature",
      "BUBBLE_POINT_NOT_RISING_WITH_T",
      "warning",
      [
        cell("bubble_point", a.pressure, a.temperature),
        cell("bubble_point", b.pressure, b.temperature),
      ],
      `The bubble point falls from ${ctx.p(a.pressure)} at ${ctx.t(a.temperature)} to ${ctx.p(b.pressure)} at ${ctx.t(b.temperature)}; for a black oil it should rise with temperature.`,
    );
  }
}
