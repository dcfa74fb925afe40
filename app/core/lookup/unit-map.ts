/**
 * The unit conversions of a lookup, reduced to one multiply-add per number: every conversion between the
 * canonical system and the field or metric system (including the change of standard conditions for gas
 * volumes) is affine, so its two coefficients are taken once from app/core/units and reused per point.
 */
import {
  CANONICAL_UNIT_SYSTEM,
  convertBetweenSystems,
  type Quantity,
  type UnitSystem,
} from "../units";

/** canonical = value · scale + offset; value = (canonical − offset) / scale. */
export type Affine = { readonly scale: number; readonly offset: number };

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
