/**
 * One header cell: "oil viscosity (cP)", "Bo [rb/STB]", "Pressure, psia", "Z factor". Finds the name and
 * the unit, resolves both, and reports anything it cannot use.
 */
import {
  isUnitError,
  parseUnitLabel,
  PROPERTY_KEYS,
  quotedHeader,
  type Quantity,
} from "../units";
import { cellText, type RawCell } from "./cells";
import { quote, type Place } from "./findings";
import {
  HEADER_QUANTITIES,
  HEADER_LABELS,
  resolveHeaderName,
  type HeaderName,
} from "./header-names";
import { unitChoices, type SheetContext } from "./sheet-context";
import type { UnitRef } from "./types";

export interface HeaderCell {
  readonly name: HeaderName;
  readonly unit: UnitRef;
  readonly text: string;
}

/** Split "Name (unit)", "Name [unit]" or "Name, unit"; null when there is no unit part. */
function splitHeaderText(text: string): { name: string; unit: string } | null {
  const t = text.trim();
  const last = t.at(-1);
  if (last === ")" || last === "]") {
    const open = last === ")" ? "(" : "[";
    let depth = 0;
    for (let i = t.length - 1; i >= 0; i--) {
      const ch = t[i];
      if (ch === last) depth++;
      else if (ch === open && --depth === 0) {
        const name = t.slice(0, i).trim();
        const unit = t.slice(i + 1, -1).trim();
        return name && unit ? { name, unit } : null;
      }
    }
    return null;
  }
  const comma = t.lastIndexOf(",");
  if (comma > 0) {
    const name = t.slice(0, comma).trim();
    const unit = t.slice(comma + 1).trim();
    return name && unit ? { name, unit } : null;
  }
  return null;
}

const KNOWN_NAMES = [
  '"pressure"',
  '"temperature"',
  '"bubble point"',
  ...PROPERTY_KEYS.map(quotedHeader),
];
const SHORT_NAMES = `${KNOWN_NAMES.slice(0, -1).join(", ")} and ${KNOWN_NAMES.at(-1)}`;

/** The name part of a header if it is one we know (used to tell layouts apart). */
export function headerNameOf(cell: RawCell): HeaderName | null {
  if (cell.kind !== "text") return null;
  const split = splitHeaderText(cell.text);
  return resolveHeaderName(split ? split.name : cell.text);
}

/**
 * Parse a header cell. Reports a finding and returns null when the name or unit cannot be used.
 * `aloneInRow` adds a hint for a free-text title line.
 */
export function parseHeaderCell(
  ctx: SheetContext,
  cell: RawCell,
  place: Place,
  options: { readonly aloneInRow?: boolean } = {},
): HeaderCell | null {
  const text = cellText(cell);
  if (cell.kind !== "text") {
    ctx.findings.error(
      "UNKNOWN_COLUMN",
      place,
      `the header ${quote(text)} should be a name with its unit in brackets, such as "pressure (psia)", not a number.`,
      text,
    );
    return null;
  }
  const split = splitHeaderText(text);
  const name = resolveHeaderName(split ? split.name : text);
  if (name === null) {
    const hint = options.aloneInRow
      ? ' If this line is a title or a note, start it with "#" so it is read as a comment.'
      : "";
    ctx.findings.error(
      "UNKNOWN_COLUMN",
      place,
      `the header ${quote(text)} does not name a property we know; use ${SHORT_NAMES}, each followed by its unit in brackets.${hint}`,
      text,
    );
    return null;
  }
  const quantity: Quantity = HEADER_QUANTITIES[name];
  if (!split) {
    if (name === "z_factor") {
      return {
        name,
        text,
        unit: { quantity: "dimensionless", id: "-", symbol: "–", label: "" },
      };
    }
    ctx.findings.error(
      "MISSING_UNIT",
      place,
      `the header ${quote(text)} has no unit; write it with its unit in brackets, e.g. "${text} (${defaultUnitHint(quantity)})".`,
      text,
    );
    return null;
  }
  try {
    const parsed = parseUnitLabel(split.unit, { quantity });
    return {
      name,
      text,
      unit: {
        quantity,
        id: parsed.unit,
        symbol: parsed.symbol,
        label: split.unit,
      },
    };
  } catch (error) {
    const label = HEADER_LABELS[name];
    if (isUnitError(error) && error.code === "AMBIGUOUS_UNIT") {
      ctx.findings.error(
        "AMBIGUOUS_UNIT",
        place,
        `the unit in the header ${quote(text)} is ambiguous: ${lowerFirst(error.message)}`,
        text,
      );
    } else if (isUnitError(error) && error.code === "WRONG_QUANTITY") {
      ctx.findings.error(
        "WRONG_UNIT",
        place,
        `the header ${quote(text)} has a unit of the wrong kind for ${label}: ${lowerFirst(error.message)}`,
        text,
      );
    } else {
      ctx.findings.error(
        "UNKNOWN_UNIT",
        place,
        `the unit ${quote(split.unit)} in the header ${quote(text)} is not a ${label} unit we know; use one of ${unitChoices(quantity)}.`,
        text,
      );
    }
    return null;
  }
}

function lowerFirst(message: string): string {
  return /^[A-Z][a-z]/.test(message)
    ? message.charAt(0).toLowerCase() + message.slice(1)
    : message;
}

function defaultUnitHint(quantity: Quantity): string {
  switch (quantity) {
    case "pressure":
      return "psia";
    case "temperature":
      return "°F";
    case "oil_fvf":
      return "rb/STB";
    case "gas_fvf":
      return "rb/scf";
    case "gas_oil_ratio":
      return "scf/STB";
    case "viscosity":
      return "cP";
    case "density":
      return "lb/ft3";
    case "compressibility":
      return "1/psi";
    case "dimensionless":
      return "-";
  }
}
