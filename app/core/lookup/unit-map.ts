/**
 * The unit conversions of a lookup, reduced to one multiply-add per number: every conversion between the
 * canonical system and the field or metric system (including the change of standard conditions for gas
 * volumes) is affine, so its two coefficients are taken once from app/core/units and reused per point.
 */
import {
  CANONICAL_UNIT_SYSTEM,
  FIELD_UNIT_SYSTEM,
  METRIC_UNIT_SYSTEM,
  PROPERTY_QUANTITIES,
  convertBetweenSystems,
  getUnit,
  type PropertyKey,
  type Quantity,
  type UnitSystem,
} from "../units";

export type LookupUnits = "field" | "metric";

export const LOOKUP_UNITS: readonly LookupUnits[] = ["field", "metric"];

/** canonical = value · scale + offset; value = (canonical − offset) / scale. */
export type Affine = { readonly scale: number; readonly offset: number };

/** A unit as shown: the catalogue id (ASCII, e.g. "ft3/scf") and the display symbol (e.g. "ft³/scf"). */
export type UnitLabel = { readonly id: string; readonly symbol: string };

export function unitSystemOf(units: LookupUnits): UnitSystem {
  return units === "metric" ? METRIC_UNIT_SYSTEM : FIELD_UNIT_SYSTEM;
}

const affineCache = new Map<string, Affine>();

/** Coefficients taking a value of `quantity` in `system` to the canonical unit. */
export function affineToCanonical(
  quantity: Quantity,
  system: UnitSystem,
): Affine {
  const key = `${system.id}|${quantity}`;
  let hit = affineCache.get(key);
  if (!hit) {
    const at0 = convertBetweenSystems(
      0,
      quantity,
      system,
      CANONICAL_UNIT_SYSTEM,
    );
    const at1 = convertBetweenSystems(
      1,
      quantity,
      system,
      CANONICAL_UNIT_SYSTEM,
    );
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

export function unitLabel(quantity: Quantity, system: UnitSystem): UnitLabel {
  const id = system.units[quantity];
  return Object.freeze({ id, symbol: getUnit(quantity, id).symbol });
}

export function propertyQuantity(property: PropertyKey): Quantity {
  return PROPERTY_QUANTITIES[property];
}

/** Plain names of the properties, for messages and table headers. */
export const PROPERTY_NAMES: Readonly<Record<PropertyKey, string>> =
  Object.freeze({
    oil_fvf: "oil formation volume factor (Bo)",
    solution_gor: "solution gas-oil ratio (Rs)",
    oil_viscosity: "oil viscosity",
    oil_density: "oil density",
    gas_fvf: "gas formation volume factor (Bg)",
    gas_viscosity: "gas viscosity",
    z_factor: "gas compressibility factor (z)",
  });
