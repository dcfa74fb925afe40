import type { Sheet } from "~/core/tables";
import { sheetToDelimited } from "~/core/tables";

/*
 * Downloads of a sheet (app/core/tables/sheet.ts) as a file: CSV (UTF-8 with a byte-order mark, so a
 * spreadsheet reads °F and ft³ as written) or XLSX (exceljs). Both hold the same rounded numbers and the
 * sheet's about lines — what it is, its sample and revision, and the estimates caution — above the header.
 */

export const EXPORT_FORMATS = ["csv", "xlsx"] as const;
type ExportFormat = (typeof EXPORT_FORMATS)[number];

const XLSX_TYPE =
  "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/**
 * The sheet as an XLSX workbook: the about lines in the first column (italic), a blank row, the header (bold,
 * frozen), then the rows; numbers are number cells and text is text (a string cell is never a formula, so a
 * label starting with "=" stays text).
 */
export async function sheetToXlsx(sheet: Sheet): Promise<Uint8Array> {
  const mod = (await import("exceljs")) as typeof import("exceljs") & {
    default?: typeof import("exceljs");
  };
  const ExcelJS = mod.default ?? mod;
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Isopleth";
  const ws = workbook.addWorksheet(sheet.name.slice(0, 31));
  for (const line of sheet.about) ws.addRow([line]).font = { italic: true };
  ws.addRow([]);
  const header = ws.addRow(sheet.header);
  header.font = { bold: true };
  header.alignment = { wrapText: true, vertical: "top" };
  ws.views = [{ state: "frozen", ySplit: header.number }];
  for (const row of sheet.rows) ws.addRow(row);
  sheet.header.forEach((h, j) => {
    ws.getColumn(j + 1).width = Math.min(40, Math.max(12, h.length * 0.6));
  });
  const buffer = await workbook.xlsx.writeBuffer();
  return new Uint8Array(buffer as ArrayBuffer);
}

/** A file name without characters a file system or a Content-Disposition header would trip on. */
export function safeFileName(base: string): string {
  return (
    base
      .normalize("NFKD")
      .replace(/\p{M}+/gu, "")
      .replace(/[^\w.-]+/g, "-")
      .replace(/-+/g, "-")
      .replace(/^-|-$/g, "")
      .slice(0, 100) || "isopleth-export"
  );
}

/** The sheet as a download (`attachment`): `<fileBase>.csv` or `<fileBase>.xlsx`. */
export async function sheetDownload(
  sheet: Sheet,
  format: ExportFormat,
  fileBase: string,
  headers: HeadersInit = {},
): Promise<Response> {
  const name = `${safeFileName(fileBase)}.${format}`;
  const h = new Headers(headers);
  h.set("Content-Disposition", `attachment; filename="${name}"`);
  h.set("Cache-Control", "private, no-store");
  if (format === "csv") {
    h.set("Content-Type", "text/csv; charset=utf-8");
    return new Response(sheetToDelimited(sheet), { status: 200, headers: h });
  }
  h.set("Content-Type", XLSX_TYPE);
  const bytes = await sheetToXlsx(sheet);
  return new Response(new Blob([bytes as Uint8Array<ArrayBuffer>]), {
    status: 200,
    headers: h,
  });
}
