/**
 * The grid layout: one block per property (several blocks per sheet, or one sheet per block), blocks
 * separated by at least one blank row.
 *
 *   oil viscosity (cP), pressure (psia), temperature (°F)      ← title row: property, pressure and temperature units
 *   ,                   180,             220                   ← temperatures (first cell empty or a label)
 *   5000,               0.612,           0.498                 ← pressure, then one value per temperature
 *   4000,               0.571,           0.463
 *
 * A bubble-point block has a title row "bubble point (psia), temperature (°F)", a row of temperatures and
 * one row of bubble points (first cell empty or "bubble point").
 */
import type { PropertyKey } from "../units";
import {
  cellAt,
  cellText,
  columnLetter,
  isBlankRow,
  isCommentRow,
  isEmptyCell,
  usedWidth,
  type RawRow,
  type RawSheet,
} from "./cells";
import { quote, type Place } from "./findings";
import { headerNameOf, parseHeaderCell, type HeaderCell } from "./header-cell";
import { HEADER_LABELS, isPropertyName } from "./header-names";
import { numberStyle } from "./numbers";
import {
  readNumber,
  sourceOf,
  toCanonicalChecked,
  type SheetContext,
  type SheetResult,
} from "./sheet-context";

interface Block {
  readonly title: HeaderCell;
  readonly titleRow: RawRow;
  readonly pressure?: HeaderCell;
  readonly temperature: HeaderCell;
  /** Temperatures (canonical) by column index; undefined where the header cell was unusable. */
  temperatures?: (number | undefined)[];
  temperatureTexts?: string[];
  /** Number of columns of the block (first column + temperatures). */
  width: number;
  headerFields?: number;
  dataRows: number;
  readonly pressures: Map<number, number>;
  ok: boolean;
}

/** Is this row a block title (its first cell names a property or the bubble point)? */
export function isGridTitleRow(row: RawRow): boolean {
  const name = headerNameOf(cellAt(row, 0));
  return name !== null && (isPropertyName(name) || name === "bubble_point");
}

function looksNumeric(text: string): boolean {
  return numberStyle(text) !== null;
}

export function parseGridSheet(
  ctx: SheetContext,
  sheet: RawSheet,
  seenTitles: Map<string, Place>,
): SheetResult {
  const result: SheetResult = {
    layout: "grid",
    properties: [],
    points: [],
    bubblePoints: [],
  };
  const at = (row: number, column?: number): Place => ({
    ...(sheet.name !== undefined ? { sheet: sheet.name } : {}),
    row,
    ...(column !== undefined ? { column } : {}),
  });
  let block: Block | null = null;
  let skipping = false;

  const close = (): void => {
    if (block && block.ok && block.temperatures && block.dataRows === 0) {
      ctx.findings.error(
        "NO_DATA",
        at(block.titleRow.row, 1),
        `the block ${quote(block.title.text)} has no rows of values under its temperatures.`,
        block.title.text,
      );
    } else if (block && block.ok && !block.temperatures) {
      ctx.findings.error(
        "MISSING_VALUE",
        at(block.titleRow.row, 1),
        `the block ${quote(block.title.text)} has no row of temperatures under its title.`,
        block.title.text,
      );
    }
    block = null;
  };

  for (const row of sheet.rows) {
    if (isCommentRow(row)) continue;
    if (isBlankRow(row)) {
      close();
      skipping = false;
      continue;
    }
    const first = cellAt(row, 0);
    const awaitingBubbleRow =
      block?.title.name === "bubble_point" &&
      block.temperatures !== undefined &&
      block.dataRows === 0;
    const startsTitle = isGridTitleRow(row) && !awaitingBubbleRow;
    if (block === null || startsTitle) {
      if (block !== null) close();
      if (skipping && !startsTitle) continue;
      skipping = false;
      block = openBlock(ctx, row, at, seenTitles, result);
      if (!block) skipping = true; // Skip the rest of an unusable block, up to the next blank row or title.
      continue;
    }
    const current: Block = block;
    if (!current.ok) continue;

    if (!current.temperatures) {
      readTemperatureRow(ctx, current, row, at);
      continue;
    }

    // Ragged rows.
    if (row.fieldCount !== undefined && row.fieldCount < current.width) {
      const last = cellText(cellAt(row, row.fieldCount - 1));
      ctx.findings.error(
        "RAGGED_ROW",
        at(row.row, row.fieldCount),
        `the row has ${row.fieldCount} field${row.fieldCount === 1 ? "" : "s"} (ending with ${quote(last)}) but the block ${quote(current.title.text)} has ${current.width} columns; add empty fields for values that were not measured.`,
        last,
      );
      continue;
    }
    const used = usedWidth(row);
    if (used > current.width) {
      const extra = cellText(cellAt(row, used - 1));
      ctx.findings.error(
        "RAGGED_ROW",
        at(row.row, used),
        `the value ${quote(extra)} lies beyond the last temperature of the block ${quote(current.title.text)}; every column needs a temperature in the row under the title.`,
        extra,
      );
      continue;
    }

    if (current.title.name === "bubble_point") {
      readBubbleRow(ctx, current, row, at, result);
    } else {
      readValueRow(ctx, current, row, at, result, first);
    }
  }
  close();
  return result;
}

function openBlock(
  ctx: SheetContext,
  row: RawRow,
  at: (row: number, column?: number) => Place,
  seenTitles: Map<string, Place>,
  result: SheetResult,
): Block | null {
  const first = cellAt(row, 0);
  if (!isGridTitleRow(row)) {
    const text = cellText(first);
    if (looksNumeric(text) || isEmptyCell(first)) {
      ctx.findings.error(
        "UNKNOWN_LAYOUT",
        at(row.row, 1),
        `a block title row was expected (such as "oil viscosity (cP), pressure (psia), temperature (°F)") but the row starts with ${quote(text)}; separate blocks with one blank row.`,
        text,
      );
    } else {
      const header = parseHeaderCell(ctx, first, at(row.row, 1), {
        aloneInRow: usedWidth(row) === 1,
      }); // explains the name or unit
      if (header) {
        ctx.findings.error(
          "UNKNOWN_LAYOUT",
          at(row.row, 1),
          `a block starts with ${quote(text)}, but a block title names a property (such as "oil viscosity (cP)") followed by its pressure and temperature units.`,
          text,
        );
      }
    }
    return null;
  }
  const title = parseHeaderCell(ctx, first, at(row.row, 1));
  if (!title) return null;
  let pressure: HeaderCell | undefined;
  let temperature: HeaderCell | undefined;
  let ok = true;
  const width = usedWidth(row);
  for (let c = 1; c < width; c++) {
    const cell = cellAt(row, c);
    if (isEmptyCell(cell)) continue;
    const header = parseHeaderCell(ctx, cell, at(row.row, c + 1));
    if (!header) {
      ok = false;
      continue;
    }
    if (
      header.name === "pressure" &&
      !pressure &&
      title.name !== "bubble_point"
    )
      pressure = header;
    else if (header.name === "temperature" && !temperature)
      temperature = header;
    else {
      ctx.findings.error(
        "UNKNOWN_COLUMN",
        at(row.row, c + 1),
        `the block title row may hold only the property, ${title.name === "bubble_point" ? "" : "its pressure unit and "}its temperature unit, but it also has ${quote(header.text)}.`,
        header.text,
      );
      ok = false;
    }
  }
  if (!ok) return null;
  if (!temperature || (!pressure && title.name !== "bubble_point")) {
    const needs =
      title.name === "bubble_point"
        ? 'a cell "temperature (°F)"'
        : 'cells such as "pressure (psia)" and "temperature (°F)"';
    ctx.findings.error(
      "MISSING_UNIT",
      at(row.row, 1),
      `the block title ${quote(title.text)} needs ${needs} beside it, stating the units of the first column and of the row of temperatures.`,
      title.text,
    );
    return null;
  }
  const key = title.name;
  const previous = seenTitles.get(key);
  if (previous) {
    ctx.findings.error(
      "DUPLICATE_PROPERTY",
      at(row.row, 1),
      `the block ${quote(title.text)} repeats the ${HEADER_LABELS[title.name]} given at ${describeShort(previous)}; give each property in one block.`,
      title.text,
    );
    return null;
  }
  seenTitles.set(key, at(row.row, 1));
  if (isPropertyName(title.name) && pressure) {
    result.properties.push({
      property: title.name as PropertyKey,
      unit: title.unit,
      pressureUnit: pressure.unit,
      temperatureUnit: temperature.unit,
      place: at(row.row, 1),
      headerText: title.text,
    });
  }
  return {
    title,
    titleRow: row,
    ...(pressure ? { pressure } : {}),
    temperature,
    width: 0,
    dataRows: 0,
    pressures: new Map(),
    ok: true,
  };
}

export function describeShort(place: Place): string {
  const parts: string[] = [];
  if (place.sheet !== undefined) parts.push(`sheet ${quote(place.sheet)}`);
  if (place.row !== undefined) parts.push(`row ${place.row}`);
  return parts.join(", ");
}

function readTemperatureRow(
  ctx: SheetContext,
  block: Block,
  row: RawRow,
  at: (row: number, column?: number) => Place,
): void {
  const corner = cellAt(row, 0);
  if (
    corner.kind === "number" ||
    (corner.kind === "text" && looksNumeric(corner.text))
  ) {
    ctx.findings.error(
      "MISSING_VALUE",
      at(row.row, 1),
      `the row under the block title ${quote(block.title.text)} should list the temperatures with its first cell empty, but it starts with ${quote(cellText(corner))}.`,
      cellText(corner),
    );
    block.ok = false;
    return;
  }
  const width = usedWidth(row);
  if (width < 2) {
    ctx.findings.error(
      "MISSING_VALUE",
      at(row.row, 2),
      `the row under the block title ${quote(block.title.text)} has no temperatures.`,
      "",
    );
    block.ok = false;
    return;
  }
  const temperatures: (number | undefined)[] = [undefined];
  const texts: string[] = [cellText(corner)];
  const seen = new Map<number, number>();
  for (let c = 1; c < width; c++) {
    const cell = cellAt(row, c);
    const place = at(row.row, c + 1);
    texts.push(cellText(cell));
    if (isEmptyCell(cell)) {
      ctx.findings.error(
        "MISSING_VALUE",
        place,
        `the temperature is empty in the middle of the row of temperatures of block ${quote(block.title.text)}.`,
        "",
      );
      block.ok = false;
      temperatures.push(undefined);
      continue;
    }
    const raw = readNumber(ctx, cell, place, "the temperature");
    const t =
      raw === null || raw === undefined
        ? undefined
        : toCanonicalChecked(
            ctx,
            raw,
            block.temperature.unit,
            place,
            cell,
            "the temperature",
          );
    if (t === undefined) {
      block.ok = false;
      temperatures.push(undefined);
      continue;
    }
    const dup = seen.get(t);
    if (dup !== undefined) {
      ctx.findings.error(
        "DUPLICATE_POINT",
        place,
        `the temperature ${quote(cellText(cell))} appears twice in the row of temperatures of block ${quote(block.title.text)} (also column ${columnLetter(dup)}).`,
        cellText(cell),
      );
      block.ok = false;
    }
    seen.set(t, c + 1);
    temperatures.push(t);
  }
  block.temperatures = temperatures;
  block.temperatureTexts = texts;
  block.width = width;
}

function readValueRow(
  ctx: SheetContext,
  block: Block,
  row: RawRow,
  at: (row: number, column?: number) => Place,
  result: SheetResult,
  first: ReturnType<typeof cellAt>,
): void {
  block.dataRows++;
  const pPlace = at(row.row, 1);
  const pressureUnit = block.pressure;
  if (!pressureUnit) return;
  const pRaw = readNumber(ctx, first, pPlace, "the pressure");
  if (pRaw === null) {
    ctx.findings.error(
      "MISSING_VALUE",
      pPlace,
      `the pressure is empty; in block ${quote(block.title.text)} each row starts with its pressure.`,
      "",
    );
    return;
  }
  if (pRaw === undefined) return;
  const pressure = toCanonicalChecked(
    ctx,
    pRaw,
    pressureUnit.unit,
    pPlace,
    first,
    "the pressure",
  );
  if (pressure === undefined) return;
  const dup = block.pressures.get(pressure);
  if (dup !== undefined) {
    ctx.findings.error(
      "DUPLICATE_POINT",
      pPlace,
      `the pressure ${quote(cellText(first))} repeats row ${dup} of block ${quote(block.title.text)}; give each pressure once per block.`,
      cellText(first),
    );
    return;
  }
  block.pressures.set(pressure, row.row);
  const label = `the ${HEADER_LABELS[block.title.name]}`;
  for (let c = 1; c < block.width; c++) {
    const temperature = block.temperatures?.[c];
    const cell = cellAt(row, c);
    const place = at(row.row, c + 1);
    const raw = readNumber(ctx, cell, place, label);
    if (raw === null || raw === undefined || temperature === undefined)
      continue;
    const value = toCanonicalChecked(
      ctx,
      raw,
      block.title.unit,
      place,
      cell,
      label,
    );
    if (value === undefined) continue;
    result.points.push({
      property: block.title.name as PropertyKey,
      pressure,
      temperature,
      value,
      source: sourceOf(place),
    });
  }
}

function readBubbleRow(
  ctx: SheetContext,
  block: Block,
  row: RawRow,
  at: (row: number, column?: number) => Place,
  result: SheetResult,
): void {
  const corner = cellAt(row, 0);
  if (block.dataRows > 0) {
    ctx.findings.error(
      "RAGGED_ROW",
      at(row.row, 1),
      `the bubble-point block ${quote(block.title.text)} takes one row of bubble points, but this is a second one (starting ${quote(cellText(corner))}).`,
      cellText(corner),
    );
    return;
  }
  block.dataRows++;
  if (!isEmptyCell(corner) && headerNameOf(corner) !== "bubble_point") {
    ctx.findings.error(
      "UNKNOWN_COLUMN",
      at(row.row, 1),
      `the row of bubble points should start with an empty cell or "bubble point", not ${quote(cellText(corner))}.`,
      cellText(corner),
    );
    return;
  }
  for (let c = 1; c < block.width; c++) {
    const temperature = block.temperatures?.[c];
    const cell = cellAt(row, c);
    const place = at(row.row, c + 1);
    const raw = readNumber(ctx, cell, place, "the bubble point");
    if (raw === null || raw === undefined || temperature === undefined)
      continue;
    const pb = toCanonicalChecked(
      ctx,
      raw,
      block.title.unit,
      place,
      cell,
      "the bubble point",
    );
    if (pb === undefined) continue;
    result.bubblePoints.push({
      temperature,
      pressure: pb,
      source: sourceOf(place),
      text: cellText(cell),
    });
  }
}
