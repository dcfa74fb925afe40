/**
 * The columns of a black-oil table: the property key of the grid each comes from, with its plain name (no
 * simulator's keywords) and the short name used as a single word in the text layout, both from the property
 * catalogue.
 */
import { PROPERTIES } from "../units";

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

/** Each column's names, from the property catalogue (app/core/units/properties.ts). */
export const COLUMN_INFO: Readonly<Record<TableColumnKey, ColumnInfo>> =
  Object.freeze(
    Object.fromEntries(
      TABLE_COLUMNS.map((key) => [key, { key, ...PROPERTIES[key].column }]),
    ) as Record<TableColumnKey, ColumnInfo>,
  );
