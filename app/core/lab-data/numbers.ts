/**
 * Numbers as written in cells. Accepted: an optional sign, digits with one decimal mark, an optional
 * exponent ("1.2e-5"). Not accepted: thousands separators, units inside the cell, "N/A", "-" (leave a cell
 * empty when nothing was measured).
 *
 * The decimal mark is decided once per file: a point, or a comma when the file is separated by semicolons
 * or tabs (or is a workbook) and no cell uses a decimal point — otherwise "1,234" would be ambiguous.
 */
export type DecimalMark = "." | ",";

const INTEGER = /^[+-]?\d+(?:[eE][+-]?\d+)?$/;
const DOT_DECIMAL = /^[+-]?(?:\d+\.\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const COMMA_DECIMAL = /^[+-]?(?:\d+,\d*|,\d+)(?:[eE][+-]?\d+)?$/;

/** Trim, fold the Unicode minus sign and no-break spaces. */
function tidyNumberText(text: string): string {
  return text
    .replace(/[\u00a0\u202f]/g, " ")
    .trim()
    .replace(/^[\u2212\u2013]/, "-");
}

type NumberStyle = "integer" | "dot" | "comma";

/** How a cell's text writes a number, or null when it is not a number in either style. */
export function numberStyle(text: string): NumberStyle | null {
  const t = tidyNumberText(text);
  if (INTEGER.test(t)) return "integer";
  if (DOT_DECIMAL.test(t)) return "dot";
  if (COMMA_DECIMAL.test(t)) return "comma";
  return null;
}

/** The number a cell's text stands for under the file's decimal mark, or null. Never NaN or ±∞. */
export function parseNumberText(
  text: string,
  mark: DecimalMark,
): number | null {
  const t = tidyNumberText(text);
  const style = numberStyle(t);
  if (style === null) return null;
  if (style === "comma" && mark !== ",") return null;
  if (style === "dot" && mark !== ".") return null;
  const value = Number(style === "comma" ? t.replace(",", ".") : t);
  return Number.isFinite(value) ? value : null;
}

/** Short hint on why a text is not a number, for messages. */
export function notNumberHint(text: string, mark: DecimalMark): string {
  const t = tidyNumberText(text);
  if (
    /^[+-]?\d{1,3}([,. ']\d{3})+([.,]\d+)?$/.test(t) &&
    numberStyle(t) === null
  ) {
    return "remove the thousands separators";
  }
  if (numberStyle(t) === "comma" && mark === ".")
    return "this file uses a decimal point";
  if (numberStyle(t) === "dot" && mark === ",")
    return "this file uses a decimal comma";
  if (/^[+-]?[\d.,]+(?:[eE][+-]?\d+)?\s*\S+$/.test(t))
    return "put the unit in the column header, not in the cell";
  if (/^(n\/?a|nd|-+|—|–|\?)$/i.test(t))
    return "leave the cell empty when nothing was measured";
  return "write a plain number";
}
