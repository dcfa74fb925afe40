/**
 * The long layout: one header row, then one row per measurement.
 *
 *   pressure (psia), temperature (°F), bubble point (psia), oil formation volume factor (rb/STB), …
 *   5000,            220,              2635,               1.4416,                               …
 *
 * Pressure and temperature columns are required; a bubble-point column is optional (it gives pb at that
 * row's temperature; repeat it or give it once per temperature). A row with an empty pressure may carry only
 * a bubble point. Columns may come in any order.
 */
import type { PropertyKey } from "../units";
import {
  cellAt,
  cellText,
  isBlankRow,
  isCommentRow,
  isEmptyCell,
  usedWidth,
  type RawRow,
  type RawSheet,
} from "./cells";
import { quote, type Place } from "./findings";
import { parseHeaderCell, type HeaderCell } from "./header-cell";
import { HEADER_LABELS, isPropertyName, type HeaderName } from "./header-names";
import {
  readNumber,
  sourceOf,
  toCanonicalChecked,
  tidy,
  type BubbleRecord,
  type PointRecord,
  type PropertyRecord,
  type SheetContext,
  type SheetResult,
} from "./sheet-context";

interface Column {
  readonly index: number;
  readonly header: HeaderCell;
}

export function parseLongSheet(
  ctx: SheetContext,
  sheet: RawSheet,
): SheetResult {
  const result: SheetResult = {
    layout: "long",
    properties: [],
    points: [],
    bubblePoints: [],
  };
  const rows = sheet.rows.filter((r) => !isBlankRow(r) && !isCommentRow(r));
  const headerRow = rows[0];
  if (!headerRow) return result;
  const at = (row: number, column?: number): Place => ({
    ...(sheet.name !== undefined ? { sheet: sheet.name } : {}),
    row,
    ...(column !== undefined ? { column } : {}),
  });

  // Header.
  const width = usedWidth(headerRow);
  const columns: Column[] = [];
  const seen = new Map<HeaderName, Column>();
  let headerOk = true;
  const emptyHeaders: number[] = [];
  for (let c = 0; c < width; c++) {
    const cell = cellAt(headerRow, c);
    if (isEmptyCell(cell)) {
      emptyHeaders.push(c);
      continue;
    }
    const header = parseHeaderCell(ctx, cell, at(headerRow.row, c + 1), {
      aloneInRow: width === 1,
    });
    if (!header) {
      headerOk = false;
      continue;
    }
    const previous = seen.get(header.name);
    if (previous) {
      ctx.findings.error(
        "DUPLICATE_COLUMN",
        at(headerRow.row, c + 1),
        `the header ${quote(header.text)} is a second ${HEADER_LABELS[header.name]} column (the first is ${quote(previous.header.text)}); keep one.`,
        header.text,
      );
      headerOk = false;
      continue;
    }
    const column = { index: c, header };
    seen.set(header.name, column);
    columns.push(column);
  }
  const pressure = seen.get("pressure");
  const temperature = seen.get("temperature");
  const bubble = seen.get("bubble_point");
  const propertyColumns = columns.filter((c) => isPropertyName(c.header.name));
  const headerPlace = at(headerRow.row);
  const headerText = headerRow.cells
    .map(cellText)
    .filter((t) => t !== "")
    .join(", ");
  const missing = (what: string, hint: string): void =>
    ctx.findings.error(
      "MISSING_COLUMN",
      headerPlace,
      `the header row ${quote(headerText)} has no ${what} column; ${hint}`,
      headerText,
    );
  if (!pressure && headerOk)
    missing("pressure", 'add one such as "pressure (psia)".');
  if (!temperature && headerOk)
    missing(
      "temperature",
      'add one such as "temperature (°F)", even when every row is at the same temperature.',
    );
  if (propertyColumns.length === 0 && headerOk)
    missing("property", 'add at least one, such as "oil viscosity (cP)".');
  if (!pressure || !temperature || !headerOk) {
    // The rows cannot be converted, but their cells can still be checked, so that one upload lists all problems.
    for (const row of rows.slice(1)) {
      for (let c = 0; c < width; c++) {
        const cell = cellAt(row, c);
        if (!isEmptyCell(cellAt(headerRow, c)))
          readNumber(ctx, cell, at(row.row, c + 1), "the value");
      }
    }
    return result;
  }

  for (const column of propertyColumns) {
    const property = column.header.name as PropertyKey;
    const record: PropertyRecord = {
      property,
      unit: column.header.unit,
      pressureUnit: pressure.header.unit,
      temperatureUnit: temperature.header.unit,
      place: at(headerRow.row, column.index + 1),
      headerText: column.header.text,
    };
    result.properties.push(record);
  }

  // Data rows.
  const pairs = new Map<string, number>();
  for (const row of rows.slice(1)) {
    readRow(ctx, row, {
      width,
      headerFields: headerRow.fieldCount,
      emptyHeaders,
      pressure,
      temperature,
      bubble,
      propertyColumns,
      pairs,
      at,
      result,
    });
  }
  return result;
}

interface RowContext {
  readonly width: number;
  readonly headerFields: number | undefined;
  readonly emptyHeaders: readonly number[];
  readonly pressure: Column;
  readonly temperature: Column;
  readonly bubble: Column | undefined;
  readonly propertyColumns: readonly Column[];
  readonly pairs: Map<string, number>;
  readonly at: (row: number, column?: number) => Place;
  readonly result: SheetResult;
}

function readRow(ctx: SheetContext, row: RawRow, rc: RowContext): void {
  const { at, width } = rc;
  // Ragged rows: a CSV record with fewer fields than the header, or a value beyond the last header column.
  if (row.fieldCount !== undefined && row.fieldCount < width) {
    const last = cellText(cellAt(row, row.fieldCount - 1));
    ctx.findings.error(
      "RAGGED_ROW",
      at(row.row, row.fieldCount),
      `the row has ${row.fieldCount} field${row.fieldCount === 1 ? "" : "s"} (ending with ${quote(last)}) but the header has ${width}; add empty fields for values that were not measured.`,
      last,
    );
    return;
  }
  const used = usedWidth(row);
  if (used > width) {
    const extra = cellText(cellAt(row, used - 1));
    ctx.findings.error(
      "RAGGED_ROW",
      at(row.row, used),
      `the value ${quote(extra)} lies beyond the last column of the header (column ${width}); every value needs a header.`,
      extra,
    );
    return;
  }
  for (const c of rc.emptyHeaders) {
    const cell = cellAt(row, c);
    if (!isEmptyCell(cell)) {
      ctx.findings.error(
        "MISSING_COLUMN",
        at(row.row, c + 1),
        `the value ${quote(cellText(cell))} is in a column without a header; add the header or remove the value.`,
        cellText(cell),
      );
      return;
    }
  }

  const pCell = cellAt(row, rc.pressure.index);
  const tCell = cellAt(row, rc.temperature.index);
  const pPlace = at(row.row, rc.pressure.index + 1);
  const tPlace = at(row.row, rc.temperature.index + 1);
  const pRaw = readNumber(ctx, pCell, pPlace, "the pressure");
  const tRaw = readNumber(ctx, tCell, tPlace, "the temperature");
  const temperature =
    tRaw === null || tRaw === undefined
      ? undefined
      : toCanonicalChecked(
          ctx,
          tRaw,
          rc.temperature.header.unit,
          tPlace,
          tCell,
          "the temperature",
        );
  if (tRaw === null) {
    ctx.findings.error(
      "MISSING_VALUE",
      tPlace,
      "the temperature is empty; every row needs one.",
      "",
    );
  }

  // Values of the properties on this row.
  const values: { column: Column; value: number; place: Place }[] = [];
  let valuesOk = true;
  for (const column of rc.propertyColumns) {
    const cell = cellAt(row, column.index);
    const place = at(row.row, column.index + 1);
    const raw = readNumber(
      ctx,
      cell,
      place,
      `the ${HEADER_LABELS[column.header.name]}`,
    );
    if (raw === undefined) valuesOk = false;
    if (raw === null || raw === undefined) continue;
    const value = toCanonicalChecked(
      ctx,
      raw,
      column.header.unit,
      place,
      cell,
      `the ${HEADER_LABELS[column.header.name]}`,
    );
    if (value === undefined) valuesOk = false;
    else values.push({ column, value, place });
  }

  // Bubble point on this row.
  let bubble: BubbleRecord | undefined;
  if (rc.bubble) {
    const cell = cellAt(row, rc.bubble.index);
    const place = at(row.row, rc.bubble.index + 1);
    const raw = readNumber(ctx, cell, place, "the bubble point");
    if (raw !== null && raw !== undefined) {
      const pb = toCanonicalChecked(
        ctx,
        raw,
        rc.bubble.header.unit,
        place,
        cell,
        "the bubble point",
      );
      if (pb !== undefined && temperature !== undefined) {
        bubble = {
          temperature,
          pressure: pb,
          source: sourceOf(place),
          text: cellText(cell),
        };
      }
    }
  }

  if (pRaw === null) {
    // A row that only states a bubble point.
    if (
      rc.bubble &&
      !isEmptyCell(cellAt(row, rc.bubble.index)) &&
      values.length === 0 &&
      valuesOk
    ) {
      if (bubble) rc.result.bubblePoints.push(bubble);
      return;
    }
    ctx.findings.error(
      "MISSING_VALUE",
      pPlace,
      rc.bubble
        ? "the pressure is empty; every row with measurements needs one (a row with only a temperature and a bubble point may leave it empty)."
        : "the pressure is empty; every row needs one.",
      "",
    );
    return;
  }
  if (pRaw === undefined) return;
  const pressure = toCanonicalChecked(
    ctx,
    pRaw,
    rc.pressure.header.unit,
    pPlace,
    pCell,
    "the pressure",
  );
  if (pressure === undefined || temperature === undefined) return;

  const key = `${tidy(pressure)}|${tidy(temperature)}`;
  const first = rc.pairs.get(key);
  if (first !== undefined) {
    ctx.findings.error(
      "DUPLICATE_POINT",
      pPlace,
      `the pressure ${quote(cellText(pCell))} at temperature ${quote(cellText(tCell))} repeats row ${first}; give each pressure–temperature pair once.`,
      cellText(pCell),
    );
    return;
  }
  rc.pairs.set(key, row.row);
  if (bubble) rc.result.bubblePoints.push(bubble);
  for (const { column, value, place } of values) {
    const point: PointRecord = {
      property: column.header.name as PropertyKey,
      pressure,
      temperature,
      value,
      source: sourceOf(place),
    };
    rc.result.points.push(point);
  }
}
