/**
 * Standing (1947), "A Pressure-Volume-Temperature Correlation for Mixtures of California Oils and Gases",
 * API Drilling & Production Practice: bubble-point pressure, solution GOR and saturated oil FVF.
 *
 * Units: pressure psia, temperature °F, Rs scf/STB, Bo rb/STB, γg gas gravity (air = 1), API °API.
 *
 *   pb = 18.2 [ (Rs/γg)^0.83 · 10^a − 1.4 ],       a = 0.00091 T − 0.0125 API
 *   Rs = γg [ (p/18.2 + 1.4) · 10^x ]^1.2048,       x = 0.0125 API − 0.00091 T
 *   Bo = 0.9759 + 0.00012 [ Rs (γg/γo)^0.5 + 1.25 T ]^1.2
 *
 * Bo form: we implement the 0.9759 + 0.00012 F^1.2 form (the algebraic fit usually printed for Standing's
 * 1947 chart). A second form, 0.972 + 1.47×10⁻⁴ F^1.175, also circulates; the two differ by ~0.7 %.
 *
 * The Rs form is the inverse of the pb form with 1/0.83 rounded to 1.2048, so Rs → pb → Rs closes only to
 * ~0.2 psi at 2000 psia. `standingSaturationPressure` is the exact inverse of the Rs form, for callers that
 * need Rs(pb) = Rsb exactly (the sample generator).
 *
 * Data range (105 bubble points of California crude-oil/gas systems): pb 130–7000 psia, T 100–258 °F,
 * Rs 20–1425 scf/STB, API 16.5–63.8, γg 0.59–0.95.
 */
import { apiToSpecificGravity } from "../units";
import { PropertyInputError } from "./errors";
import {
  rangeWarnings,
  requireApi,
  requireNonNegative,
  requirePositive,
  requirePressure,
  requireTemperature,
  type Estimate,
  type PropertyWarning,
  type ValidityRanges,
} from "./estimate";
import { formatDecimals } from "../format";

const SOURCE = "Standing (1947) data range, as quoted in the domain brief §3.1";

export const STANDING_RANGES: ValidityRanges = {
  pressure: {
    input: "pressure",
    unit: "psia",
    min: 130,
    max: 7000,
    source: SOURCE,
  },
  bubblePoint: {
    input: "bubble point",
    unit: "psia",
    min: 130,
    max: 7000,
    source: SOURCE,
  },
  temperature: {
    input: "temperature",
    unit: "°F",
    min: 100,
    max: 258,
    source: SOURCE,
  },
  solutionGor: {
    input: "solution GOR",
    unit: "scf/STB",
    min: 20,
    max: 1425,
    source: SOURCE,
  },
  apiGravity: {
    input: "API gravity",
    unit: "°API",
    min: 16.5,
    max: 63.8,
    source: SOURCE,
  },
  gasGravity: {
    input: "gas gravity",
    unit: "air = 1",
    min: 0.59,
    max: 0.95,
    source: SOURCE,
  },
};

export interface StandingFluid {
  /** Gas specific gravity, air = 1. */
  readonly gasGravity: number;
  /** Stock-tank oil gravity, °API. */
  readonly apiGravity: number;
  /** °F */
  readonly temperature: number;
}

function validateFluid(input: StandingFluid): void {
  requirePositive("gasGravity", input.gasGravity);
  requireApi("apiGravity", input.apiGravity);
  requireTemperature("temperature", input.temperature);
}

function nonPhysical(
  method: string,
  input: string,
  value: number,
  message: string,
): PropertyWarning {
  return { code: "NONPHYSICAL_RESULT", method, input, value, message };
}

/** Bubble-point pressure (psia) of an oil with solution GOR `solutionGor` (scf/STB). */
export function standingBubblePoint(
  input: StandingFluid & { readonly solutionGor: number },
): Estimate {
  validateFluid(input);
  requirePositive("solutionGor", input.solutionGor);
  const {
    solutionGor: rs,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
  } = input;
  const a = 0.00091 * t - 0.0125 * api;
  const pb = 18.2 * ((rs / gg) ** 0.83 * 10 ** a - 1.4);
  const method = "standing-1947-bubble-point";
  const warnings = rangeWarnings(method, STANDING_RANGES, {
    solutionGor: rs,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
    bubblePoint: pb,
  });
  if (pb <= 0)
    warnings.push(
      nonPhysical(
        method,
        "result",
        pb,
        `Bubble point ${formatDecimals(pb, 1)} psia is not positive: Rs is too small for this method.`,
      ),
    );
  return { value: pb, warnings };
}

/** Solution GOR (scf/STB) of a saturated oil at `pressure` (psia, at or below the bubble point). */
export function standingSolutionGor(
  input: StandingFluid & { readonly pressure: number },
): Estimate {
  validateFluid(input);
  requirePressure("pressure", input.pressure);
  const {
    pressure: p,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
  } = input;
  const x = 0.0125 * api - 0.00091 * t;
  const rs = gg * ((p / 18.2 + 1.4) * 10 ** x) ** 1.2048;
  const method = "standing-1947-solution-gor";
  const warnings = rangeWarnings(method, STANDING_RANGES, {
    pressure: p,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
    solutionGor: rs,
  });
  return { value: rs, warnings };
}

/**
 * Exact inverse of `standingSolutionGor`: the pressure (psia) at which Standing's Rs form gives
 * `solutionGor`. Differs from `standingBubblePoint` by the rounding of 1/0.83 (≈0.2 psi at 2000 psia).
 */
export function standingSaturationPressure(
  input: StandingFluid & { readonly solutionGor: number },
): Estimate {
  validateFluid(input);
  requirePositive("solutionGor", input.solutionGor);
  const {
    solutionGor: rs,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
  } = input;
  const x = 0.0125 * api - 0.00091 * t;
  const p = 18.2 * ((rs / gg) ** (1 / 1.2048) * 10 ** -x - 1.4);
  const method = "standing-1947-solution-gor-inverse";
  const warnings = rangeWarnings(method, STANDING_RANGES, {
    solutionGor: rs,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
    bubblePoint: p,
  });
  if (p <= 0)
    warnings.push(
      nonPhysical(
        method,
        "result",
        p,
        `Saturation pressure ${formatDecimals(p, 1)} psia is not positive: Rs is too small for this method.`,
      ),
    );
  return { value: p, warnings };
}

/** Saturated oil FVF (rb/STB) at solution GOR `solutionGor` — the 0.9759 + 0.00012 F^1.2 form. */
export function standingOilFvf(
  input: StandingFluid & { readonly solutionGor: number },
): Estimate {
  validateFluid(input);
  requireNonNegative("solutionGor", input.solutionGor);
  const {
    solutionGor: rs,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
  } = input;
  const gammaO = apiToSpecificGravity(api);
  const f = rs * Math.sqrt(gg / gammaO) + 1.25 * t;
  if (f < 0) {
    // only at temperatures far below 0 °F with little gas: the fractional power is undefined
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "temperature",
      t,
      `Standing's Bo is undefined at ${t} °F with Rs = ${rs} scf/STB (negative correlating group).`,
    );
  }
  const bo = 0.9759 + 0.00012 * f ** 1.2;
  const warnings = rangeWarnings("standing-1947-oil-fvf", STANDING_RANGES, {
    solutionGor: rs,
    gasGravity: gg,
    apiGravity: api,
    temperature: t,
  });
  return { value: bo, warnings };
}
