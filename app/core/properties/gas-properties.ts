/**
 * Gas formation volume factor and density from z, and gas viscosity by Lee, Gonzalez & Eakin (1966).
 *
 * Bg = (psc/Tsc) · z T / p                 (reservoir volume per standard volume; p, T absolute)
 *      returned in rb/scf (canonical): ft³/scf ÷ 5.614583. With 14.696 psia and 519.67 °R this is
 *      0.0282795 zT/p ft³/scf = 0.0050368 zT/p rb/scf. The standard conditions are an input (default
 *      60 °F, 14.696 psia): lab tables often use another base (e.g. 14.65 psia).
 * ρg = p Ma / (z R T)                      (lb/ft³; Ma = 28.9647 γg lb/lbmol; R = 10.7316 psia·ft³/(lbmol·°R))
 *
 * Lee, Gonzalez & Eakin (1966), "The Viscosity of Natural Gases", JPT 18 (SPE-1340-PA), original
 * coefficients (not the later refit):
 *   μg = 10⁻⁴ K exp(X ρ^Y) cP,  ρ in g/cm³
 *   K = (9.4 + 0.02 Ma) T^1.5 / (209 + 19 Ma + T),  X = 3.5 + 986/T + 0.01 Ma,  Y = 2.4 − 0.2 X   (T in °R)
 *   Data (recalled): four natural gases, 100–340 °F, 100–8000 psia; standard deviation ≈ 2.7 %.
 *   Not for sour or high-CO2 gases without correction.
 */
import {
  CUBIC_FOOT_PER_BARREL,
  FIELD_STANDARD_CONDITIONS,
  GAS_CONSTANT_FIELD,
  LB_PER_FT3_PER_G_PER_CM3,
  RANKINE_OFFSET,
  assertStandardConditions,
  gasGravityToMolarMass,
  type StandardConditions,
} from "../units";
import { PropertyInputError } from "./errors";
import {
  rangeWarnings,
  requirePositive,
  requirePressure,
  requireTemperature,
  type Estimate,
  type ValidityRanges,
} from "./estimate";

/** Gas FVF in rb/scf (canonical). */
export function gasFvf(input: {
  readonly pressure: number;
  readonly temperature: number;
  readonly z: number;
  readonly standardConditions?: StandardConditions;
}): Estimate {
  const p = requirePressure("pressure", input.pressure);
  const tR = requireTemperature("temperature", input.temperature);
  const z = requirePositive("z", input.z);
  const sc = input.standardConditions ?? FIELD_STANDARD_CONDITIONS;
  assertStandardConditions(sc);
  const ft3PerScf =
    ((sc.pressurePsia / (sc.temperatureF + RANKINE_OFFSET)) * z * tR) / p;
  return { value: ft3PerScf / CUBIC_FOOT_PER_BARREL, warnings: [] };
}

function molarMassOf(input: {
  readonly gasGravity?: number;
  readonly molarMass?: number;
}): number {
  if (input.molarMass !== undefined)
    return requirePositive("molarMass", input.molarMass);
  if (input.gasGravity !== undefined)
    return gasGravityToMolarMass(
      requirePositive("gasGravity", input.gasGravity),
    );
  throw new PropertyInputError(
    "OUT_OF_DOMAIN",
    "gasGravity",
    undefined,
    "Give gasGravity (air = 1) or molarMass (g/mol).",
  );
}

/** Gas density in lb/ft³ at reservoir conditions. */
export function gasDensity(input: {
  readonly pressure: number;
  readonly temperature: number;
  readonly z: number;
  readonly gasGravity?: number;
  readonly molarMass?: number;
}): Estimate {
  const p = requirePressure("pressure", input.pressure);
  const tR = requireTemperature("temperature", input.temperature);
  const z = requirePositive("z", input.z);
  const ma = molarMassOf(input);
  return { value: (p * ma) / (z * GAS_CONSTANT_FIELD * tR), warnings: [] };
}

export const LEE_GONZALEZ_EAKIN_RANGES: ValidityRanges = {
  temperature: {
    input: "temperature",
    unit: "°F",
    min: 100,
    max: 340,
    source:
      "Lee, Gonzalez & Eakin (1966) data, recalled (domain brief §3.7, from memory)",
  },
  pressure: {
    input: "pressure",
    unit: "psia",
    min: 100,
    max: 8000,
    source:
      "Lee, Gonzalez & Eakin (1966) data, recalled (domain brief §3.7, from memory)",
  },
};

export interface GasViscosityEstimate extends Estimate {
  readonly k: number;
  readonly x: number;
  readonly y: number;
}

/**
 * Gas viscosity (cP) at `temperature` (°F) and gas density `gasDensity` (lb/ft³). `pressure` (psia) is
 * optional and used only for the data-range warning.
 */
export function leeGonzalezEakinViscosity(input: {
  readonly temperature: number;
  readonly gasDensity: number;
  readonly gasGravity?: number;
  readonly molarMass?: number;
  readonly pressure?: number;
}): GasViscosityEstimate {
  const tR = requireTemperature("temperature", input.temperature);
  const rho = requirePositive("gasDensity", input.gasDensity);
  if (input.pressure !== undefined) requirePressure("pressure", input.pressure);
  const ma = molarMassOf(input);
  const k = ((9.4 + 0.02 * ma) * tR ** 1.5) / (209 + 19 * ma + tR);
  const x = 3.5 + 986 / tR + 0.01 * ma;
  const y = 2.4 - 0.2 * x;
  const mu = 1e-4 * k * Math.exp(x * (rho / LB_PER_FT3_PER_G_PER_CM3) ** y);
  const warnings = rangeWarnings(
    "lee-gonzalez-eakin-1966-gas-viscosity",
    LEE_GONZALEZ_EAKIN_RANGES,
    {
      temperature: input.temperature,
      pressure: input.pressure,
    },
  );
  return { value: mu, warnings, k, x, y };
}
