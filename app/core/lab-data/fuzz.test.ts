import fc from "fast-check";
import { expect, test } from "vitest";
import { parseUpload } from "./parse-upload";
import { runQc } from "./qc/run-qc";
import { datasetFromCanonicalGrids } from "./dataset";
import type { ParseOutcome } from "./types";

// Property-based fuzzing: whatever arrives, parseUpload returns grids or a list of findings — it never
// throws, never reports an internal error, and every finding is one sentence naming the file.

function wellFormed(outcome: ParseOutcome, file: string): void {
  if (outcome.ok) {
    expect(Object.keys(outcome.dataset.properties).length).toBeGreaterThan(0);
    for (const grid of Object.values(outcome.dataset.properties)) {
      expect(grid.values.length).toBe(grid.pressures.length);
      for (const row of grid.values) {
        expect(row.length).toBe(grid.temperatures.length);
        for (const v of row)
          expect(v === null || Number.isFinite(v)).toBe(true);
      }
      for (const p of grid.pressures) expect(p).toBeGreaterThan(0);
    }
  } else {
    expect(outcome.errors.length).toBeGreaterThan(0);
  }
  const findings = outcome.ok
    ? outcome.warnings
    : [...outcome.errors, ...outcome.warnings];
  for (const f of findings) {
    expect(f.code).not.toBe("INTERNAL_ERROR");
    expect(f.message.startsWith(`In ${file}`)).toBe(true);
    expect(f.message).not.toMatch(/\n/);
  }
}

test("random text never throws", async () => {
  await fc.assert(
    fc.asyncProperty(
      fc.oneof(
        fc.string({ maxLength: 400 }),
        fc.string({ unit: "binary", maxLength: 400 }),
      ),
      async (text) => {
        wellFormed(
          await parseUpload({
            filename: "fuzz.csv",
            bytes: new TextEncoder().encode(text),
          }),
          "fuzz.csv",
        );
      },
    ),
    { numRuns: 300 },
  );
});

test("random bytes never throw (also when they start like a ZIP archive or carry a byte-order mark)", async () => {
  const prefixes = [
    [],
    [0x50, 0x4b, 0x03, 0x04],
    [0xef, 0xbb, 0xbf],
    [0xff, 0xfe],
    [0x50, 0x4b, 0x05, 0x06],
  ];
  await fc.assert(
    fc.asyncProperty(
      fc.constantFrom(...prefixes),
      fc.uint8Array({ maxLength: 600 }),
      async (prefix, body) => {
        const bytes = Uint8Array.from([...prefix, ...body]);
        wellFormed(
          await parseUpload({ filename: "fuzz.xlsx", bytes }),
          "fuzz.xlsx",
        );
      },
    ),
    { numRuns: 300 },
  );
});

// Text built from the pieces real files are made of reaches far deeper into the parser than random text.
const TOKENS = [
  "pressure (psia)",
  "pressure (psig)",
  "pressure (psi)",
  "temperature (°F)",
  "temperature (°C)",
  "bubble point (psia)",
  "Bo (rb/STB)",
  "Rs (scf/STB)",
  "oil viscosity (cP)",
  "Z factor",
  "Bg (ft3/scf)",
  "gas viscosity (mPa.s)",
  "oil density (kg/m3)",
  "unknown (x)",
  "Bo",
  "",
  "",
  "1000",
  "2000",
  "220",
  "-20",
  "0",
  "1,5",
  "1.5",
  "0.0012",
  "1e3",
  "abc",
  "#",
  '"',
  "bubble point",
];

const tokenLines = fc.array(
  fc.tuple(
    fc.array(fc.constantFrom(...TOKENS), { maxLength: 7 }),
    fc.constantFrom(",", ";", "\t"),
  ),
  { maxLength: 14 },
);

test("random tables of real header, unit and number pieces never throw", async () => {
  await fc.assert(
    fc.asyncProperty(tokenLines, async (lines) => {
      const text = lines.map(([cells, d]) => cells.join(d)).join("\n");
      const outcome = await parseUpload({
        filename: "pieces.csv",
        bytes: new TextEncoder().encode(text),
      });
      wellFormed(outcome, "pieces.csv");
      if (outcome.ok) expect(() => runQc(outcome.dataset)).not.toThrow();
    }),
    { numRuns: 400 },
  );
});

test("random workbooks of the same pieces never throw", async () => {
  const ExcelJS = (await import("exceljs")).default;
  await fc.assert(
    fc.asyncProperty(
      fc.array(
        fc.array(
          fc.oneof(
            fc.constantFrom(...TOKENS),
            fc.double({ noNaN: false }),
            fc.constant(null),
          ),
          { maxLength: 6 },
        ),
        { maxLength: 10 },
      ),
      async (rows) => {
        const wb = new ExcelJS.Workbook();
        const ws = wb.addWorksheet("fuzz");
        for (const row of rows) ws.addRow(row);
        const bytes = new Uint8Array(await wb.xlsx.writeBuffer());
        wellFormed(
          await parseUpload({ filename: "fuzz.xlsx", bytes }),
          "fuzz.xlsx",
        );
      },
    ),
    { numRuns: 40 },
  );
}, 60_000);

test("runQc never throws, whatever the grids hold", () => {
  const value = fc.oneof(
    fc.double(),
    fc.constant(null),
    fc.constant(Number.NaN),
  );
  fc.assert(
    fc.property(
      fc.array(fc.double(), { maxLength: 6 }),
      fc.array(fc.double(), { maxLength: 3 }),
      fc.array(fc.array(value, { maxLength: 4 }), { maxLength: 7 }),
      fc.array(fc.record({ temperature: fc.double(), pressure: fc.double() }), {
        maxLength: 3,
      }),
      (pressures, temperatures, values, bubblePoints) => {
        const dataset = datasetFromCanonicalGrids({
          properties: {
            oil_fvf: { pressures, temperatures, values },
            solution_gor: { pressures, temperatures, values },
            gas_fvf: { pressures, temperatures, values },
          },
          bubblePoints,
        });
        const findings = runQc(dataset, { apiGravity: 35, gasGravity: 0.75 });
        for (const f of findings)
          expect(f.message).not.toContain("error in Isopleth itself");
      },
    ),
    { numRuns: 300 },
  );
});
