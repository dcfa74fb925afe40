/**
 * One CSV cell, written safely: RFC 4180 quoting, plus the neutralisation of text that a spreadsheet would run
 * as a formula (OWASP "CSV Injection"; ASVS 5.0 requirement 1.2.10): a text cell starting with "=", "+", "-",
 * "@", tab, carriage return or NUL gets a leading single quote and is quoted, so Excel, LibreOffice and Sheets
 * show it as text. Numbers are written as numbers: -1.5 given as a number stays -1.5, while the text "-1.5"
 * (a label someone typed) is neutralised like any other text. Every CSV writer of the product uses this.
 */

export type CsvValue = string | number | null | undefined;

export type CsvCellOptions = {
  /** Field separator of the file; a cell holding it is quoted. Default ",". */
  readonly delimiter?: string;
  /** Decimal mark of numbers; "," needs a delimiter other than ",". Default ".". */
  readonly decimalMark?: "." | ",";
};

/** First characters that make a spreadsheet read a text cell as a formula (OWASP CSV Injection, ASVS 1.2.10). */
export const FORMULA_TRIGGERS = ["=", "+", "-", "@", "\t", "\r", "\0"] as const;

export function startsLikeFormula(text: string): boolean {
  return (
    text.length > 0 &&
    (FORMULA_TRIGGERS as readonly string[]).includes(text[0]!)
  );
}

function quoted(text: string): string {
  return `"${text.replace(/"/g, '""')}"`;
}

/** The cell as it goes between delimiters. */
export function csvCell(value: CsvValue, options: CsvCellOptions = {}): string {
  if (value === null || value === undefined) return "";
  const delimiter = options.delimiter ?? ",";
  if (typeof value === "number") {
    const text = String(value);
    return options.decimalMark === "," ? text.replace(".", ",") : text;
  }
  if (startsLikeFormula(value)) return quoted(`'${value}`);
  return /["\r\n]/.test(value) || value.includes(delimiter)
    ? quoted(value)
    : value;
}

/** One line of cells (no line end). */
export function csvRow(
  values: readonly CsvValue[],
  options: CsvCellOptions = {},
): string {
  return values.map((v) => csvCell(v, options)).join(options.delimiter ?? ",");
}

/**
 * A comment line ("# text"), one cell: line breaks become spaces, and a text holding the delimiter or a quote is
 * quoted whole, so that nothing after a delimiter can become a cell of its own (and a formula).
 */
export function csvCommentLine(
  text: string,
  options: CsvCellOptions = {},
): string {
  const line = `# ${text.replace(/[\r\n]+/g, " ")}`;
  return csvCell(line, options);
}
