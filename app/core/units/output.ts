/**
 * Output units: the two unit systems a person or an API caller can choose for what they read (and type), the
 * unit each quantity or property is shown in, and conversions from canonical values to that system and back.
 * Every page, API route and the lookup take their unit labels from here; the argument order is always
 * (system, quantity or property).
 */
import { convert, getUnit, type Quantity, type UnitId } from "./catalogue";
import { METRE_PER_FOOT } from "./definitions";
import {
  PROPERTY_QUANTITIES,
  isPropertyKey,
  type PropertyKey,
} from "./properties";
import type { ReferenceConditions } from "./standard-conditions";
import {
  CANONICAL_UNIT_SYSTEM,
  FIELD_UNIT_SYSTEM,
  METRIC_UNIT_SYSTEM,
  canonicalUnitSystemOn,
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
/**
 * A stored property value in the output system. Rs and Bg are stored on the report's own standard conditions
 * (`reported`, the sample's; default 60 °F, 14.696 psia) and come out on the output system's base (60 °F and
 * 14.696 psia for field, 15 °C and 101.325 kPa for metric), rebased as an ideal gas (standard-conditions.ts).
 */
export const toOutputValue = (
  value: number,
  property: PropertyKey,
  system: OutputSystem,
  reported?: ReferenceConditions,
) =>
  convertBetweenSystems(
    value,
    PROPERTY_QUANTITIES[property],
    reported ? canonicalUnitSystemOn(reported) : CANONICAL_UNIT_SYSTEM,
    outputUnitSystem(system),
  );
export const fromInputPressure = (value: number, system: OutputSystem) =>
  toCanonical(value, "pressure", system);
export const fromInputTemperature = (value: number, system: OutputSystem) =>
  toCanonical(value, "temperature", system);

/*
 * Pressure basis. Inside the product every pressure is absolute; a person or an API caller may read and type
 * gauge pressures instead (psig in field units, barg in metric), made absolute with a barometric pressure —
 * the sample's recorded one, default one standard atmosphere.
 */
export const PRESSURE_BASES = ["absolute", "gauge"] as const;
export type PressureBasis = (typeof PRESSURE_BASES)[number];

/** A pressure basis and the barometric pressure (psia) that goes with gauge readings. */
export type PressureBasisOptions = {
  readonly pressureBasis?: PressureBasis;
  /** Added to a gauge reading to make it absolute; default 14.696 psia (one atmosphere, oilfield figure). */
  readonly barometricPressurePsia?: number;
};

/** The barometric pressure the sample records by default: 14.696 psia, one atmosphere as the oilfield writes it. */
export const DEFAULT_SAMPLE_BAROMETRIC_PSIA = 14.696;

const GAUGE_UNITS: Readonly<Record<OutputSystem, UnitId<"pressure">>> = {
  field: "psig",
  metric: "barg",
};

/** The pressure unit of an output system on a basis: psia/bara, or psig/barg for gauge. */
export function outputPressureUnit(
  system: OutputSystem,
  basis: PressureBasis = "absolute",
): UnitLabel {
  if (basis === "absolute") return outputUnit(system, "pressure");
  const id = GAUGE_UNITS[system];
  return Object.freeze({ id, symbol: getUnit("pressure", id).symbol });
}

const barometricOf = (options: PressureBasisOptions | undefined) => ({
  barometricPsia:
    options?.barometricPressurePsia ?? DEFAULT_SAMPLE_BAROMETRIC_PSIA,
});

/** An absolute pressure (psia) in the output system on the given basis (psig/barg for gauge). */
export function toOutputPressureOn(
  psia: number,
  system: OutputSystem,
  options?: PressureBasisOptions,
): number {
  if ((options?.pressureBasis ?? "absolute") === "absolute")
    return toOutputPressure(psia, system);
  return convert(
    psia,
    "pressure",
    "psia",
    GAUGE_UNITS[system],
    barometricOf(options),
  );
}

/** A pressure typed in the output system on the given basis, as absolute psia. */
export function fromInputPressureOn(
  value: number,
  system: OutputSystem,
  options?: PressureBasisOptions,
): number {
  if ((options?.pressureBasis ?? "absolute") === "absolute")
    return fromInputPressure(value, system);
  return convert(
    value,
    "pressure",
    GAUGE_UNITS[system],
    "psia",
    barometricOf(options),
  );
}

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
