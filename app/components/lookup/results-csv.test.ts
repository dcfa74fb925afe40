// The lookup's CSV and clipboard forms (OWASP "CSV Injection"): a sample label that is a formula stays inside its
// "# …" line's one cell, text cells are neutralised, numbers (negative ones too) stay numbers; headers in words
// with units, a byte-order mark on the CSV. Parsed back with csv-parse.
import { parse } from "csv-parse/sync";
import { expect, test } from "vitest";
import { lookupResultsDelimited } from "./results-csv";
import type { PropertyRun } from "./property-run";

const runs: PropertyRun[] = [
  {
    property: "oil_fvf",
    ok: true,
    revision: 1,
    revisionStatus: "approved",
    approved: true,
    unit: "rb/STB",
    bases: {
      standardConditions: "60 °F, 14.696 psia",
      reportStandardConditions: "60 °F, 14.696 psia",
      pressureBasis: "absolute",
      barometricPressurePsia: 14.696,
    },
    methodDescription: "bilinear",
    degree: null,
    serverMs: 1,
    results: [
      {
        value: -1.5,
        errorEstimate: 0.001,
        warnings: [],
        // not a method the API names: a hostile text cell, to see it neutralised
        method: "=1+1" as "newton",
        stencil: { pressure: [], temperature: [] },
      },
    ],
    summary: {
      count: 1,
      refusedCount: 0,
      refusalCounts: {},
      methodCounts: {},
      warningCounts: {},
    },
  },
];

test("a formula in the label or in a text cell is written as text; numbers stay numbers", () => {
  const label = '=HYPERLINK("http://evil.example","x")';
  const csv = lookupResultsDelimited(
    [{ pressure: 3000, temperature: -10 }],
    runs,
    { pressure: "psia", temperature: "degF" },
    ",",
    [`Isopleth lookup — sample ${label}, revision 1`, label],
    () => [],
  );
  expect(csv.startsWith("\uFEFF")).toBe(true);
  const rows = parse(csv, {
    bom: true,
    relax_column_count: true,
  }) as string[][];
  expect(rows[0]).toEqual([`# Isopleth lookup — sample ${label}, revision 1`]);
  expect(rows[1]).toEqual([`# ${label}`]);
  expect(rows[2]).toEqual([
    "Pressure (psia)",
    "Temperature (degF)",
    "Oil formation volume factor (rb/STB)",
    "Oil formation volume factor error estimate (rb/STB)",
    "Oil formation volume factor method",
    "Oil formation volume factor warnings",
  ]);
  expect(rows[3]).toEqual(["3000", "-10", "-1.5", "0.001", "'=1+1", ""]);
  // No cell a spreadsheet would run: only numbers may start with "-".
  for (const cell of rows.flat())
    expect(cell).toMatch(/^(?![=+@\t\r])(?!-(?![\d.]))/);
});

test("the clipboard form (tab-separated) neutralises too", () => {
  const tsv = lookupResultsDelimited(
    [{ pressure: 3000, temperature: 200 }],
    runs,
    { pressure: "psia", temperature: "degF" },
    "\t",
    [],
    () => [],
  );
  expect(tsv.startsWith("Pressure (psia)\t")).toBe(true);
  expect(tsv.split("\r\n")[1]).toBe('3000\t200\t-1.5\t0.001\t"\'=1+1"\t');
});
