/**
 * XLSX workbooks into RawSheets, with exceljs (loaded on demand so that code which only runs the QC checks
 * does not carry it). Every visible worksheet becomes one RawSheet; hidden sheets are skipped with a note.
 */
import type { CellValue, Workbook } from "exceljs";
import { EMPTY_CELL, type RawCell, type RawRow, type RawSheet } from "./cells";
import type { FindingList } from "./findings";
import { zipDirectory } from "./sniff-file";

/** A workbook may unpack to at most this many bytes (a guard against ZIP bombs). */
const MAX_UNPACKED_BYTES = 100 * 1024 * 1024;
/** Rows and columns read per sheet at most. */
const MAX_SHEET_ROWS = 50_000;
const MAX_SHEET_COLUMNS = 1_000;

type ExcelModule = typeof import("exceljs");

async function loadExcel(): Promise<ExcelModule> {
  const mod = (await import("exceljs")) as ExcelModule & {
    default?: ExcelModule;
  };
  return mod.default ?? mod;
}

function fromValue(value: CellValue): RawCell {
  if (value === null || value === undefined) return EMPTY_CELL;
  if (typeof value === "number") {
    return Number.isFinite(value)
      ? { kind: "number", value, text: String(value) }
      : { kind: "other", text: String(value), what: "not a finite number" };
  }
  if (typeof value === "string") {
    const text = value.trim();
    return text === "" ? EMPTY_CELL : { kind: "text", text };
  }
  if (typeof value === "boolean")
    return {
      kind: "other",
      text: value ? "TRUE" : "FALSE",
      what: "a TRUE/FALSE value",
    };
  if (value instanceof Date) {
    return {
      kind: "other",
      text: Number.isNaN(value.getTime())
        ? "date"
        : value.toISOString().slice(0, 10),
      what: "a date",
    };
  }
  if ("error" in value)
    return {
      kind: "other",
      text: String(value.error),
      what: `the error value ${String(value.error)}`,
    };
  if ("richText" in value) {
    const text = (Array.isArray(value.richText) ? value.richText : [])
      .map((r) => String(r.text ?? ""))
      .join("")
      .trim();
    return text === "" ? EMPTY_CELL : { kind: "text", text };
  }
  if ("formula" in value || "sharedFormula" in value) {
    const result = (value as { result?: CellValue }).result;
    if (result === undefined || result === null) {
      return {
        kind: "other",
        text: `=${String((value as { formula?: unknown }).formula ?? "")}`,
        what: "a formula without a stored result (open and save the file in a spreadsheet program first)",
      };
    }
    return fromValue(result);
  }
  if ("text" in value) {
    const text = String(value.text ?? "").trim();
    return text === "" ? EMPTY_CELL : { kind: "text", text };
  }
  return { kind: "other", text: "?", what: "a value of an unknown kind" };
}

/**
 * Read the visible sheets of an XLSX workbook. Returns null (with findings) when the bytes are not a
 * readable workbook.
 */
export async function readXlsx(
  bytes: Uint8Array,
  findings: FindingList,
): Promise<RawSheet[] | null> {
  const directory = zipDirectory(bytes);
  if (directory === null) {
    findings.error(
      "UNREADABLE_WORKBOOK",
      {},
      "the file starts like a ZIP archive (as XLSX workbooks do) but its table of contents is damaged or missing; save it again from the spreadsheet program.",
    );
    return null;
  }
  if (!directory.names.includes("xl/workbook.xml")) {
    const what = directory.names.includes("content.xml")
      ? "an OpenDocument file"
      : directory.names.some((n) => n.startsWith("word/"))
        ? "a Word document"
        : directory.names.some((n) => n.startsWith("ppt/"))
          ? "a PowerPoint presentation"
          : "a ZIP archive";
    findings.error(
      "WRONG_FILE_TYPE",
      {},
      `the file is ${what}, not an Excel workbook; save the results as .xlsx or .csv.`,
    );
    return null;
  }
  if (directory.uncompressedBytes > MAX_UNPACKED_BYTES) {
    findings.error(
      "FILE_TOO_LARGE",
      {},
      `the workbook unpacks to more than ${MAX_UNPACKED_BYTES / 1024 / 1024} MB, far more than a table of laboratory results needs; upload only the results.`,
    );
    return null;
  }

  let workbook: Workbook;
  try {
    const ExcelJS = await loadExcel();
    workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(
      bytes as unknown as Parameters<typeof workbook.xlsx.load>[0],
    );
  } catch {
    findings.error(
      "UNREADABLE_WORKBOOK",
      {},
      "the workbook cannot be opened (it may be damaged, encrypted or password-protected); save it again as a plain .xlsx or as .csv.",
    );
    return null;
  }

  const sheets: RawSheet[] = [];
  let tooBig = false;
  workbook.eachSheet((worksheet) => {
    if (tooBig) return;
    const name = worksheet.name;
    if (worksheet.state !== "visible") {
      findings.info(
        "HIDDEN_SHEET_IGNORED",
        { sheet: name },
        "the sheet is hidden and was not read.",
      );
      return;
    }
    const rowCount = worksheet.rowCount;
    if (rowCount > MAX_SHEET_ROWS) {
      findings.error(
        "TOO_MANY_ROWS",
        { sheet: name },
        `the sheet has ${rowCount} rows; at most ${MAX_SHEET_ROWS} are read.`,
      );
      tooBig = true;
      return;
    }
    if (worksheet.columnCount > MAX_SHEET_COLUMNS) {
      findings.error(
        "TOO_MANY_ROWS",
        { sheet: name },
        `the sheet has ${worksheet.columnCount} columns; at most ${MAX_SHEET_COLUMNS} are read.`,
      );
      tooBig = true;
      return;
    }
    const rows: RawRow[] = [];
    for (let r = 1; r <= rowCount; r++) {
      const row = worksheet.findRow(r);
      const cells: RawCell[] = [];
      row?.eachCell({ includeEmpty: false }, (cell, column) => {
        // A cell covered by a merge repeats its master's value: treat it as empty.
        const isMergeSlave = cell.isMerged && cell.master !== cell;
        while (cells.length < column - 1) cells.push(EMPTY_CELL);
        cells[column - 1] = isMergeSlave ? EMPTY_CELL : fromValue(cell.value);
      });
      rows.push({ row: r, cells });
    }
    sheets.push({ name, rows });
  });
  return tooBig ? null : sheets;
}
