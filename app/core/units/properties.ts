/**
 * The property catalogue: the one place that says what each measured property is called, its symbol and the
 * quantity (unit kind) it is measured in. Every page, message, API description, table column and upload
 * template takes these words from here; a new or renamed `PropertyKey` fails the type check until its entry
 * exists (`satisfies Record<PropertyKey, PropertyInfo>`).
 *
 * The fields are different ways of writing the same property, each kept because a page or message shows it
 * that way today:
 *
 * | field          | used for                                                   | e.g. (oil_fvf / oil_viscosity / z_factor)                     |
 * | -------------- | ---------------------------------------------------------- | ------------------------------------------------------------- |
 * | `name`         | headings, plot titles, the sample page                     | Oil formation volume factor / Oil viscosity / Gas deviation factor |
 * | `symbol`       | the usual symbol beside a name                             | Bo / μo / Z                                                   |
 * | `abbreviation` | the short letters the trade writes instead of the name     | Bo / – / –                                                    |
 * | `short`        | compact labels (compare page)                              | Bo / Oil viscosity / z                                        |
 * | `phrase`       | inside a sentence (lookup results and messages)            | oil formation volume factor (Bo) / oil viscosity / gas compressibility factor (z) |
 * | `header`       | the upload templates' column name and upload messages      | oil formation volume factor / oil viscosity / Z factor        |
 * | `subject`      | the subject of a QC trend sentence                         | Bo / the oil viscosity / Z                                    |
 * | `column`       | black-oil table columns: CSV/message name and one-word name | Bo, Bo / oil viscosity, oil_viscosity / z-factor, z           |
 */
import type { Quantity } from "./catalogue";

/** Property keys used across the app (grids, API, database), in display order. */
export const PROPERTY_KEYS = [
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
  "oil_density",
  "gas_fvf",
  "gas_viscosity",
  "z_factor",
] as const;
export type PropertyKey = (typeof PROPERTY_KEYS)[number];

export interface PropertyInfo {
  readonly quantity: Quantity;
  readonly name: string;
  readonly symbol: string;
  readonly abbreviation: string | null;
  readonly short: string;
  readonly phrase: string;
  readonly header: string;
  readonly subject: string;
  readonly column: { readonly name: string; readonly word: string } | null;
}

export const PROPERTIES = Object.freeze({
  oil_fvf: {
    quantity: "oil_fvf",
    name: "Oil formation volume factor",
    symbol: "Bo",
    abbreviation: "Bo",
    short: "Bo",
    phrase: "oil formation volume factor (Bo)",
    header: "oil formation volume factor",
    subject: "Bo",
    column: { name: "Bo", word: "Bo" },
  },
  solution_gor: {
    quantity: "gas_oil_ratio",
    name: "Solution gas–oil ratio",
    symbol: "Rs",
    abbreviation: "Rs",
    short: "Rs",
    phrase: "solution gas-oil ratio (Rs)",
    header: "solution GOR",
    subject: "Rs",
    column: { name: "Rs", word: "Rs" },
  },
  oil_viscosity: {
    quantity: "viscosity",
    name: "Oil viscosity",
    symbol: "μo",
    abbreviation: null,
    short: "Oil viscosity",
    phrase: "oil viscosity",
    header: "oil viscosity",
    subject: "the oil viscosity",
    column: { name: "oil viscosity", word: "oil_viscosity" },
  },
  oil_density: {
    quantity: "density",
    name: "Oil density",
    symbol: "ρo",
    abbreviation: null,
    short: "Oil density",
    phrase: "oil density",
    header: "oil density",
    subject: "the oil density",
    column: null,
  },
  gas_fvf: {
    quantity: "gas_fvf",
    name: "Gas formation volume factor",
    symbol: "Bg",
    abbreviation: "Bg",
    short: "Bg",
    phrase: "gas formation volume factor (Bg)",
    header: "gas formation volume factor",
    subject: "Bg",
    column: { name: "Bg", word: "Bg" },
  },
  gas_viscosity: {
    quantity: "viscosity",
    name: "Gas viscosity",
    symbol: "μg",
    abbreviation: null,
    short: "Gas viscosity",
    phrase: "gas viscosity",
    header: "gas viscosity",
    subject: "the gas viscosity",
    column: { name: "gas viscosity", word: "gas_viscosity" },
  },
  z_factor: {
    quantity: "dimensionless",
    name: "Gas deviation factor",
    symbol: "Z",
    abbreviation: null,
    short: "z",
    phrase: "gas compressibility factor (z)",
    header: "Z factor",
    subject: "Z",
    column: { name: "z-factor", word: "z" },
  },
} as const satisfies Record<PropertyKey, PropertyInfo>);

/** The quantity each property is measured in (a view of the catalogue). */
export const PROPERTY_QUANTITIES: {
  readonly [K in PropertyKey]: (typeof PROPERTIES)[K]["quantity"];
} = Object.freeze(
  Object.fromEntries(PROPERTY_KEYS.map((k) => [k, PROPERTIES[k].quantity])) as {
    [K in PropertyKey]: (typeof PROPERTIES)[K]["quantity"];
  },
);

export function isPropertyKey(value: string): value is PropertyKey {
  return (PROPERTY_KEYS as readonly string[]).includes(value);
}

/** "oil_fvf (Bo)" or "oil_viscosity": a key with the abbreviation the trade writes for it. */
export function keyWithAbbreviation(key: PropertyKey): string {
  const abbreviation: string | null = PROPERTIES[key].abbreviation;
  return abbreviation ? `${key} (${abbreviation})` : key;
}

/** `"oil formation volume factor" (Bo)` or `"oil viscosity"`: a template header name as quoted in messages. */
export function quotedHeader(key: PropertyKey): string {
  const abbreviation: string | null = PROPERTIES[key].abbreviation;
  const quoted = `"${PROPERTIES[key].header}"`;
  return abbreviation ? `${quoted} (${abbreviation})` : quoted;
}
