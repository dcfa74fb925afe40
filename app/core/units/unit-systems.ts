/**
 * Unit systems: the canonical internal system and two presets for display and import/export
 * (field and metric). Each maps every quantity to one catalogue unit and carries its standard conditions.
 *
 * Property keys, names and quantities live in properties.ts.
 */
import {
  CANONICAL_UNITS,
  convert,
  type ConversionOptions,
  type Quantity,
  type UnitId,
} from "./catalogue";
import { PROPERTY_QUANTITIES, type PropertyKey } from "./properties";
import {
  FIELD_STANDARD_CONDITIONS,
  METRIC_STANDARD_CONDITIONS,
  rebaseStandardVolume,
  standardConditionsLabel,
  type ReferenceConditions,
  type StandardConditions,
} from "./standard-conditions";

export type UnitSystemUnits = { readonly [Q in Quantity]: UnitId<Q> };

export interface UnitSystem {
  readonly id: "canonical" | "field" | "metric";
  readonly label: string;
  readonly units: UnitSystemUnits;
  readonly standardConditions: StandardConditions;
}

export const CANONICAL_UNIT_SYSTEM: UnitSystem = Object.freeze({
  id: "canonical",
  label:
    "Canonical (internal): psia, °F, rb/STB, rb/scf, scf/STB, cP, lb/ft³, 1/psi",
  units: CANONICAL_UNITS,
  standardConditions: FIELD_STANDARD_CONDITIONS,
});

/**
 * The canonical units with the gas volumes referred to another base: how a sample's stored values read. Rs and
 * Bg are stored in scf/STB and rb/scf but on the report's own standard conditions (an upload converts units,
 * never the base), so converting them out starts from this system, not from CANONICAL_UNIT_SYSTEM.
 */
export function canonicalUnitSystemOn(base: ReferenceConditions): UnitSystem {
  const sc = CANONICAL_UNIT_SYSTEM.standardConditions;
  if (
    base.pressurePsia === sc.pressurePsia &&
    base.temperatureF === sc.temperatureF
  )
    return CANONICAL_UNIT_SYSTEM;
  const label = standardConditionsLabel(base);
  return Object.freeze({
    id: "canonical",
    label: `${CANONICAL_UNIT_SYSTEM.label} (${label})`,
    units: CANONICAL_UNITS,
    standardConditions: Object.freeze({
      id: `report_${base.temperatureF}f_${base.pressurePsia}psia`,
      label,
      pressurePsia: base.pressurePsia,
      temperatureF: base.temperatureF,
    }),
  });
}

export const FIELD_UNIT_SYSTEM: UnitSystem = Object.freeze({
  id: "field",
  label: "Field: psia, °F, rb/STB, ft³/scf, scf/STB, cP, lb/ft³, 1/psi",
  units: Object.freeze({ ...CANONICAL_UNITS, gas_fvf: "ft3/scf" }),
  standardConditions: FIELD_STANDARD_CONDITIONS,
});

export const METRIC_UNIT_SYSTEM: UnitSystem = Object.freeze({
  id: "metric",
  label:
    "Metric: bara, °C, rm³/sm³, sm³/sm³, mPa·s, kg/m³, 1/bar (15 °C, 101.325 kPa)",
  units: Object.freeze({
    pressure: "bara",
    temperature: "degC",
    oil_fvf: "rm3/sm3",
    gas_fvf: "rm3/sm3",
    gas_oil_ratio: "sm3/sm3",
    viscosity: "mPa.s",
    density: "kg/m3",
    compressibility: "1/bar",
    dimensionless: "-",
  } as const),
  standardConditions: METRIC_STANDARD_CONDITIONS,
});

export const UNIT_SYSTEMS = Object.freeze({
  canonical: CANONICAL_UNIT_SYSTEM,
  field: FIELD_UNIT_SYSTEM,
  metric: METRIC_UNIT_SYSTEM,
});

export type UnitSystemId = keyof typeof UNIT_SYSTEMS;

/** The unit a property is shown in within a unit system. */
export function propertyUnit<K extends PropertyKey>(
  system: UnitSystem,
  key: K,
): UnitId<(typeof PROPERTY_QUANTITIES)[K]> {
  const quantity = PROPERTY_QUANTITIES[key];
  return system.units[quantity] as UnitId<(typeof PROPERTY_QUANTITIES)[K]>;
}

/**
 * Convert a value of a quantity from one unit system to another, including the change of standard
 * conditions for gas volumes (gas_oil_ratio, gas_fvf).
 */
export function convertBetweenSystems<Q extends Quantity>(
  value: number,
  quantity: Q,
  from: UnitSystem,
  to: UnitSystem,
  options?: ConversionOptions,
): number {
  const fromUnit = from.units[quantity] as UnitId<Q>;
  const toUnit = to.units[quantity] as UnitId<Q>;
  const converted = convert(value, quantity, fromUnit, toUnit, options);
  if (quantity === "gas_oil_ratio" || quantity === "gas_fvf") {
    return rebaseStandardVolume(
      converted,
      quantity,
      from.standardConditions,
      to.standardConditions,
    );
  }
  return converted;
}
