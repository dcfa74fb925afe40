// The XLSX and CSV downloads of a sheet, read back the way a spreadsheet reads them: the workbook with exceljs,
// the CSV with csv-parse. Numbers are number cells, text that looks like a formula stays text, the caution is
// in the file, and the CSV starts with the UTF-8 byte-order mark.
import { parse } from "csv-parse/sync";
import ExcelJS from "exceljs";
import { expect, test } from "vitest";
import { lookupSheet, TABLE_CAUTION, type Sheet } from "~/core/tables";
import { safeFileName, sheetDownload, sheetToXlsx } from "./spreadsheet";

const sheet: Sheet = lookupSheet({
  about: ["Isopleth lookup — sample =HYPERLINK(1), revision 1", TABLE_CAUTION],
  pressureUnit: "bara",
  temperatureUnit: "°C",
  conditions: [{ pressure: 200, temperature: 100 }],
  properties: [
    {
      property: "gas_fvf",
      unit: "rm³/sm³",
      digits: 5,
      points: [
        {
          value: 0.0050123456,
          errorEstimate: 1.234e-6,
          warnings: ["extrapolated"],
          method: "=1+1",
        },
      ],
    },
  ],
});

async function readBack(bytes: Uint8Array) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes.buffer as ArrayBuffer);
  return wb.worksheets[0]!;
}

test("XLSX: about lines, a bold frozen header in words with units, numbers as numbers, text never a formula", async () => {
  const ws = await readBack(await sheetToXlsx(sheet));
  expect(ws.name).toBe("Lookup");
  expect(ws.getCell("A1").value).toBe(
    "Isopleth lookup — sample =HYPERLINK(1), revision 1",
  );
  expect(ws.getCell("A2").value).toBe(TABLE_CAUTION);
  const header = ws.getRow(4);
  expect(header.font?.bold).toBe(true);
  expect(header.getCell(1).value).toBe("Pressure (bara)");
  expect(header.getCell(2).value).toBe("Temperature (°C)");
  expect(header.getCell(3).value).toBe("Gas formation volume factor (rm³/sm³)");
  expect(ws.views[0]).toMatchObject({ state: "frozen", ySplit: 4 });
  const row = ws.getRow(5);
  expect(row.getCell(1).value).toBe(200);
  expect(row.getCell(3).value).toBe(0.0050123);
  expect(row.getCell(3).type).toBe(ExcelJS.ValueType.Number);
  expect(row.getCell(4).value).toBe(0.0000012);
  expect(row.getCell(5).value).toBe("=1+1");
  expect(row.getCell(5).type).toBe(ExcelJS.ValueType.String);
  expect(row.getCell(6).value).toBe("extrapolated");
});

test("downloads: attachment names, content types, and the CSV's byte-order mark", async () => {
  const csv = await sheetDownload(sheet, "csv", "isopleth lookup/CS-1 (rev 2)");
  expect(csv.headers.get("Content-Disposition")).toBe(
    'attachment; filename="isopleth-lookup-CS-1-rev-2.csv"',
  );
  expect(csv.headers.get("Content-Type")).toBe("text/csv; charset=utf-8");
  const bytes = new Uint8Array(await csv.arrayBuffer());
  expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  const rows = parse(Buffer.from(bytes), {
    bom: true,
    relax_column_count: true,
  }) as string[][];
  expect(rows[2]![1]).toBe("Temperature (°C)");
  expect(rows[3]![4]).toBe("'=1+1");

  const xlsx = await sheetDownload(sheet, "xlsx", "x");
  expect(xlsx.headers.get("Content-Type")).toBe(
    "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
  );
  const ws = await readBack(new Uint8Array(await xlsx.arrayBuffer()));
  expect(ws.getRow(5).getCell(1).value).toBe(200);
  expect(safeFileName("“Ünïcode” set")).toBe("Unicode-set");
});
