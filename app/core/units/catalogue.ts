/**
 * The quantity catalogue: every unit Isopleth accepts, grouped by physical quantity, each with an exact
 * affine map to the canonical unit of its quantity:
 *
 *     canonical = value × scale + offset
 *
 * Gauge pressures are the one context-dependent case: their offset is the barometric pressure, supplied at
 * conversion time (default: one standard atmosphere, 101.325 kPa = 14.69595 psia, printed "14.696 psia").
 *
 * Canonical internal system (what every function in app/core works in):
 *
 * | quantity        | canonical | meaning                                               |
 * |-----------------|-----------|-------------------------------------------------------|
 * | pressure        | psia      | absolute pressure                                     |
 * | temperature     | degF      | °F (equations convert to °R internally)               |
 * | oil_fvf         | rb/STB    | oil and total (two-phase) formation volume factor     |
 * | gas_fvf         | rb/scf    | so Bg·Rs is directly rb/STB                           |
 * | gas_oil_ratio   | scf/STB   | solution (or producing) gas–oil ratio                 |
 * | viscosity       | cP        |                                                       |
 * | density         | lb/ft3    |                                                       |
 * | compressibility | 1/psi     | isothermal compressibility                            |
 * | dimensionless   | -         | z-factor, relative volume, specific gravity           |
 *
 * Volume ratios assume the same standard (reference) conditions on both sides; changing the reference
 * conditions of a gas volume is a separate, explicit step (see standard-conditions.ts).
 */
import {
  CUBIC_FOOT_PER_BARREL,
  KG_PER_M3_PER_LB_PER_FT3,
  PASCAL_PER_BAR,
  PASCAL_PER_PSI,
  PSI_PER_ATMOSPHERE,
  RANKINE_OFFSET,
  RANKINE_PER_KELVIN,
} from "./definitions";
import { UnitError } from "./errors";
import { formatPrecision } from "../format";

interface UnitSpec {
  /** Display symbol, e.g. "°F", "rm³/sm³", "mPa·s". */
  readonly symbol: string;
  readonly name: string;
  /** canonical = value × scale + offset. */
  readonly scale: number;
  readonly offset: number;
  /** A gauge pressure: the barometric pressure is added to (value × scale). */
  readonly gauge?: true;
  /** How scale and offset follow from the exact definitions. */
  readonly definition: string;
}

const PSI_PER_BAR = PASCAL_PER_BAR / PASCAL_PER_PSI;
const PSI_PER_KPA = 1000 / PASCAL_PER_PSI;
const PSI_PER_MPA = 1_000_000 / PASCAL_PER_PSI;

const unit = (spec: UnitSpec): UnitSpec => spec;

export const UNITS = {
  pressure: {
    psia: unit({
      symbol: "psia",
      name: "pound-force per square inch, absolute",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    psig: unit({
      symbol: "psig",
      name: "pound-force per square inch, gauge",
      scale: 1,
      offset: 0,
      gauge: true,
      definition: "psia = psig + barometric pressure",
    }),
    bara: unit({
      symbol: "bara",
      name: "bar, absolute",
      scale: PSI_PER_BAR,
      offset: 0,
      definition:
        "1 bar = 100 000 Pa; 1 psi = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)²",
    }),
    barg: unit({
      symbol: "barg",
      name: "bar, gauge",
      scale: PSI_PER_BAR,
      offset: 0,
      gauge: true,
      definition: "bar factor, plus barometric pressure",
    }),
    kPa: unit({
      symbol: "kPa",
      name: "kilopascal, absolute",
      scale: PSI_PER_KPA,
      offset: 0,
      definition: "1 kPa = 1000 Pa; psi as above",
    }),
    kPag: unit({
      symbol: "kPag",
      name: "kilopascal, gauge",
      scale: PSI_PER_KPA,
      offset: 0,
      gauge: true,
      definition: "kPa factor, plus barometric pressure",
    }),
    MPa: unit({
      symbol: "MPa",
      name: "megapascal, absolute",
      scale: PSI_PER_MPA,
      offset: 0,
      definition: "1 MPa = 10⁶ Pa; psi as above",
    }),
    MPag: unit({
      symbol: "MPag",
      name: "megapascal, gauge",
      scale: PSI_PER_MPA,
      offset: 0,
      gauge: true,
      definition: "MPa factor, plus barometric pressure",
    }),
    atm: unit({
      symbol: "atm",
      name: "standard atmosphere",
      scale: PSI_PER_ATMOSPHERE,
      offset: 0,
      definition: "1 atm = 101 325 Pa",
    }),
  },
  temperature: {
    degF: unit({
      symbol: "°F",
      name: "degree Fahrenheit",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    degC: unit({
      symbol: "°C",
      name: "degree Celsius",
      scale: 1.8,
      offset: 32,
      definition: "°F = 1.8 °C + 32",
    }),
    K: unit({
      symbol: "K",
      name: "kelvin",
      scale: RANKINE_PER_KELVIN,
      offset: -RANKINE_OFFSET,
      definition: "°F = 1.8 K − 459.67",
    }),
    degR: unit({
      symbol: "°R",
      name: "degree Rankine",
      scale: 1,
      offset: -RANKINE_OFFSET,
      definition: "°F = °R − 459.67",
    }),
  },
  oil_fvf: {
    "rb/STB": unit({
      symbol: "rb/STB",
      name: "reservoir barrel per stock-tank barrel",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    "rm3/sm3": unit({
      symbol: "rm³/sm³",
      name: "reservoir m³ per standard m³ (oil)",
      scale: 1,
      offset: 0,
      definition: "volume ratio: rb/STB ≡ rm³/sm³",
    }),
  },
  gas_fvf: {
    "rb/scf": unit({
      symbol: "rb/scf",
      name: "reservoir barrel per standard cubic foot",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    "rb/Mscf": unit({
      symbol: "rb/Mscf",
      name: "reservoir barrel per thousand standard cubic feet",
      scale: 1 / 1000,
      offset: 0,
      definition: "1 Mscf = 1000 scf",
    }),
    "ft3/scf": unit({
      symbol: "ft³/scf",
      name: "reservoir cubic foot per standard cubic foot",
      scale: 1 / CUBIC_FOOT_PER_BARREL,
      offset: 0,
      definition: "1 bbl = 42 US gal = 9702 in³ = 5.614583 ft³",
    }),
    "rm3/sm3": unit({
      symbol: "rm³/sm³",
      name: "reservoir m³ per standard m³ (gas)",
      scale: 1 / CUBIC_FOOT_PER_BARREL,
      offset: 0,
      definition: "volume ratio, numerically equal to ft³/scf",
    }),
  },
  gas_oil_ratio: {
    "scf/STB": unit({
      symbol: "scf/STB",
      name: "standard cubic foot per stock-tank barrel",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    "Mscf/STB": unit({
      symbol: "Mscf/STB",
      name: "thousand standard cubic feet per stock-tank barrel",
      scale: 1000,
      offset: 0,
      definition: "1 Mscf = 1000 scf",
    }),
    "sm3/sm3": unit({
      symbol: "sm³/sm³",
      name: "standard m³ gas per standard m³ oil",
      scale: CUBIC_FOOT_PER_BARREL,
      offset: 0,
      definition: "1 m³/m³ = 5.614583 ft³/bbl (same reference conditions)",
    }),
  },
  viscosity: {
    cP: unit({
      symbol: "cP",
      name: "centipoise",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    "mPa.s": unit({
      symbol: "mPa·s",
      name: "millipascal second",
      scale: 1,
      offset: 0,
      definition: "1 cP = 1 mPa·s",
    }),
    "Pa.s": unit({
      symbol: "Pa·s",
      name: "pascal second",
      scale: 1000,
      offset: 0,
      definition: "1 Pa·s = 1000 cP",
    }),
  },
  density: {
    "lb/ft3": unit({
      symbol: "lb/ft³",
      name: "pound per cubic foot",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    "kg/m3": unit({
      symbol: "kg/m³",
      name: "kilogram per cubic metre",
      scale: 1 / KG_PER_M3_PER_LB_PER_FT3,
      offset: 0,
      definition: "1 lb/ft³ = 0.45359237 kg / 0.3048³ m³ = 16.01846337 kg/m³",
    }),
    "g/cm3": unit({
      symbol: "g/cm³",
      name: "gram per cubic centimetre",
      scale: 1000 / KG_PER_M3_PER_LB_PER_FT3,
      offset: 0,
      definition: "1 g/cm³ = 1000 kg/m³",
    }),
  },
  compressibility: {
    "1/psi": unit({
      symbol: "1/psi",
      name: "per psi",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
    "1e-6/psi": unit({
      symbol: "10⁻⁶/psi",
      name: "per psi, ×10⁻⁶",
      scale: 1e-6,
      offset: 0,
      definition: "value × 10⁻⁶ 1/psi",
    }),
    "1/bar": unit({
      symbol: "1/bar",
      name: "per bar",
      scale: 1 / PSI_PER_BAR,
      offset: 0,
      definition: "inverse of the bar factor",
    }),
    "1/kPa": unit({
      symbol: "1/kPa",
      name: "per kilopascal",
      scale: 1 / PSI_PER_KPA,
      offset: 0,
      definition: "inverse of the kPa factor",
    }),
    "1/MPa": unit({
      symbol: "1/MPa",
      name: "per megapascal",
      scale: 1 / PSI_PER_MPA,
      offset: 0,
      definition: "inverse of the MPa factor",
    }),
  },
  dimensionless: {
    "-": unit({
      symbol: "–",
      name: "dimensionless",
      scale: 1,
      offset: 0,
      definition: "canonical",
    }),
  },
} as const satisfies Record<string, Record<string, UnitSpec>>;

export type Quantity = keyof typeof UNITS;
export type UnitId<Q extends Quantity = Quantity> = Q extends Quantity
  ? keyof (typeof UNITS)[Q] & string
  : never;

export const QUANTITIES = Object.keys(UNITS) as Quantity[];

export const QUANTITY_LABELS: Readonly<Record<Quantity, string>> = {
  pressure: "pressure",
  temperature: "temperature",
  oil_fvf: "oil (or total) formation volume factor",
  gas_fvf: "gas formation volume factor",
  gas_oil_ratio: "gas–oil ratio",
  viscosity: "viscosity",
  density: "density",
  compressibility: "isothermal compressibility",
  dimensionless: "dimensionless ratio",
};

/** The canonical internal unit of each quantity. */
export const CANONICAL_UNITS = {
  pressure: "psia",
  temperature: "degF",
  oil_fvf: "rb/STB",
  gas_fvf: "rb/scf",
  gas_oil_ratio: "scf/STB",
  viscosity: "cP",
  density: "lb/ft3",
  compressibility: "1/psi",
  dimensionless: "-",
} as const satisfies { [Q in Quantity]: UnitId<Q> };

export interface UnitDefinition {
  readonly quantity: Quantity;
  readonly id: string;
  readonly symbol: string;
  readonly name: string;
  readonly scale: number;
  readonly offset: number;
  readonly gauge: boolean;
  readonly definition: string;
}

export function isQuantity(value: string): value is Quantity {
  return Object.hasOwn(UNITS, value);
}

export function isUnitId<Q extends Quantity>(
  quantity: Q,
  id: string,
): id is UnitId<Q> {
  return Object.hasOwn(UNITS[quantity], id);
}

/** Look a unit up by quantity and id (e.g. from a database column). Throws UnitError UNKNOWN_UNIT. */
export function getUnit(quantity: Quantity, id: string): UnitDefinition {
  if (!isQuantity(quantity)) {
    throw new UnitError(
      "UNKNOWN_UNIT",
      `Unknown quantity "${String(quantity)}".`,
      { quantity },
    );
  }
  const table = UNITS[quantity] as Record<string, UnitSpec>;
  const spec = Object.hasOwn(table, id) ? table[id] : undefined;
  if (!spec) {
    throw new UnitError(
      "UNKNOWN_UNIT",
      `Unknown ${QUANTITY_LABELS[quantity]} unit "${id}". Known: ${Object.keys(table).join(", ")}.`,
      { quantity, unit: id },
    );
  }
  return {
    quantity,
    id,
    symbol: spec.symbol,
    name: spec.name,
    scale: spec.scale,
    offset: spec.offset,
    gauge: spec.gauge === true,
    definition: spec.definition,
  };
}

/** Every unit of a quantity, in catalogue order. */
export function listUnits(quantity: Quantity): UnitDefinition[] {
  return Object.keys(UNITS[quantity]).map((id) => getUnit(quantity, id));
}

export interface ConversionOptions {
  /**
   * Barometric pressure in psia used for gauge units (psig, barg, kPag, MPag). Default: one standard
   * atmosphere, 14.69595 psia (= 1.01325 bar exactly). Pass the lab's stated value when it differs.
   */
  readonly barometricPsia?: number;
}

/** One standard atmosphere in psia: the default barometric pressure for gauge units. */
export const DEFAULT_BAROMETRIC_PSIA = PSI_PER_ATMOSPHERE;

function assertFinite(value: number, what: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new UnitError(
      "NOT_FINITE",
      `${what} must be a finite number, got ${String(value)}.`,
      { value },
    );
  }
}

function barometric(options: ConversionOptions | undefined): number {
  const b = options?.barometricPsia ?? DEFAULT_BAROMETRIC_PSIA;
  assertFinite(b, "Barometric pressure (psia)");
  if (b <= 0) {
    throw new UnitError(
      "NEGATIVE_ABSOLUTE_PRESSURE",
      `Barometric pressure must be > 0 psia, got ${b}.`,
      { value: b },
    );
  }
  return b;
}

/** Physical-limit checks on a value already in canonical units. */
function assertPhysical(
  quantity: Quantity,
  canonical: number,
  original: number,
  unitId: string,
): void {
  if (quantity === "pressure" && canonical < 0) {
    throw new UnitError(
      "NEGATIVE_ABSOLUTE_PRESSURE",
      `${original} ${unitId} is a negative absolute pressure (${formatPrecision(canonical, 6)} psia). ` +
        "Check whether the column is gauge or absolute.",
      { value: original, unit: unitId },
    );
  }
  if (quantity === "temperature" && canonical < -RANKINE_OFFSET) {
    throw new UnitError(
      "BELOW_ABSOLUTE_ZERO",
      `${original} ${unitId} is below absolute zero (−459.67 °F).`,
      { value: original, unit: unitId },
    );
  }
}

/** Convert a value in `unit` to the canonical unit of its quantity. */
export function toCanonical<Q extends Quantity>(
  value: number,
  quantity: Q,
  unit: UnitId<Q>,
  options?: ConversionOptions,
): number {
  assertFinite(value, `Value in ${unit}`);
  const def = getUnit(quantity, unit);
  const offset = def.gauge ? barometric(options) : def.offset;
  const canonical = value * def.scale + offset;
  assertPhysical(quantity, canonical, value, unit);
  return canonical;
}

/** Convert a canonical value to `unit`. */
export function fromCanonical<Q extends Quantity>(
  value: number,
  quantity: Q,
  unit: UnitId<Q>,
  options?: ConversionOptions,
): number {
  assertFinite(value, `Canonical ${QUANTITY_LABELS[quantity]}`);
  assertPhysical(quantity, value, value, CANONICAL_UNITS[quantity]);
  const def = getUnit(quantity, unit);
  const offset = def.gauge ? barometric(options) : def.offset;
  return (value - offset) / def.scale;
}

/** Convert between two units of the same quantity (through the canonical unit). */
export function convert<Q extends Quantity>(
  value: number,
  quantity: Q,
  from: UnitId<Q>,
  to: UnitId<Q>,
  options?: ConversionOptions,
): number {
  if (from === to) {
    // Still validate, so that a bad value never passes silently.
    toCanonical(value, quantity, from, options);
    return value;
  }
  return fromCanonical(
    toCanonical(value, quantity, from, options),
    quantity,
    to,
    options,
  );
}
