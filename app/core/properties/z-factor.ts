/**
 * Gas compressibility (z) factor from reduced temperature and pressure, two equation-of-state fits to the
 * Standing–Katz (1942) chart, each solved with a bracketed root finder (Brent's method) that always
 * converges. When the equation has several roots the lowest-density (gas) root is taken: the bracket is
 * scanned from zero density upwards for the first sign change.
 *
 * Hall & Yarborough (1973), Oil & Gas Journal. With t = 1/Tpr, solve for the reduced density y ∈ (0, 1):
 *   F(y) = −A ppr + (y + y² + y³ − y⁴)/(1 − y)³ − B y² + C y^D = 0
 *   A = 0.06125 t exp[−1.2 (1 − t)²],  B = t (14.76 − 9.76 t + 4.58 t²),
 *   C = t (90.7 − 242.2 t + 42.4 t²),  D = 2.18 + 2.82 t;   z = A ppr / y
 *   F(0) = −A ppr < 0 and F → +∞ as y → 1, so a root is always bracketed. Not recommended for Tpr < 1.
 *
 * Dranchuk & Abou-Kassem (1975), JCPT 14 (doi 10.2118/75-03-03). With ρr = 0.27 ppr/(z Tpr):
 *   z = 1 + (A1 + A2/Tpr + A3/Tpr³ + A4/Tpr⁴ + A5/Tpr⁵) ρr + (A6 + A7/Tpr + A8/Tpr²) ρr²
 *         − A9 (A7/Tpr + A8/Tpr²) ρr⁵ + A10 (1 + A11 ρr²)(ρr²/Tpr³) exp(−A11 ρr²)
 *   A1..A11 = 0.3265, −1.0700, −0.5339, 0.01569, −0.05165, 0.5475, −0.7361, 0.1844, 0.1056, 0.6134, 0.7210.
 *   Solved as g(ρr) = ρr·z(ρr) − 0.27 ppr/Tpr = 0: g(0) < 0 and g → +∞ (the ρr⁶ term is positive for
 *   Tpr > 0.26), so a root is always bracketed.
 *   Stated range (recalled): 0.2 ≤ ppr < 30 with 1.0 < Tpr ≤ 3.0, and ppr < 1.0 with 0.7 < Tpr ≤ 1.0.
 *
 * Inputs below Tpr = 0.5 are rejected (far outside both fits, and the bracketing argument needs Tpr > 0.26).
 */
import { PropertyInputError } from "./errors";
import {
  mergeWarnings,
  rangeWarnings,
  requireFinite,
  requireNonNegative,
  type Estimate,
  type PropertyWarning,
  type ValidityRanges,
} from "./estimate";
import {
  pseudoCritical,
  reducedConditions,
  type PseudoCritical,
  type PseudoCriticalMethod,
} from "./pseudo-critical";
import { solveFirstRoot } from "./solve-bracketed";
import { formatPrecision } from "../format";

export interface ZFactorEstimate extends Estimate {
  /** Reduced density at the solution (y for Hall–Yarborough, ρr for Dranchuk–Abou-Kassem). */
  readonly reducedDensity: number;
  /** Residual of the solved equation at the root. */
  readonly residual: number;
  readonly iterations: number;
}

export const HALL_YARBOROUGH_RANGES: ValidityRanges = {
  tpr: {
    input: "reduced temperature",
    unit: "–",
    min: 1.0,
    max: 3.0,
    source:
      "not recommended below Tpr = 1 (domain brief §3.5); upper bound of the Standing–Katz chart it fits (from memory)",
  },
  ppr: {
    input: "reduced pressure",
    unit: "–",
    min: 0,
    max: 15,
    source: "Standing–Katz chart coverage, ppr 0–15 (from memory)",
  },
};

const MIN_TPR = 0.5;
/** Below this reduced pressure z = 1 is returned (|z − 1| < 1e-8 there; avoids a 0/0 at subnormal ppr). */
const IDEAL_GAS_PPR = 1e-9;

function validateReduced(tpr: number, ppr: number): void {
  requireFinite("tpr", tpr);
  requireNonNegative("ppr", ppr);
  if (tpr < MIN_TPR) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "tpr",
      tpr,
      `Reduced temperature ${tpr} is below ${MIN_TPR}: far outside both z-factor fits (Tpr ≥ 0.7–1.0).`,
    );
  }
}

export function hallYarboroughZ(input: {
  readonly tpr: number;
  readonly ppr: number;
}): ZFactorEstimate {
  const { tpr, ppr } = input;
  validateReduced(tpr, ppr);
  const warnings = rangeWarnings(
    "hall-yarborough-1973-z-factor",
    HALL_YARBOROUGH_RANGES,
    { tpr, ppr },
  );
  if (ppr < IDEAL_GAS_PPR)
    return {
      value: 1,
      warnings,
      reducedDensity: 0,
      residual: 0,
      iterations: 0,
    };
  const t = 1 / tpr;
  const a = 0.06125 * t * Math.exp(-1.2 * (1 - t) ** 2);
  const b = t * (14.76 - 9.76 * t + 4.58 * t * t);
  const c = t * (90.7 - 242.2 * t + 42.4 * t * t);
  const d = 2.18 + 2.82 * t;
  const f = (y: number): number =>
    -a * ppr +
    (y + y * y + y ** 3 - y ** 4) / (1 - y) ** 3 -
    b * y * y +
    c * y ** d;
  const root = solveFirstRoot(f, 0, 1 - 1e-9, 400);
  return {
    value: (a * ppr) / root.root,
    warnings,
    reducedDensity: root.root,
    residual: root.residual,
    iterations: root.iterations,
  };
}

const DAK = [
  0.3265, -1.07, -0.5339, 0.01569, -0.05165, 0.5475, -0.7361, 0.1844, 0.1056,
  0.6134, 0.721,
] as const;

function dakWarnings(tpr: number, ppr: number): PropertyWarning[] {
  const inMain = tpr > 1.0 && tpr <= 3.0 && ppr >= 0.2 && ppr < 30;
  const inLow = tpr > 0.7 && tpr <= 1.0 && ppr < 1.0;
  const inLowPressure = tpr > 1.0 && tpr <= 3.0 && ppr < 0.2; // below the fitted range, z ≈ 1: benign
  if (inMain || inLow || inLowPressure) return [];
  return [
    {
      code: "OUTSIDE_CORRELATION_RANGE",
      method: "dranchuk-abou-kassem-1975-z-factor",
      input: "reduced temperature and pressure",
      message:
        `Tpr = ${formatPrecision(tpr, 4)}, ppr = ${formatPrecision(ppr, 4)} is outside the Dranchuk–Abou-Kassem range ` +
        "(0.2 ≤ ppr < 30 with 1.0 < Tpr ≤ 3.0; ppr < 1.0 with 0.7 < Tpr ≤ 1.0); the value is an extrapolation.",
    },
  ];
}

export function dranchukAbouKassemZ(input: {
  readonly tpr: number;
  readonly ppr: number;
}): ZFactorEstimate {
  const { tpr, ppr } = input;
  validateReduced(tpr, ppr);
  const warnings = dakWarnings(tpr, ppr);
  if (ppr < IDEAL_GAS_PPR)
    return {
      value: 1,
      warnings,
      reducedDensity: 0,
      residual: 0,
      iterations: 0,
    };
  const [a1, a2, a3, a4, a5, a6, a7, a8, a9, a10, a11] = DAK;
  const c1 = a1 + a2 / tpr + a3 / tpr ** 3 + a4 / tpr ** 4 + a5 / tpr ** 5;
  const c2 = a6 + a7 / tpr + a8 / tpr ** 2;
  const c3 = a9 * (a7 / tpr + a8 / tpr ** 2);
  const c4 = a10 / tpr ** 3;
  const zOf = (r: number): number =>
    1 +
    c1 * r +
    c2 * r * r -
    c3 * r ** 5 +
    c4 * (1 + a11 * r * r) * r * r * Math.exp(-a11 * r * r);
  const target = (0.27 * ppr) / tpr;
  const g = (r: number): number => r * zOf(r) - target;
  let upper = 1;
  while (g(upper) <= 0) {
    upper *= 2;
    if (upper > 1e6) {
      throw new PropertyInputError(
        "OUT_OF_DOMAIN",
        "ppr",
        ppr,
        `No Dranchuk–Abou-Kassem root found for ppr = ${ppr}.`,
      );
    }
  }
  const root = solveFirstRoot(g, 0, upper, 400);
  return {
    value: target / root.root,
    warnings,
    reducedDensity: root.root,
    residual: root.residual,
    iterations: root.iterations,
  };
}

export type ZFactorMethod = "hall_yarborough" | "dranchuk_abou_kassem";

/**
 * z-factor at (pressure psia, temperature °F) of a gas of specific gravity `gasGravity`, with the
 * pseudo-critical correlation and EOS fit chosen (defaults: Sutton, Dranchuk–Abou-Kassem).
 */
export function gasZFactor(input: {
  readonly pressure: number;
  readonly temperature: number;
  readonly gasGravity: number;
  readonly method?: ZFactorMethod;
  readonly pseudoCritical?: PseudoCriticalMethod;
}): ZFactorEstimate & {
  readonly pseudoCritical: PseudoCritical;
  readonly tpr: number;
  readonly ppr: number;
} {
  const critical = pseudoCritical(
    input.gasGravity,
    input.pseudoCritical ?? "sutton",
  );
  const { tpr, ppr } = reducedConditions(
    input.pressure,
    input.temperature,
    critical.value,
  );
  const z =
    (input.method ?? "dranchuk_abou_kassem") === "hall_yarborough"
      ? hallYarboroughZ({ tpr, ppr })
      : dranchukAbouKassemZ({ tpr, ppr });
  return {
    ...z,
    warnings: mergeWarnings(critical.warnings, z.warnings),
    pseudoCritical: critical.value,
    tpr,
    ppr,
  };
}
