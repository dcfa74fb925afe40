/**
 * Pseudo-critical temperature and pressure of a natural gas from its specific gravity (air = 1).
 * Temperatures here are absolute (°R), pressures psia; reduced properties are Tpr = T/Tpc, ppr = p/ppc.
 *
 * Sutton (1985), "Compressibility Factors for High-Molecular-Weight Reservoir Gases", SPE-14265-MS:
 *   Tpc = 169.2 + 349.5 γg − 74.0 γg²  (°R);   ppc = 756.8 − 131.0 γg − 3.6 γg²  (psia)
 *   264 gas samples, 0.57 < γg < 1.68; sweet hydrocarbon gases (apply a sour-gas correction otherwise).
 *
 * Standing (1977, Volumetric and Phase Behavior of Oil Field Hydrocarbon Systems), coefficients recalled
 * (domain brief §3.4, from memory — verify against the book):
 *   natural gas:    Tpc = 168 + 325 γg − 12.5 γg²;   ppc = 677 + 15.0 γg − 37.5 γg²
 *   gas condensate: Tpc = 187 + 330 γg − 71.5 γg²;   ppc = 706 − 51.7 γg − 11.1 γg²
 *   No data range is stated in our sources, so these return no range warnings.
 */
import { RANKINE_OFFSET } from "../units";
import {
  rangeWarnings,
  requirePositive,
  requirePressure,
  requireTemperature,
  type Estimate,
  type ValidityRanges,
} from "./estimate";

export interface PseudoCritical {
  /** Pseudo-critical temperature, °R (absolute). */
  readonly temperatureR: number;
  /** Pseudo-critical pressure, psia. */
  readonly pressurePsia: number;
}

export const SUTTON_RANGES: ValidityRanges = {
  gasGravity: {
    input: "gas gravity",
    unit: "air = 1",
    min: 0.57,
    max: 1.68,
    source: "Sutton (1985), 264 gas samples (domain brief §3.4)",
  },
};

export type PseudoCriticalMethod =
  "sutton" | "standing_natural_gas" | "standing_condensate";

export function suttonPseudoCritical(input: {
  readonly gasGravity: number;
}): Estimate<PseudoCritical> {
  const g = requirePositive("gasGravity", input.gasGravity);
  return {
    value: {
      temperatureR: 169.2 + 349.5 * g - 74.0 * g * g,
      pressurePsia: 756.8 - 131.0 * g - 3.6 * g * g,
    },
    warnings: rangeWarnings("sutton-1985-pseudo-critical", SUTTON_RANGES, {
      gasGravity: g,
    }),
  };
}

export function standingPseudoCritical(input: {
  readonly gasGravity: number;
  readonly system?: "natural_gas" | "condensate";
}): Estimate<PseudoCritical> {
  const g = requirePositive("gasGravity", input.gasGravity);
  const value =
    (input.system ?? "natural_gas") === "natural_gas"
      ? {
          temperatureR: 168 + 325 * g - 12.5 * g * g,
          pressurePsia: 677 + 15.0 * g - 37.5 * g * g,
        }
      : {
          temperatureR: 187 + 330 * g - 71.5 * g * g,
          pressurePsia: 706 - 51.7 * g - 11.1 * g * g,
        };
  return { value, warnings: [] };
}

export function pseudoCritical(
  gasGravity: number,
  method: PseudoCriticalMethod = "sutton",
): Estimate<PseudoCritical> {
  switch (method) {
    case "sutton":
      return suttonPseudoCritical({ gasGravity });
    case "standing_natural_gas":
      return standingPseudoCritical({ gasGravity, system: "natural_gas" });
    case "standing_condensate":
      return standingPseudoCritical({ gasGravity, system: "condensate" });
  }
}

/** Reduced temperature and pressure at (pressure psia, temperature °F). */
export function reducedConditions(
  pressure: number,
  temperature: number,
  critical: PseudoCritical,
): { readonly tpr: number; readonly ppr: number } {
  requirePressure("pressure", pressure);
  requireTemperature("temperature", temperature);
  return {
    tpr: (temperature + RANKINE_OFFSET) / critical.temperatureR,
    ppr: pressure / critical.pressurePsia,
  };
}
