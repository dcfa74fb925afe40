/**
 * What the layout readers share: the finding list, the file's decimal mark, unit conversion to canonical
 * units with checks, and the records they produce for the assembler.
 */
import {
  CANONICAL_UNITS,
  getUnit,
  isUnitError,
  toCanonical,
  UNITS,
  type PropertyKey,
  type Quantity,
  type UnitId,
} from "../units";
import { cellText, type RawCell } from "./cells";
import type { FindingList, Place } from "./findings";
import { quote } from "./findings";
import { notNumberHint, parseNumberText, type DecimalMark } from "./numbers";
import type { CellSource, Layout, UnitRef } from "./types";
import { roundSignificant } from "../format";

export interface SheetContext {
  readonly findings: FindingList;
  readonly decimalMark: DecimalMark;
  readonly barometricPsia?: number;
}

/** A header that named a property, and the units of its values and axes. */
export interface PropertyRecord {
  readonly property: PropertyKey;
  readonly unit: UnitRef;
  readonly pressureUnit: UnitRef;
  readonly temperatureUnit: UnitRef;
  /** Where the header (long) or block title (grid) is. */
  readonly place: Place;
  readonly headerText: string;
}

export interface PointRecord {
  readonly property: PropertyKey;
  readonly pressure: number;
  readonly temperature: number;
  readonly value: number;
  readonly source: CellSource;
}

export interface BubbleRecord {
  readonly temperature: number;
  readonly pressure: number;
  readonly source: CellSource;
  readonly text: string;
}

export interface SheetResult {
  readonly layout: Layout;
  readonly properties: PropertyRecord[];
  readonly points: PointRecord[];
  readonly bubblePoints: BubbleRecord[];
}

export function sourceOf(place: Place): CellSource {
  return {
    ...(place.sheet !== undefined ? { sheet: place.sheet } : {}),
    row: place.row ?? 0,
    column: place.column ?? 0,
  };
}

/** Canonical values keep 12 significant digits: enough for any measurement, and no float noise. */
export function tidy(value: number): number {
  return roundSignificant(value, 12);
}

/**
 * Read a number from a cell. Returns null for an empty cell and undefined (with an error) for a cell that
 * is not a number. `what` names the quantity in the message ("the pressure", "the oil viscosity").
 */
export function readNumber(
  ctx: SheetContext,
  cell: RawCell,
  place: Place,
  what: string,
): number | null | undefined {
  if (cell.kind === "empty") return null;
  if (cell.kind === "number") return cell.value;
  if (cell.kind === "other") {
    ctx.findings.error(
      "NOT_A_NUMBER",
      place,
      `${what} ${quote(cell.text)} is ${cell.what}, not a number; write a plain number.`,
      cell.text,
    );
    return undefined;
  }
  const value = parseNumberText(cell.text, ctx.decimalMark);
  if (value === null) {
    ctx.findings.error(
      "NOT_A_NUMBER",
      place,
      `${what} ${quote(cell.text)} is not a number; ${notNumberHint(cell.text, ctx.decimalMark)}.`,
      cell.text,
    );
    return undefined;
  }
  return value;
}

/**
 * Convert a value to canonical units, reporting negative or zero absolute pressures and temperatures below
 * absolute zero. Returns undefined (with an error) when the value cannot be used.
 */
export function toCanonicalChecked(
  ctx: SheetContext,
  value: number,
  unit: UnitRef,
  place: Place,
  cell: RawCell,
  what: string,
): number | undefined {
  const text = cellText(cell);
  if (
    unit.id === CANONICAL_UNITS[unit.quantity] &&
    unit.quantity !== "pressure" &&
    unit.quantity !== "temperature"
  ) {
    return value; // Already canonical: nothing to convert or tidy.
  }
  let canonical: number;
  try {
    canonical = toCanonical(value, unit.quantity, unit.id as UnitId<Quantity>, {
      ...(ctx.barometricPsia !== undefined
        ? { barometricPsia: ctx.barometricPsia }
        : {}),
    });
  } catch (error) {
    if (isUnitError(error) && error.code === "BELOW_ABSOLUTE_ZERO") {
      ctx.findings.error(
        "BELOW_ABSOLUTE_ZERO",
        place,
        `${what} ${quote(text)} ${unit.symbol} is below absolute zero.`,
        text,
      );
      return undefined;
    }
    if (isUnitError(error) && error.code === "NEGATIVE_ABSOLUTE_PRESSURE") {
      canonical = Number.NEGATIVE_INFINITY;
    } else {
      ctx.findings.error(
        "NOT_A_NUMBER",
        place,
        `${what} ${quote(text)} cannot be converted from ${unit.symbol}.`,
        text,
      );
      return undefined;
    }
  }
  if (unit.quantity === "pressure" && !(canonical > 0)) {
    const gauge = getUnit("pressure", unit.id).gauge;
    ctx.findings.error(
      "NEGATIVE_ABSOLUTE_PRESSURE",
      place,
      `${what} ${quote(text)} ${unit.symbol} is ${gauge ? "below a vacuum once the barometric pressure is added" : "not above zero"}, but absolute pressure must be above zero${gauge ? "" : "; check whether the values are gauge pressures and say so in the header (e.g. psig)"}.`,
      text,
    );
    return undefined;
  }
  return tidy(canonical);
}

/** Unit symbols of a quantity, for messages: "psia, psig, bara, …". */
export function unitChoices(quantity: Quantity): string {
  return Object.keys(UNITS[quantity]).join(", ");
}
