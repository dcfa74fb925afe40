/**
 * Mass-balance oil density at reservoir conditions: the mass of one stock-tank barrel plus its dissolved gas,
 * divided by its reservoir volume Bo.
 *
 *   ρo = ( ρw γo + (Ma,air γg / Vm) · Rs / 5.614583 ) / Bo        (lb/ft³)
 *
 * ρw = 62.366 lb/ft³ (water at 60 °F); Vm = R Tsc / psc = 379.48 scf/lbmol at 60 °F, 14.696 psia; with these
 * the gas term is 0.013594 γg Rs. γo is the stock-tank oil specific gravity (from °API), γg the gravity of
 * the dissolved (total separator) gas, Rs in scf/STB, Bo in rb/STB. Standard definitions (McCain 1990).
 */
import {
  CUBIC_FOOT_PER_BARREL,
  FIELD_STANDARD_CONDITIONS,
  GAS_CONSTANT_FIELD,
  MOLAR_MASS_AIR,
  RANKINE_OFFSET,
  apiToSpecificGravity,
  assertStandardConditions,
  type StandardConditions,
} from "../units";
import {
  requireApi,
  requireNonNegative,
  requirePositive,
  type Estimate,
} from "./estimate";

/** Density of water at 60 °F, lb/ft³ (999.0 kg/m³). */
export const WATER_DENSITY_60F = 62.366;

export function massBalanceOilDensity(input: {
  readonly apiGravity: number;
  readonly gasGravity: number;
  /** scf/STB */
  readonly solutionGor: number;
  /** rb/STB */
  readonly oilFvf: number;
  readonly standardConditions?: StandardConditions;
  /** lb/ft³, default 62.366 */
  readonly waterDensity?: number;
}): Estimate {
  requireApi("apiGravity", input.apiGravity);
  requirePositive("gasGravity", input.gasGravity);
  requireNonNegative("solutionGor", input.solutionGor);
  requirePositive("oilFvf", input.oilFvf);
  const rhoW = requirePositive(
    "waterDensity",
    input.waterDensity ?? WATER_DENSITY_60F,
  );
  const sc = input.standardConditions ?? FIELD_STANDARD_CONDITIONS;
  assertStandardConditions(sc);
  const molarVolume =
    (GAS_CONSTANT_FIELD * (sc.temperatureF + RANKINE_OFFSET)) / sc.pressurePsia; // scf/lbmol
  const gasMassPerFt3Oil =
    ((MOLAR_MASS_AIR * input.gasGravity) / molarVolume) *
    (input.solutionGor / CUBIC_FOOT_PER_BARREL);
  const rho =
    (rhoW * apiToSpecificGravity(input.apiGravity) + gasMassPerFt3Oil) /
    input.oilFvf;
  return { value: rho, warnings: [] };
}
