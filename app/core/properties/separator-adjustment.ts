/**
 * Adjusting differential-liberation (DL) Bo and Rs to the separator (stock-tank) basis — the "simple ratio"
 * method (Amyx, Bass & Whiting 1960; Moses, JPT 1986; McCain, The Properties of Petroleum Fluids, 1990).
 *
 * Notation (all at reservoir temperature):
 *   Bod, Rsd   DL oil FVF (rb per bbl of residual oil) and solution GOR (scf per bbl residual oil) at p
 *   Bodb, Rsdb the DL values at the bubble point
 *   Bofb, Rsfb bubble-point oil FVF (rb/STB) and total GOR (separator + stock-tank gas, scf/STB) from the
 *              separator test matching the field separator scheme
 *   V/Vb       CCE relative volume above the bubble point
 *
 *   p ≤ pb:  Bo = Bod · Bofb/Bodb;       Rs = Rsfb − (Rsdb − Rsd) · Bofb/Bodb
 *   p > pb:  Bo = (V/Vb) · Bofb;         Rs = Rsfb
 *
 * Units: rb/STB, scf/STB, psia. The method can return a negative Rs at low pressure for volatile oils; the
 * value is returned with a NONPHYSICAL_RESULT warning (an EOS-based conversion is then preferable).
 */
import { PropertyInputError } from "./errors";
import {
  mergeWarnings,
  requireNonNegative,
  requirePositive,
  requirePressure,
  type Estimate,
  type PropertyWarning,
} from "./estimate";
import { formatDecimals } from "../format";

export interface SeparatorAdjustmentBasis {
  /** Bofb: bubble-point oil FVF from the separator test, rb/STB. */
  readonly bofb: number;
  /** Rsfb: separator + stock-tank GOR of the separator test, scf/STB. */
  readonly rsfb: number;
  /** Bodb: DL relative oil volume at the bubble point (rb per residual bbl). */
  readonly bodb: number;
  /** Rsdb: DL solution GOR at the bubble point (scf per residual bbl). */
  readonly rsdb: number;
}

export interface AdjustedPoint {
  /** rb/STB */
  readonly oilFvf: number;
  /** scf/STB */
  readonly solutionGor: number;
}

const METHOD = "dl-to-separator-adjustment";

function validateBasis(basis: SeparatorAdjustmentBasis): void {
  requirePositive("bofb", basis.bofb);
  requireNonNegative("rsfb", basis.rsfb);
  requirePositive("bodb", basis.bodb);
  requireNonNegative("rsdb", basis.rsdb);
}

/** One saturated (p ≤ pb) DL point on the separator basis. */
export function adjustSaturatedPoint(
  basis: SeparatorAdjustmentBasis,
  point: { readonly bod: number; readonly rsd: number },
): Estimate<AdjustedPoint> {
  validateBasis(basis);
  requirePositive("bod", point.bod);
  requireNonNegative("rsd", point.rsd);
  const shrinkage = basis.bofb / basis.bodb;
  const oilFvf = point.bod * shrinkage;
  const solutionGor = basis.rsfb - (basis.rsdb - point.rsd) * shrinkage;
  const warnings: PropertyWarning[] = [];
  if (solutionGor < 0) {
    warnings.push({
      code: "NONPHYSICAL_RESULT",
      method: METHOD,
      input: "result",
      value: solutionGor,
      message: `Adjusted Rs is negative (${formatDecimals(solutionGor, 1)} scf/STB): the ratio method fails here (volatile oil?).`,
    });
  }
  if (point.rsd > basis.rsdb) {
    warnings.push({
      code: "DATA_FLAG",
      method: METHOD,
      input: "rsd",
      value: point.rsd,
      message: `DL Rs ${point.rsd} exceeds its bubble-point value ${basis.rsdb}: is this point above the bubble point?`,
    });
  }
  return { value: { oilFvf, solutionGor }, warnings };
}

/** One undersaturated (p > pb) point from the CCE relative volume V/Vb. */
export function adjustUndersaturatedPoint(
  basis: Pick<SeparatorAdjustmentBasis, "bofb" | "rsfb">,
  point: { readonly relativeVolume: number },
): Estimate<AdjustedPoint> {
  requirePositive("bofb", basis.bofb);
  requireNonNegative("rsfb", basis.rsfb);
  requirePositive("relativeVolume", point.relativeVolume);
  const warnings: PropertyWarning[] = [];
  if (point.relativeVolume > 1) {
    warnings.push({
      code: "DATA_FLAG",
      method: METHOD,
      input: "relativeVolume",
      value: point.relativeVolume,
      message: `V/Vb = ${point.relativeVolume} > 1 above the bubble point: the oil would expand with pressure.`,
    });
  }
  return {
    value: {
      oilFvf: point.relativeVolume * basis.bofb,
      solutionGor: basis.rsfb,
    },
    warnings,
  };
}

export interface AdjustedRow extends AdjustedPoint {
  readonly pressure: number;
  readonly branch: "saturated" | "undersaturated";
}

/**
 * Whole-table conversion: DL points at or below `bubblePoint` and CCE relative volumes above it, merged and
 * sorted by pressure. Pressures in psia.
 */
export function adjustDifferentialLiberation(input: {
  readonly bubblePoint: number;
  readonly basis: SeparatorAdjustmentBasis;
  readonly differential: ReadonlyArray<{
    readonly pressure: number;
    readonly bod: number;
    readonly rsd: number;
  }>;
  readonly relativeVolumes?: ReadonlyArray<{
    readonly pressure: number;
    readonly relativeVolume: number;
  }>;
}): Estimate<AdjustedRow[]> {
  const pb = requirePressure("bubblePoint", input.bubblePoint);
  validateBasis(input.basis);
  const rows: AdjustedRow[] = [];
  let warnings: PropertyWarning[] = [];
  for (const point of input.differential) {
    requirePressure("differential.pressure", point.pressure);
    if (point.pressure > pb) {
      throw new PropertyInputError(
        "OUT_OF_DOMAIN",
        "differential.pressure",
        point.pressure,
        `DL point at ${point.pressure} psia lies above the bubble point ${pb} psia; give it as a CCE relative volume.`,
      );
    }
    const adjusted = adjustSaturatedPoint(input.basis, point);
    rows.push({
      pressure: point.pressure,
      branch: "saturated",
      ...adjusted.value,
    });
    warnings = mergeWarnings(warnings, adjusted.warnings);
  }
  for (const point of input.relativeVolumes ?? []) {
    requirePressure("relativeVolumes.pressure", point.pressure);
    if (point.pressure <= pb) continue; // below pb the DL data govern
    const adjusted = adjustUndersaturatedPoint(input.basis, point);
    rows.push({
      pressure: point.pressure,
      branch: "undersaturated",
      ...adjusted.value,
    });
    warnings = mergeWarnings(warnings, adjusted.warnings);
  }
  rows.sort((a, b) => a.pressure - b.pressure);
  return { value: rows, warnings };
}
