/**
 * The columns of a black-oil table: our own plain names (no simulator's keywords), the property key of the
 * grid each comes from, and the short name used as a single word in the text layout.
 */
import type { PropertyKey } from "../units";

export type TableColumnKey =
  | "solution_gor"
  | "oil_fvf"
  | "oil_viscosity"
  | "gas_fvf"
  | "gas_viscosity"
  | "z_factor";

/** Left to right. */
export const TABLE_COLUMNS: readonly TableColumnKey[] = [
  "solution_gor",
  "oil_fvf",
  "oil_viscosity",
  "gas_fvf",
  "gas_viscosity",
  "z_factor",
];

export const OIL_COLUMNS: readonly TableColumnKey[] = [
  "solution_gor",
  "oil_fvf",
  "oil_viscosity",
];

export type ColumnInfo = {
  key: TableColumnKey;
  /** Name in CSV headers and messages. */
  name: string;
  /** One word, for the whitespace-separated text layout. */
  word: string;
};

export const COLUMN_INFO: Readonly<Record<TableColumnKey, ColumnInfo>> =
  Object.freeze({
    solution_gor: { key: "solution_gor", name: "Rs", word: "Rs" },
    oil_fvf: { key: "oil_fvf", name: "Bo", word: "Bo" },
    oil_viscosity: {
      key: "oil_viscosity",
      name: "oil viscosity",
      word: "oil_viscosity",
    },
    gas_fvf: { key: "gas_fvf", name: "Bg", word: "Bg" },
    gas_viscosity: {
      key: "gas_viscosity",
      name: "gas viscosity",
      word: "gas_viscosity",
    },
    z_factor: { key: "z_factor", name: "z-factor", word: "z" },
  });

export function isTableColumn(key: PropertyKey): key is TableColumnKey {
  return (TABLE_COLUMNS as readonly string[]).includes(key);
}
