/**
 * Refused points of a lookup: a point that cannot be served gets `refused: { code, message }` in place of a
 * value, and every other point of the batch is still answered. The codes, the physical limits behind
 * `impossible-value`, and the engine error that explains a refusal (re-run for that point only).
 */
import {
  interpolateGrid,
  InterpolationError,
  type Grid,
  type Method,
} from "../interpolation";
import type { PropertyKey } from "../units";

export const LOOKUP_REFUSAL_CODES = [
  "outside-measured-range",
  "no-measured-values",
  "extrapolation-too-far",
  "impossible-value",
] as const;

export type LookupRefusalCode = (typeof LOOKUP_REFUSAL_CODES)[number];

/** Codes in `refusals` arrays: 0 = served, k = LOOKUP_REFUSAL_CODES[k − 1] (1–3 are the engine's codes). */
export const REFUSED_OUTSIDE = 1;
export const REFUSED_NO_VALUES = 2;
export const REFUSED_TOO_FAR = 3;
export const REFUSED_IMPOSSIBLE = 4;

/** The refusal code of entry k of a refusals array (k ≥ 1). */
export function refusalCode(k: number): LookupRefusalCode {
  return LOOKUP_REFUSAL_CODES[k - 1]!;
}

/**
 * Physical lower limits (domain brief §2.1, §6): volume factors, viscosities, density and z are positive;
 * the solution gas–oil ratio is zero or more. `strict`: the value must exceed `min` (else reach it).
 */
export const PHYSICAL_LIMITS: Readonly<
  Record<PropertyKey, { min: number; strict: boolean; rule: string }>
> = {
  oil_fvf: { min: 0, strict: true, rule: "a volume factor is above zero" },
  solution_gor: {
    min: 0,
    strict: false,
    rule: "a gas-oil ratio is zero or more",
  },
  oil_viscosity: { min: 0, strict: true, rule: "a viscosity is above zero" },
  oil_density: { min: 0, strict: true, rule: "a density is above zero" },
  gas_fvf: { min: 0, strict: true, rule: "a volume factor is above zero" },
  gas_viscosity: { min: 0, strict: true, rule: "a viscosity is above zero" },
  z_factor: {
    min: 0,
    strict: true,
    rule: "a compressibility factor is above zero",
  },
};

/** Whether a canonical value of `property` is physically possible (NaN is not judged here: false). */
export function isPossible(property: PropertyKey, value: number): boolean {
  const l = PHYSICAL_LIMITS[property];
  return l.strict ? value > l.min : value >= l.min;
}

/**
 * The engine error behind a refusal by the engine (codes 1–3), for its details and message: the single
 * point is interpolated again (only refused points pay for this). `pointIndex` is put in the details.
 * Null if the point is, after all, served (it should not be).
 */
export function engineRefusal(
  grid: Grid,
  pressure: number,
  temperature: number,
  options: {
    method: Method;
    degree: [number, number];
    extrapolate: boolean;
    maxExtrapolation: number;
  },
  pointIndex: number,
): InterpolationError | null {
  try {
    interpolateGrid(grid, { pressure, temperature }, options);
    return null;
  } catch (error) {
    if (!(error instanceof InterpolationError)) throw error;
    return new InterpolationError(error.code, error.message, {
      ...error.details,
      pointIndex,
    });
  }
}
