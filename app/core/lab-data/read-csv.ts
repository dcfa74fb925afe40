/**
 * Delimited text (CSV, semicolon-separated, tab-separated) into a RawSheet, with csv-parse.
 * Lines starting with "#" are comments. Blank lines are kept: they separate blocks in the grid layout.
 */
import { parse } from "csv-parse/sync";
import type { RawCell, RawRow, RawSheet } from "./cells";
import { EMPTY_CELL } from "./cells";
import { quote, type FindingList } from "./findings";

export type Delimiter = "," | ";" | "\t";
const DELIMITERS: readonly Delimiter[] = [",", ";", "\t"];

/** Number of fields a line splits into with a delimiter, ignoring delimiters inside double quotes. */
function fieldCount(line: string, delimiter: Delimiter): number {
  let count = 1;
  let quoted = false;
  for (const ch of line) {
    if (ch === '"') quoted = !quoted;
    else if (ch === delimiter && !quoted) count++;
  }
  return count;
}

/**
 * Pick the delimiter: the one that splits the most of the first 50 content lines into two or more fields,
 * then the one giving the most lines with the commonest field count. Ties keep the order comma, semicolon, tab.
 */
function detectDelimiter(text: string): Delimiter {
  const lines = text
    .split(/\r\n|\n|\r/)
    .filter((l) => l.trim() !== "" && !l.trimStart().startsWith("#"))
    .slice(0, 50);
  let best: Delimiter = ",";
  let bestScore = -1;
  for (const d of DELIMITERS) {
    const counts = lines.map((l) => fieldCount(l, d));
    const split = counts.filter((c) => c >= 2).length;
    const tally = new Map<number, number>();
    for (const c of counts) if (c >= 2) tally.set(c, (tally.get(c) ?? 0) + 1);
    const modal = Math.max(0, ...tally.values());
    const score = split * 1000 + modal;
    if (score > bestScore) {
      best = d;
      bestScore = score;
    }
  }
  return best;
}

function toCell(field: string): RawCell {
  const text = field.trim();
  return text === "" ? EMPTY_CELL : { kind: "text", text };
}

interface CsvRecord {
  readonly record: string[];
  readonly info: { readonly lines: number };
}

/** Read delimited text. Returns null (with a finding) when the text is not well-formed CSV. */
export function readCsv(
  text: string,
  findings: FindingList,
): { sheet: RawSheet; delimiter: Delimiter } | null {
  const delimiter = detectDelimiter(text);
  let records: CsvRecord[];
  try {
    records = parse(text, {
      delimiter,
      relax_column_count: true,
      skip_empty_lines: false,
      comment: "#",
      comment_no_infix: true,
      info: true,
      bom: true,
    }) as unknown as CsvRecord[];
  } catch (error) {
    const e = error as { code?: unknown; lines?: unknown };
    const line =
      typeof e.lines === "number" && e.lines > 0 ? e.lines : undefined;
    const why =
      e.code === "CSV_QUOTE_NOT_CLOSED"
        ? "a double quote opened here is never closed"
        : e.code === "INVALID_OPENING_QUOTE"
          ? "a double quote appears in the middle of a field"
          : e.code === "CSV_INVALID_CLOSING_QUOTE"
            ? "a closing double quote is followed by more text in the same field"
            : "the line cannot be split into fields";
    const lineText =
      line !== undefined ? (text.split(/\r\n|\n|\r/)[line - 1] ?? "") : "";
    findings.error(
      "CSV_SYNTAX",
      line !== undefined ? { row: line } : {},
      `the line ${quote(lineText)} cannot be read as ${delimiterName(delimiter)}-separated values because ${why}; remove the stray quote or put the whole field in double quotes.`,
      lineText,
    );
    return null;
  }
  const rows: RawRow[] = records.map(({ record, info }) => {
    // info.lines is the line on which the record ends; quoted line breaks push it past the start line.
    const breaks = record.reduce(
      (n, f) => n + (f.match(/\r\n|\n|\r/g)?.length ?? 0),
      0,
    );
    return {
      row: Math.max(1, info.lines - breaks),
      cells: record.map(toCell),
      fieldCount: record.length,
    };
  });
  return { sheet: { rows }, delimiter };
}

function delimiterName(d: Delimiter): string {
  return d === "," ? "comma" : d === ";" ? "semicolon" : "tab";
}
