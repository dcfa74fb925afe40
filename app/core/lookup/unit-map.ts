/**
 * The unit conversions of a lookup, reduced to one multiply-add per number: every conversion between the
 * canonical system and the field or metric system (including the change of standard conditions for gas
 * volumes and the barometric offset of gauge pressures) is affine, so its two coefficients are taken once
 * from app/core/units and reused per point.
 *
 * The stored side is the sample's: canonical units (psia, °F, scf/STB, rb/scf, …) with Rs and Bg on the
 * report's own standard conditions (`UnitBasis.standardConditions`; default 60 °F, 14.696 psia).
 */
import {
  canonicalUnitSystemOn,
  CANONICAL_UNIT_SYSTEM,
  convert,
  convertBetweenSystems,
  DEFAULT_SAMPLE_BAROMETRIC_PSIA,
  PRESSURE_BASES,
  type PressureBasis,
  type Quantity,
  type ReferenceConditions,
  type UnitSystem,
} from "../units";
import { LookupError } from "./errors";

/** canonical = value · scale + offset; value = (canonical − offset) / scale. */
export type Affine = { readonly scale: number; readonly offset: number };

/** What the stored numbers refer to, and how the caller's pressures are written. */
export type UnitBasis = {
  /** Standard conditions of the stored Rs and Bg (the sample's); default 60 °F, 14.696 psia. */
  readonly standardConditions?: ReferenceConditions;
  /** Pressures in and out as absolute (psia, bara; the default) or gauge (psig, barg). */
  readonly pressureBasis?: PressureBasis;
  /** Barometric pressure of gauge readings, psia (the sample's); default 14.696. */
  readonly barometricPressurePsia?: number;
};

const affineCache = new Map<string, Affine>();

const GAS_VOLUMES: ReadonlySet<Quantity> = new Set<Quantity>([
  "gas_oil_ratio",
  "gas_fvf",
]);

/**
 * Coefficients taking a value of `quantity` in `system` to the stored (canonical) unit. Without `basis` the
 * stored side is the canonical system itself (60 °F, 14.696 psia; absolute pressures).
 */
export function affineToCanonical(
  quantity: Quantity,
  system: UnitSystem,
  basis?: UnitBasis,
): Affine {
  const sc = GAS_VOLUMES.has(quantity) ? basis?.standardConditions : undefined;
  const gauge =
    quantity === "pressure" && basis?.pressureBasis === "gauge"
      ? (basis.barometricPressurePsia ?? DEFAULT_SAMPLE_BAROMETRIC_PSIA)
      : undefined;
  const key = `${system.id}|${quantity}|${sc ? `${sc.pressurePsia}|${sc.temperatureF}` : ""}|${gauge ?? ""}`;
  let hit = affineCache.get(key);
  if (!hit) {
    const stored = sc ? canonicalUnitSystemOn(sc) : CANONICAL_UNIT_SYSTEM;
    const at = (v: number) =>
      gauge !== undefined
        ? convert(
            v,
            "pressure",
            system.units.pressure === "bara" ? "barg" : "psig",
            "psia",
            { barometricPsia: gauge },
          )
        : convertBetweenSystems(v, quantity, system, stored);
    const at0 = at(0);
    const at1 = at(1);
    hit = Object.freeze({ scale: at1 - at0, offset: at0 });
    affineCache.set(key, hit);
  }
  return hit;
}

export function toCanonicalWith(a: Affine, value: number): number {
  return value * a.scale + a.offset;
}

export function fromCanonicalWith(a: Affine, canonical: number): number {
  return (canonical - a.offset) / a.scale;
}

const MAX_BAROMETRIC_PSIA = 50;

/**
 * Checks the unit basis of lookup options (standardConditions, pressureBasis, barometricPressurePsia); throws
 * LookupError INVALID_OPTIONS naming the field.
 */
export function normalizeUnitBasis(options: UnitBasis): UnitBasis {
  const {
    standardConditions: sc,
    pressureBasis,
    barometricPressurePsia,
  } = options;
  const bad = (field: string, message: string) =>
    new LookupError("INVALID_OPTIONS", message, { field });
  if (
    pressureBasis !== undefined &&
    !(PRESSURE_BASES as readonly unknown[]).includes(pressureBasis)
  )
    throw bad(
      "pressureBasis",
      `pressureBasis must be 'absolute' or 'gauge'; got ${JSON.stringify(pressureBasis)}.`,
    );
  if (
    barometricPressurePsia !== undefined &&
    !(
      typeof barometricPressurePsia === "number" &&
      barometricPressurePsia > 0 &&
      barometricPressurePsia <= MAX_BAROMETRIC_PSIA
    )
  )
    throw bad(
      "barometricPressurePsia",
      `barometricPressurePsia must be a number above 0 and at most ${MAX_BAROMETRIC_PSIA} psia; got ${JSON.stringify(barometricPressurePsia)}.`,
    );
  if (sc !== undefined) {
    const p: unknown = sc?.pressurePsia;
    const t: unknown = sc?.temperatureF;
    if (
      typeof p !== "number" ||
      !(p > 0 && p <= MAX_BAROMETRIC_PSIA) ||
      typeof t !== "number" ||
      !(t > -459.67 && t < 1000)
    )
      throw bad(
        "standardConditions",
        `standardConditions must be { pressurePsia, temperatureF }: a pressure above 0 and at most ${MAX_BAROMETRIC_PSIA} psia, a temperature above absolute zero; got ${JSON.stringify(sc)}.`,
      );
  }
  return {
    ...(sc ? { standardConditions: sc } : {}),
    pressureBasis: pressureBasis ?? "absolute",
    barometricPressurePsia:
      barometricPressurePsia ?? DEFAULT_SAMPLE_BAROMETRIC_PSIA,
  };
}
