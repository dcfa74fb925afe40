/**
 * Saturated-branch relations (p ≤ pb):
 *
 *   Two-phase (total) FVF:      Bt = Bo + Bg (Rsb − Rs)                         (rb/STB; Bg in rb/scf)
 *   Apparent compressibility:   co = −(1/Bo) dBo/dp + (Bg/Bo) dRs/dp            (1/psi)
 *   Consistency (inequality) test: dBo/dp < Bg · dRs/dp on every saturated interval — i.e. the total
 *   system compressibility is positive. A violation means the Bo, Rs and Bg data cannot all be right.
 *
 * Units: canonical (psia, rb/STB, scf/STB, rb/scf). For the test, derivatives are finite differences over
 * each interval between consecutive pressures; Bg and Bo are interval means (a Bg missing at one end — e.g.
 * at the bubble point, where no gas has been liberated — uses the other end's value).
 */
import { PropertyInputError } from "./errors";
import {
  requireNonNegative,
  requirePositive,
  requirePressure,
  type Estimate,
} from "./estimate";

/** Two-phase formation volume factor (rb/STB). */
export function totalFvf(input: {
  readonly oilFvf: number;
  /** rb/scf */
  readonly gasFvf: number;
  readonly solutionGorAtBubblePoint: number;
  readonly solutionGor: number;
}): Estimate {
  requirePositive("oilFvf", input.oilFvf);
  requirePositive("gasFvf", input.gasFvf);
  requireNonNegative(
    "solutionGorAtBubblePoint",
    input.solutionGorAtBubblePoint,
  );
  requireNonNegative("solutionGor", input.solutionGor);
  const bt =
    input.oilFvf +
    input.gasFvf * (input.solutionGorAtBubblePoint - input.solutionGor);
  return {
    value: bt,
    warnings:
      input.solutionGor > input.solutionGorAtBubblePoint
        ? [
            {
              code: "DATA_FLAG",
              method: "two-phase-fvf",
              input: "solutionGor",
              value: input.solutionGor,
              message:
                "Rs exceeds Rsb: the point is not on the saturated branch.",
            },
          ]
        : [],
  };
}

export interface SaturatedPoint {
  /** psia */
  readonly pressure: number;
  /** rb/STB */
  readonly oilFvf: number;
  /** scf/STB */
  readonly solutionGor: number;
  /** rb/scf, or null where not reported (e.g. at the bubble point) */
  readonly gasFvf: number | null;
}

export interface ConsistencyInterval {
  readonly pressureLow: number;
  readonly pressureHigh: number;
  /** dBo/dp, rb/STB per psi */
  readonly oilFvfSlope: number;
  /** Bg·dRs/dp, rb/STB per psi */
  readonly gasTermSlope: number;
  readonly gasFvf: number;
  /** −(1/Bo) dBo/dp + (Bg/Bo) dRs/dp, 1/psi */
  readonly apparentCompressibility: number;
  readonly passes: boolean;
}

export interface ConsistencyResult {
  readonly intervals: readonly ConsistencyInterval[];
  readonly violations: readonly ConsistencyInterval[];
  readonly passed: boolean;
}

/** The inequality test dBo/dp < Bg·dRs/dp over every interval of a saturated table. */
export function saturatedConsistencyTest(
  points: readonly SaturatedPoint[],
): ConsistencyResult {
  if (points.length < 2) {
    throw new PropertyInputError(
      "INSUFFICIENT_DATA",
      "points",
      points.length,
      "The test needs at least two saturated points.",
    );
  }
  for (const pt of points) {
    requirePressure("pressure", pt.pressure);
    requirePositive("oilFvf", pt.oilFvf);
    requireNonNegative("solutionGor", pt.solutionGor);
    if (pt.gasFvf !== null) requirePositive("gasFvf", pt.gasFvf);
  }
  const sorted = [...points].sort((a, b) => a.pressure - b.pressure);
  const intervals: ConsistencyInterval[] = [];
  for (let i = 1; i < sorted.length; i++) {
    const lo = sorted[i - 1];
    const hi = sorted[i];
    if (!lo || !hi) continue;
    const dp = hi.pressure - lo.pressure;
    if (dp === 0) {
      throw new PropertyInputError(
        "OUT_OF_DOMAIN",
        "pressure",
        hi.pressure,
        `Duplicated pressure ${hi.pressure} psia.`,
      );
    }
    const bgs = [lo.gasFvf, hi.gasFvf].filter((b): b is number => b !== null);
    if (bgs.length === 0) {
      throw new PropertyInputError(
        "INSUFFICIENT_DATA",
        "gasFvf",
        null,
        `No gas FVF at either end of the interval ${lo.pressure}–${hi.pressure} psia.`,
      );
    }
    const bg = bgs.reduce((s, b) => s + b, 0) / bgs.length;
    const bo = (lo.oilFvf + hi.oilFvf) / 2;
    const oilFvfSlope = (hi.oilFvf - lo.oilFvf) / dp;
    const gasTermSlope = (bg * (hi.solutionGor - lo.solutionGor)) / dp;
    intervals.push({
      pressureLow: lo.pressure,
      pressureHigh: hi.pressure,
      oilFvfSlope,
      gasTermSlope,
      gasFvf: bg,
      apparentCompressibility: (-oilFvfSlope + gasTermSlope) / bo,
      passes: oilFvfSlope < gasTermSlope,
    });
  }
  const violations = intervals.filter((iv) => !iv.passes);
  return { intervals, violations, passed: violations.length === 0 };
}
