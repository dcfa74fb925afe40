/**
 * The reader-independent view of a file: sheets of rows of cells, with the row and column numbers a person
 * sees in a spreadsheet program. CSV files give one sheet (name undefined); XLSX workbooks one per sheet.
 */
export type RawCell =
  | { readonly kind: "empty" }
  | { readonly kind: "text"; readonly text: string }
  | { readonly kind: "number"; readonly value: number; readonly text: string }
  /** Dates, booleans, error values, formulas without a stored result. */
  | { readonly kind: "other"; readonly text: string; readonly what: string };

export interface RawRow {
  /** 1-based row (CSV: line on which the record starts). */
  readonly row: number;
  readonly cells: readonly RawCell[];
  /** CSV only: number of fields in the record, including trailing empty ones. */
  readonly fieldCount?: number;
}

export interface RawSheet {
  readonly name?: string;
  readonly rows: readonly RawRow[];
}

export const EMPTY_CELL: RawCell = Object.freeze({ kind: "empty" });

export function cellAt(row: RawRow, column: number): RawCell {
  return row.cells[column] ?? EMPTY_CELL;
}

export function isEmptyCell(cell: RawCell): boolean {
  return cell.kind === "empty";
}

/** The cell as the person wrote it. */
export function cellText(cell: RawCell): string {
  return cell.kind === "empty" ? "" : cell.text;
}

export function isBlankRow(row: RawRow): boolean {
  return row.cells.every(isEmptyCell);
}

/** A comment row: its first non-empty cell starts with "#". */
export function isCommentRow(row: RawRow): boolean {
  const first = row.cells.find((c) => !isEmptyCell(c));
  return (
    first !== undefined && first.kind === "text" && first.text.startsWith("#")
  );
}

/** Index after the last non-empty cell. */
export function usedWidth(row: RawRow): number {
  for (let i = row.cells.length - 1; i >= 0; i--) {
    const cell = row.cells[i];
    if (cell && !isEmptyCell(cell)) return i + 1;
  }
  return 0;
}

/** "A", "B", … "Z", "AA", … for a 1-based column. */
export function columnLetter(column: number): string {
  let n = column;
  let out = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    out = String.fromCharCode(65 + r) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}
