/**
 * Writers: a ParsedDataset as rows of text in either layout, then as CSV text or an XLSX workbook. Values
 * are written in each grid's own units (the units of the uploaded file, or the display units given when the
 * dataset was built). The files they write read back through parseUpload to the same dataset.
 */
import { csvCommentLine, csvRow } from "../csv";
import {
  fromCanonical,
  PROPERTY_KEYS,
  type PropertyKey,
  type Quantity,
  type UnitId,
} from "../units";
import { LabDataError } from "./errors";
import { HEADER_NAMES } from "./header-names";
import type { Layout, ParsedDataset, PropertyGrid, UnitRef } from "./types";
import { CANONICAL_REFS } from "./qc/format";
import { roundSignificant } from "../format";

export interface WriteOptions {
  /** Unit labels: catalogue ids, ASCII ("degF", "ft3/scf"; default, safe in any CSV) or symbols ("°F", "ft³/scf"). */
  readonly unitLabels?: "ids" | "symbols";
  /** Decimal mark of numbers written as text (CSV); a comma needs a semicolon or tab delimiter. */
  readonly decimalMark?: "." | ",";
  /** Comment lines written first (each prefixed "# "). */
  readonly comments?: readonly string[];
  /** Barometric pressure for gauge units, psia. */
  readonly barometricPsia?: number;
}

/** A sheet of cells: numbers stay numbers (XLSX writes them as numbers), text stays text, null = empty. */
export type Cell = string | number | null;
export interface TableSheet {
  readonly name: string;
  readonly rows: Cell[][];
}

function label(ref: UnitRef, options: WriteOptions): string {
  return options.unitLabels === "symbols" ? ref.symbol : ref.id;
}

/** A canonical value in a unit, rounded to 12 significant digits to drop conversion noise. */
function shown(value: number, ref: UnitRef, options: WriteOptions): number {
  const v = fromCanonical(
    value,
    ref.quantity as Quantity,
    ref.id as UnitId<Quantity>,
    {
      ...(options.barometricPsia !== undefined
        ? { barometricPsia: options.barometricPsia }
        : {}),
    },
  );
  return roundSignificant(v, 12);
}

function propertyHeader(
  key: PropertyKey,
  grid: PropertyGrid,
  options: WriteOptions,
): string {
  const name = HEADER_NAMES[key][0] ?? key;
  return grid.unit.quantity === "dimensionless"
    ? name
    : `${name} (${label(grid.unit, options)})`;
}

function grids(dataset: ParsedDataset): [PropertyKey, PropertyGrid][] {
  return PROPERTY_KEYS.flatMap((k) => {
    const g = dataset.properties[k];
    return g ? [[k, g] as [PropertyKey, PropertyGrid]] : [];
  });
}

function axisUnits(dataset: ParsedDataset): {
  pressure: UnitRef;
  temperature: UnitRef;
} {
  const first = grids(dataset)[0]?.[1];
  return {
    pressure: first?.pressureUnit ?? CANONICAL_REFS.pressure,
    temperature: first?.temperatureUnit ?? CANONICAL_REFS.temperature,
  };
}

/** The long layout: a header row, then one row per pressure–temperature pair (by temperature, then pressure). */
export function longLayoutRows(
  dataset: ParsedDataset,
  options: WriteOptions = {},
): Cell[][] {
  const { pressure, temperature } = axisUnits(dataset);
  const props = grids(dataset);
  const hasBubble = dataset.bubblePoints.length > 0;
  const header: Cell[] = [
    `pressure (${label(pressure, options)})`,
    `temperature (${label(temperature, options)})`,
  ];
  if (hasBubble) header.push(`bubble point (${label(pressure, options)})`);
  for (const [key, grid] of props)
    header.push(propertyHeader(key, grid, options));

  const pairs = new Map<string, { p: number; t: number }>();
  for (const [, grid] of props) {
    grid.pressures.forEach((p, i) =>
      grid.temperatures.forEach((t, j) => {
        if (typeof grid.values[i]?.[j] === "number")
          pairs.set(`${t}|${p}`, { p, t });
      }),
    );
  }
  const ordered = [...pairs.values()].sort((a, b) => a.t - b.t || a.p - b.p);
  const rows: Cell[][] = [header];
  const bubbleWritten = new Set<number>();
  for (const { p, t } of ordered) {
    const row: Cell[] = [
      shown(p, pressure, options),
      shown(t, temperature, options),
    ];
    if (hasBubble) {
      const b = dataset.bubblePoints.find((x) => x.temperature === t);
      row.push(
        b && !bubbleWritten.has(t)
          ? shown(b.pressure, pressure, options)
          : null,
      );
      if (b) bubbleWritten.add(t);
    }
    for (const [, grid] of props) {
      const i = grid.pressures.indexOf(p);
      const j = grid.temperatures.indexOf(t);
      const v = i >= 0 && j >= 0 ? grid.values[i]?.[j] : null;
      row.push(typeof v === "number" ? shown(v, grid.unit, options) : null);
    }
    rows.push(row);
  }
  // Bubble points at temperatures without measurements: rows with an empty pressure.
  for (const b of dataset.bubblePoints) {
    if (bubbleWritten.has(b.temperature)) continue;
    const row: Cell[] = [
      null,
      shown(b.temperature, temperature, options),
      shown(b.pressure, pressure, options),
    ];
    for (let k = 0; k < props.length; k++) row.push(null);
    rows.push(row);
  }
  return rows;
}

/** The grid layout: a bubble-point block (if any), then one block per property. */
export function gridLayoutBlocks(
  dataset: ParsedDataset,
  options: WriteOptions = {},
): { name: string; rows: Cell[][] }[] {
  const blocks: { name: string; rows: Cell[][] }[] = [];
  const { pressure, temperature } = axisUnits(dataset);
  if (dataset.bubblePoints.length > 0) {
    blocks.push({
      name: "bubble point",
      rows: [
        [
          `bubble point (${label(pressure, options)})`,
          `temperature (${label(temperature, options)})`,
        ],
        [
          null,
          ...dataset.bubblePoints.map((b) =>
            shown(b.temperature, temperature, options),
          ),
        ],
        [
          "bubble point",
          ...dataset.bubblePoints.map((b) =>
            shown(b.pressure, pressure, options),
          ),
        ],
      ],
    });
  }
  for (const [key, grid] of grids(dataset)) {
    const rows: Cell[][] = [
      [
        propertyHeader(key, grid, options),
        `pressure (${label(grid.pressureUnit, options)})`,
        `temperature (${label(grid.temperatureUnit, options)})`,
      ],
      [
        null,
        ...grid.temperatures.map((t) =>
          shown(t, grid.temperatureUnit, options),
        ),
      ],
    ];
    grid.pressures.forEach((p, i) => {
      rows.push([
        shown(p, grid.pressureUnit, options),
        ...grid.temperatures.map((_, j) => {
          const v = grid.values[i]?.[j];
          return typeof v === "number" ? shown(v, grid.unit, options) : null;
        }),
      ]);
    });
    blocks.push({ name: HEADER_NAMES[key][0] ?? key, rows });
  }
  return blocks;
}

/** Sheets for a layout: long = one sheet; grid = one sheet per block (XLSX) or all blocks on one (CSV). */
export function layoutSheets(
  dataset: ParsedDataset,
  layout: Layout,
  options: WriteOptions = {},
  oneSheet = false,
): TableSheet[] {
  const comments: Cell[][] = (options.comments ?? []).map((c) => [`# ${c}`]);
  if (layout === "long")
    return [
      {
        name: "measurements",
        rows: [...comments, ...longLayoutRows(dataset, options)],
      },
    ];
  if (layout !== "grid")
    throw new LabDataError(
      "UNKNOWN_LAYOUT",
      `Unknown layout "${String(layout)}": use "long" or "grid".`,
    );
  const blocks = gridLayoutBlocks(dataset, options);
  if (oneSheet) {
    const rows: Cell[][] = [...comments];
    blocks.forEach((b, k) => {
      if (k > 0) rows.push([]);
      rows.push(...b.rows);
    });
    return [{ name: "grids", rows }];
  }
  return blocks.map((b, k) => ({
    name: sheetName(b.name),
    rows: k === 0 ? [...comments, ...b.rows] : b.rows,
  }));
}

function sheetName(name: string): string {
  return name.replace(/[\\/?*[\]:]/g, " ").slice(0, 31);
}

/** CSV text of one sheet. Rows are padded to the same number of fields, as spreadsheet programs write. */
export function toCsv(
  rows: readonly Cell[][],
  options: { delimiter?: "," | ";" | "\t"; decimalMark?: "." | "," } = {},
): string {
  const delimiter = options.delimiter ?? ",";
  const mark = options.decimalMark ?? ".";
  if (mark === "," && delimiter === ",") {
    throw new LabDataError(
      "INVALID_DATASET",
      "A decimal comma needs a semicolon or tab delimiter.",
    );
  }
  const width = Math.max(
    0,
    ...rows
      .filter((r) => !(typeof r[0] === "string" && r[0].startsWith("#")))
      .map((r) => r.length),
  );
  return rows
    .map((row) => {
      const isComment = typeof row[0] === "string" && row[0].startsWith("#");
      if (isComment)
        return csvCommentLine(String(row[0]).replace(/^#\s?/, ""), {
          delimiter,
        });
      const padded =
        row.length === 0
          ? row
          : [
              ...row,
              ...Array<Cell>(Math.max(0, width - row.length)).fill(null),
            ];
      return csvRow(padded, { delimiter, decimalMark: mark });
    })
    .join("\r\n")
    .concat("\r\n");
}

/** An XLSX workbook (bytes) with one worksheet per sheet. */
export async function toXlsx(
  sheets: readonly TableSheet[],
): Promise<Uint8Array> {
  const mod = (await import("exceljs")) as typeof import("exceljs") & {
    default?: typeof import("exceljs");
  };
  const ExcelJS = mod.default ?? mod;
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Isopleth";
  workbook.created = new Date(Date.UTC(2000, 0, 1));
  workbook.modified = new Date(Date.UTC(2000, 0, 1));
  for (const sheet of sheets) {
    const worksheet = workbook.addWorksheet(sheet.name);
    for (const row of sheet.rows)
      worksheet.addRow(row.map((c) => (c === null ? null : c)));
    (worksheet.columns ?? []).forEach((column) => {
      column.width = 18;
    });
  }
  const buffer = await workbook.xlsx.writeBuffer();
  return new Uint8Array(buffer as ArrayBuffer);
}
