import { readFile } from "node:fs/promises";
import { expect, test, type Download } from "@playwright/test";
import { parse } from "csv-parse/sync";
import ExcelJS from "exceljs";
import { signIn } from "../support/e2e";

/*
 * Exports and saved-set runs in the browser, on the invented demo scenario (app/.server/db/seed.ts: sample 1
 * measured at 400 … 5400 psia). The files are read back as a spreadsheet would read them: the XLSX with
 * exceljs, the CSV with csv-parse. The numbers themselves are checked in tests/integration.
 */

const CAUTION = /Interpolated and extrapolated properties are estimates/;

async function rowsOfXlsx(download: Download): Promise<unknown[][]> {
  const wb = new ExcelJS.Workbook();
  const bytes = await readFile((await download.path())!);
  await wb.xlsx.load(
    bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength),
  );
  return Array.from(wb.worksheets[0]!.getSheetValues(), (r) =>
    Array.isArray(r) ? r.slice(1) : [],
  );
}

async function rowsOfCsv(download: Download): Promise<string[][]> {
  const bytes = await readFile((await download.path())!);
  expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  return parse(bytes, { bom: true, relax_column_count: true }) as string[][];
}

test("the lookup page exports XLSX and CSV: headers in words with units, the caution in the file", async ({
  page,
}) => {
  await signIn(page, "engineer");
  await page.goto("/lookup?sample=1");
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByTestId("results-table")).toBeVisible();

  const [xlsx] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("button", { name: "Export XLSX" }).click(),
  ]);
  expect(xlsx.suggestedFilename()).toBe(
    "isopleth-lookup-CS-1-BH-01-rev-1.xlsx",
  );
  const sheet = await rowsOfXlsx(xlsx);
  const h = sheet.findIndex((r) => r[0] === "Pressure (psia)");
  expect(sheet[h]).toContain("Oil formation volume factor (rb/STB)");
  expect(sheet[h]).toContain("Temperature (°F)");
  expect(typeof sheet[h + 1]![2]).toBe("number");
  expect(sheet.flat().some((c) => CAUTION.test(String(c)))).toBe(true);

  const [csv] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("button", { name: "Export CSV" }).click(),
  ]);
  const rows = await rowsOfCsv(csv);
  const c = rows.findIndex((r) => r[0] === "Pressure (psia)");
  expect(rows[c]).toEqual(sheet[h]);
  expect(Number(rows[c + 1]![2])).toBe(sheet[h + 1]![2]);
  expect(rows.flat().some((x) => CAUTION.test(x))).toBe(true);
  // The page is still the lookup page with its results.
  await expect(page.getByTestId("results-table")).toBeVisible();
});

test("a saved set with extrapolation on: its run shows the settings, flags, estimates and methods, exports, and two runs compare", async ({
  page,
}) => {
  await signIn(page, "engineer");
  await page.goto("/lookup?sample=1");
  await page.getByRole("tab", { name: "Pasted list" }).click();
  await page
    .getByRole("textbox", { name: /one pair per line/ })
    .fill("pressure\ttemperature\n3000\t212\n6000\t212");
  await page.getByLabel(/Allow extrapolation/).check();
  const name = `Export check ${Date.now()}`;
  page.once("dialog", (d) => void d.accept(name));
  await page.getByRole("button", { name: "Save as set" }).click();
  await expect(page.getByRole("status")).toContainText(`Saved “${name}”`);
  await page.reload();
  const item = page.getByRole("listitem").filter({ hasText: name });
  await expect(item).toContainText("extrapolation on");
  await item.getByRole("link", { name: "Runs" }).click();

  await expect(
    page.getByRole("heading", { name: `Lookup set: ${name}` }),
  ).toBeVisible();
  await page.getByRole("button", { name: /Run against revision 1/ }).click();
  const table = page.getByTestId("set-run-table");
  await expect(table.locator("tbody tr")).toHaveCount(2);
  await expect(page.getByTestId("run-settings")).toContainText(
    "extrapolation on · field units",
  );
  // 6000 psia is past the measured 5400 psia: flagged, with its estimate and method.
  const far = page.getByTestId("run-oil_fvf-1");
  await expect(far).toContainText("extrapolated");
  await expect(far).toContainText("±");
  await expect(page.getByTestId("run-oil_fvf-0")).toContainText(
    /newton|pchip|linear/,
  );

  const [csv] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("link", { name: "Export CSV" }).click(),
  ]);
  const rows = await rowsOfCsv(csv);
  const h = rows.findIndex((r) => r[0] === "Pressure (psia)");
  expect(rows[h + 2]![0]).toBe("6000");
  expect(rows[h + 2]!.join(" ")).toContain("extrapolated");
  expect(rows.flat().some((x) => CAUTION.test(x))).toBe(true);
  const [xlsx] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("link", { name: "Export XLSX" }).click(),
  ]);
  expect((await rowsOfXlsx(xlsx)).flat()).toContain(
    "Oil formation volume factor (rb/STB)",
  );

  // A second run of the same revision: the comparison shows nothing changed.
  await page.getByRole("button", { name: /Run against revision 1/ }).click();
  await expect(page.getByTestId("set-runs").locator("li")).toHaveCount(2);
  await expect(
    page.getByTestId("set-compare-table").locator("tbody tr"),
  ).toHaveCount(2);
  await expect(page.getByTestId("compare-summary")).toContainText(
    "0 values changed",
  );

  // Clean up: delete the set.
  await page.goto("/lookup");
  await page.getByRole("button", { name: `Delete ${name}` }).click();
  await expect(
    page.getByRole("listitem").filter({ hasText: name }),
  ).toHaveCount(0);
});
