/**
 * parseUpload: bytes of an uploaded CSV or XLSX file → a ParsedDataset in canonical units, or the list of
 * everything wrong with it. Never throws for bad input: every problem becomes a Finding naming the file,
 * sheet, row, column and value.
 */
import {
  cellAt,
  isBlankRow,
  isCommentRow,
  isEmptyCell,
  type RawSheet,
} from "./cells";
import { FindingList, quote, type Place } from "./findings";
import { numberStyle, type DecimalMark } from "./numbers";
import { isGridTitleRow, parseGridSheet } from "./parse-grid";
import { parseLongSheet } from "./parse-long";
import { readCsv, type Delimiter } from "./read-csv";
import { readXlsx } from "./read-xlsx";
import { assemble } from "./assemble";
import type { SheetContext, SheetResult } from "./sheet-context";
import {
  extensionOf,
  sniffFile,
  TEXT_EXTENSIONS,
  WORKBOOK_EXTENSIONS,
} from "./sniff-file";
import type {
  FileFormat,
  Finding,
  Layout,
  ParsedDataset,
  ParseOptions,
  ParseOutcome,
} from "./types";
import { formatFileSize } from "../format";

import { MAX_UPLOAD_BYTES } from "./limits";

export { MAX_UPLOAD_BYTES };

/** Extensions accepted on the upload page. */
export const ACCEPTED_EXTENSIONS: readonly string[] = [
  ...TEXT_EXTENSIONS,
  ...WORKBOOK_EXTENSIONS,
];

/** A file name safe to show: no folders, no control characters, not too long. */
export function displayFileName(filename: unknown): string {
  const raw = typeof filename === "string" ? filename : "";
  const base = (raw.split(/[\\/]/).pop() ?? "").replace(/\p{Cc}/gu, "").trim();
  if (base === "") return "the uploaded file";
  return base.length > 120 ? `${base.slice(0, 117)}…` : base;
}

export async function parseUpload(
  input: { readonly filename: string; readonly bytes: Uint8Array },
  options: ParseOptions = {},
): Promise<ParseOutcome> {
  const file = displayFileName(input?.filename);
  const findings = new FindingList(file);
  try {
    const dataset = await parseInto(input, options, file, findings);
    if (dataset === null || findings.hasErrors) {
      if (!findings.hasErrors)
        findings.error("NO_DATA", {}, "no measurements were found.");
      return {
        ok: false,
        errors: findings.finalErrors(),
        warnings: findings.warnings,
      };
    }
    return { ok: true, dataset, warnings: findings.warnings };
  } catch {
    const internal: Finding = {
      code: "INTERNAL_ERROR",
      severity: "error",
      message: `In ${file}, the file could not be read because of an error in Isopleth itself; nothing was stored. Please report it with the file.`,
      location: { file },
    };
    return {
      ok: false,
      errors: [...findings.finalErrors(), internal],
      warnings: findings.warnings,
    };
  }
}

async function parseInto(
  input: { readonly filename: string; readonly bytes: Uint8Array },
  options: ParseOptions,
  file: string,
  findings: FindingList,
): Promise<ParsedDataset | null> {
  const bytes = input?.bytes;
  if (!(bytes instanceof Uint8Array)) {
    findings.error("EMPTY_FILE", {}, "no file content was received.");
    return null;
  }
  if (bytes.length > MAX_UPLOAD_BYTES) {
    findings.error(
      "FILE_TOO_LARGE",
      {},
      `the file is ${formatFileSize(bytes.length)}, over the ${formatFileSize(MAX_UPLOAD_BYTES)} limit; upload only the results table.`,
    );
    return null;
  }
  if (bytes.length === 0) {
    findings.error("EMPTY_FILE", {}, "the file is empty.");
    return null;
  }
  const sniff = sniffFile(bytes);
  let format: FileFormat;
  let sheets: RawSheet[];
  let delimiter: Delimiter | undefined;
  let encoding: "utf-8" | "utf-16" | "windows-1252" | undefined;
  if (sniff.kind === "binary") {
    if (sniff.offset !== undefined) {
      findings.error(
        "BINARY_CONTENT",
        {},
        `the file is not a text table: it ${sniff.what} (character ${sniff.offset + 1} has code ${sniff.byte ?? 0}); upload a CSV or XLSX file.`,
      );
    } else {
      findings.error(
        "WRONG_FILE_TYPE",
        {},
        `the file is ${sniff.what}, not a CSV or XLSX table; save the results as .csv or .xlsx.`,
      );
    }
    return null;
  }
  const extension = extensionOf(
    typeof input.filename === "string" ? input.filename : "",
  );
  if (extension !== "" && !ACCEPTED_EXTENSIONS.includes(extension)) {
    findings.error(
      "WRONG_FILE_TYPE",
      {},
      `files of type ${quote(`.${extension}`)} are not accepted; upload a .csv, .tsv, .txt or .xlsx file.`,
      `.${extension}`,
    );
    return null;
  }
  if (sniff.kind === "zip") {
    format = "xlsx";
    if (TEXT_EXTENSIONS.includes(extension)) {
      findings.warn(
        "CONTENT_TYPE_MISMATCH",
        {},
        `the file is named ${quote(`.${extension}`)} but holds an Excel workbook; it was read as XLSX.`,
      );
    }
    const read = await readXlsx(bytes, findings);
    if (read === null) return null;
    sheets = read;
  } else {
    format = "csv";
    encoding = sniff.encoding;
    if (WORKBOOK_EXTENSIONS.includes(extension)) {
      findings.warn(
        "CONTENT_TYPE_MISMATCH",
        {},
        `the file is named ${quote(`.${extension}`)} but holds plain text; it was read as CSV.`,
      );
    }
    if (sniff.encoding === "windows-1252") {
      findings.warn(
        "LEGACY_ENCODING",
        {},
        'the text is not UTF-8, so it was read as Windows-1252 (Western European); check that symbols such as "°" look right, or save as "CSV UTF-8".',
      );
    }
    if (sniff.text.trim() === "") {
      findings.error("EMPTY_FILE", {}, "the file holds no text.");
      return null;
    }
    const read = readCsv(sniff.text, findings);
    if (read === null) return null;
    sheets = [read.sheet];
    delimiter = read.delimiter;
  }

  const contentSheets = sheets.filter((s) =>
    s.rows.some((r) => !isBlankRow(r) && !isCommentRow(r)),
  );
  if (contentSheets.length === 0) {
    findings.error(
      "EMPTY_FILE",
      {},
      format === "xlsx"
        ? "the workbook's sheets hold no table."
        : "the file holds only comments or blank lines.",
    );
    return null;
  }

  const decimalMark = decideDecimalMark(contentSheets, delimiter, findings);
  if (decimalMark === null) return null;
  const ctx: SheetContext = {
    findings,
    decimalMark,
    ...(options.barometricPsia !== undefined
      ? { barometricPsia: options.barometricPsia }
      : {}),
  };

  const results: SheetResult[] = [];
  const seenTitles = new Map<string, Place>();
  for (const sheet of contentSheets) {
    results.push(
      detectLayout(sheet) === "grid"
        ? parseGridSheet(ctx, sheet, seenTitles)
        : parseLongSheet(ctx, sheet),
    );
  }
  const assembled = assemble(results, findings);
  if (findings.hasErrors) return null;
  if (Object.keys(assembled.properties).length === 0) {
    findings.error(
      "NO_DATA",
      {},
      "no property values were found under the headers.",
    );
    return null;
  }
  const layout: Layout = results[0]?.layout ?? "long";
  return {
    properties: assembled.properties,
    bubblePoints: assembled.bubblePoints,
    file: {
      name: file,
      format,
      layout,
      ...(encoding !== undefined ? { encoding } : {}),
      ...(delimiter !== undefined ? { delimiter } : {}),
      decimalMark,
      ...(format === "xlsx"
        ? { sheets: contentSheets.map((s) => s.name ?? "") }
        : {}),
    },
  };
}

/** Grid when the first content row is a block title and the next row does not start with a number. */
export function detectLayout(sheet: RawSheet): Layout {
  const rows = sheet.rows.filter((r) => !isBlankRow(r) && !isCommentRow(r));
  const [first, second] = rows;
  if (!first || !isGridTitleRow(first)) return "long";
  if (!second) return "grid";
  const cell = cellAt(second, 0);
  if (isEmptyCell(cell)) return "grid";
  if (cell.kind === "number") return "long";
  return cell.kind === "text" && numberStyle(cell.text) !== null
    ? "long"
    : "grid";
}

/**
 * The decimal mark of the file. A comma is accepted when the columns are not separated by commas and no
 * number in the file uses a decimal point; otherwise each comma number is reported as ambiguous.
 */
function decideDecimalMark(
  sheets: readonly RawSheet[],
  delimiter: Delimiter | undefined,
  findings: FindingList,
): DecimalMark | null {
  let firstDot: { place: Place; text: string } | undefined;
  const commas: { place: Place; text: string }[] = [];
  for (const sheet of sheets) {
    for (const row of sheet.rows) {
      if (isCommentRow(row)) continue;
      row.cells.forEach((cell, c) => {
        if (cell.kind !== "text") return;
        const style = numberStyle(cell.text);
        const place: Place = {
          ...(sheet.name !== undefined ? { sheet: sheet.name } : {}),
          row: row.row,
          column: c + 1,
        };
        if (style === "dot" && !firstDot) firstDot = { place, text: cell.text };
        if (style === "comma") commas.push({ place, text: cell.text });
      });
    }
  }
  if (commas.length === 0) return ".";
  if (delimiter === ",") {
    for (const c of commas) {
      findings.error(
        "AMBIGUOUS_DECIMAL",
        c.place,
        `the value ${quote(c.text)} has a comma in a comma-separated file, so it is ambiguous; use a decimal point, or separate the columns with semicolons.`,
        c.text,
      );
    }
    return null;
  }
  if (firstDot) {
    const dot = firstDot;
    for (const c of commas) {
      findings.error(
        "AMBIGUOUS_DECIMAL",
        c.place,
        `the value ${quote(c.text)} uses a decimal comma while row ${dot.place.row ?? "?"}${dot.place.sheet !== undefined ? ` of sheet ${quote(dot.place.sheet)}` : ""} writes ${quote(dot.text)} with a decimal point, so the comma could be a thousands separator; use one decimal mark throughout.`,
        c.text,
      );
    }
    return null;
  }
  const example = commas[0];
  if (example) {
    findings.info(
      "DECIMAL_COMMA",
      example.place,
      `numbers were read with a decimal comma (${quote(example.text)} = ${example.text.replace(",", ".")}).`,
      example.text,
    );
  }
  return ",";
}
