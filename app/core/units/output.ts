/**
 * Output units: the two unit systems a person or an API caller can choose for what they read (and type), the
 * unit each quantity or property is shown in, and conversions from canonical values to that system and back.
 * Every page, API route and the lookup take their unit labels from here; the argument order is always
 * (system, quantity or property).
 */
import { getUnit, type Quantity } from "./catalogue";
import { METRE_PER_FOOT } from "./definitions";
import {
  PROPERTY_QUANTITIES,
  isPropertyKey,
  type PropertyKey,
} from "./properties";
import {
  CANONICAL_UNIT_SYSTEM,
  FIELD_UNIT_SYSTEM,
  METRIC_UNIT_SYSTEM,
  convertBetweenSystems,
  type UnitSystem,
} from "./unit-systems";

/** The unit systems offered for output (and input) in the product and the API. */
export const OUTPUT_SYSTEMS = ["field", "metric"] as const;
export type OutputSystem = (typeof OUTPUT_SYSTEMS)[number];

export function isOutputSystem(value: unknown): value is OutputSystem {
  return (OUTPUT_SYSTEMS as readonly unknown[]).includes(value);
}

export function outputUnitSystem(system: OutputSystem): UnitSystem {
  return system === "metric" ? METRIC_UNIT_SYSTEM : FIELD_UNIT_SYSTEM;
}

/** A unit as shown: the catalogue id (ASCII, e.g. "ft3/scf") and the display symbol (e.g. "ft³/scf"). */
export type UnitLabel = { readonly id: string; readonly symbol: string };

function quantityOf(what: Quantity | PropertyKey): Quantity {
  return isPropertyKey(what) ? PROPERTY_QUANTITIES[what] : what;
}

/** The unit a quantity or property is shown in within an output system, as id and symbol. */
export function outputUnit(
  system: OutputSystem,
  what: Quantity | PropertyKey,
): UnitLabel {
  const quantity = quantityOf(what);
  const id = outputUnitSystem(system).units[quantity];
  return Object.freeze({ id, symbol: getUnit(quantity, id).symbol });
}

/** The display symbol of the unit a quantity or property is shown in: "psia", "°C", "rm³/sm³". */
export function unitLabel(
  system: OutputSystem,
  what: Quantity | PropertyKey,
): string {
  return outputUnit(system, what).symbol;
}

const fromCanonical = (value: number, q: Quantity, system: OutputSystem) =>
  convertBetweenSystems(
    value,
    q,
    CANONICAL_UNIT_SYSTEM,
    outputUnitSystem(system),
  );
const toCanonical = (value: number, q: Quantity, system: OutputSystem) =>
  convertBetweenSystems(
    value,
    q,
    outputUnitSystem(system),
    CANONICAL_UNIT_SYSTEM,
  );

export const toOutputPressure = (psia: number, system: OutputSystem) =>
  fromCanonical(psia, "pressure", system);
export const toOutputTemperature = (degF: number, system: OutputSystem) =>
  fromCanonical(degF, "temperature", system);
export const toOutputValue = (
  value: number,
  property: PropertyKey,
  system: OutputSystem,
) => fromCanonical(value, PROPERTY_QUANTITIES[property], system);
export const fromInputPressure = (value: number, system: OutputSystem) =>
  toCanonical(value, "pressure", system);
export const fromInputTemperature = (value: number, system: OutputSystem) =>
  toCanonical(value, "temperature", system);

/*
 * Depth (a sample's sampling depth) is a length, which no table is measured in, so it is not in the unit
 * catalogue: it is recorded in ft and shown in ft or m.
 */
const DEPTH_UNITS: Readonly<Record<OutputSystem, string>> = {
  field: "ft",
  metric: "m",
};

/** The symbol of the unit a depth is shown in: "ft" or "m". */
export const depthUnitLabel = (system: OutputSystem) => DEPTH_UNITS[system];
export const toOutputDepth = (ft: number, system: OutputSystem) =>
  system === "metric" ? ft * METRE_PER_FOOT : ft;
export const fromInputDepth = (value: number, system: OutputSystem) =>
  system === "metric" ? value / METRE_PER_FOOT : value;
