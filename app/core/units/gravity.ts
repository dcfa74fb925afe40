/**
 * Stock-tank oil gravity: °API ↔ specific gravity (60 °F/60 °F, water = 1), and gas gravity ↔ molar mass.
 *
 * API = 141.5 / SG − 131.5 and SG = 141.5 / (API + 131.5): the definition of API gravity (water = 10 °API).
 * Gas specific gravity is relative to air: γg = Ma / 28.9647 (molar mass of air, a convention).
 */
import { MOLAR_MASS_AIR } from "./definitions";
import { UnitError } from "./errors";

function assertFinite(value: number, what: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new UnitError(
      "NOT_FINITE",
      `${what} must be a finite number, got ${String(value)}.`,
      { value },
    );
  }
}

/** Specific gravity (60/60 °F) of a stock-tank oil of the given °API. */
export function apiToSpecificGravity(api: number): number {
  assertFinite(api, "API gravity");
  if (api <= -131.5) {
    throw new UnitError(
      "INVALID_GRAVITY",
      `API gravity must be above −131.5, got ${api}.`,
      { value: api },
    );
  }
  return 141.5 / (api + 131.5);
}

/** °API of a liquid with the given specific gravity (60/60 °F). */
export function specificGravityToApi(specificGravity: number): number {
  assertFinite(specificGravity, "Specific gravity");
  if (specificGravity <= 0) {
    throw new UnitError(
      "INVALID_GRAVITY",
      `Specific gravity must be > 0, got ${specificGravity}.`,
      {
        value: specificGravity,
      },
    );
  }
  return 141.5 / specificGravity - 131.5;
}

/** Apparent molar mass (g/mol = lb/lbmol) of a gas of the given specific gravity (air = 1). */
export function gasGravityToMolarMass(gasGravity: number): number {
  assertFinite(gasGravity, "Gas gravity");
  if (gasGravity <= 0) {
    throw new UnitError(
      "INVALID_GRAVITY",
      `Gas gravity must be > 0, got ${gasGravity}.`,
      { value: gasGravity },
    );
  }
  return gasGravity * MOLAR_MASS_AIR;
}

/** Gas specific gravity (air = 1) from apparent molar mass in g/mol. */
export function molarMassToGasGravity(molarMass: number): number {
  assertFinite(molarMass, "Molar mass");
  if (molarMass <= 0) {
    throw new UnitError(
      "INVALID_GRAVITY",
      `Molar mass must be > 0, got ${molarMass}.`,
      { value: molarMass },
    );
  }
  return molarMass / MOLAR_MASS_AIR;
}
