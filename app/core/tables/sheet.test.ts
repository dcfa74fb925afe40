// Spreadsheet sheets of lookups and tables: the rounding rule, headers in words with units from the property
// catalogue, refused points, the caution in the file, and CSV with a UTF-8 byte-order mark read back with a
// real parser (csv-parse). The sample is invented (generated from published correlations).
import { parse } from "csv-parse/sync";
import { describe, expect, test } from "vitest";
import { generateSample } from "../properties";
import { fromCanonical, toCanonical } from "../units";
import {
  buildBlackOilTable,
  formatTableJson,
  lookupSheet,
  measuredDigits,
  measuredTablePressures,
  parsePressureSpec,
  roundEstimate,
  roundForExport,
  sheetToDelimited,
  TABLE_CAUTION,
  tableSheet,
  UTF8_BOM,
} from "./index";
import { significantDigitsOf } from "./sheet";

describe("rounding", () => {
  test("significant digits as a value is written (integers count every digit)", () => {
    expect(significantDigitsOf(1.2345)).toBe(5);
    expect(significantDigitsOf(2500)).toBe(4);
    expect(significantDigitsOf(0.0123)).toBe(3);
    expect(significantDigitsOf(-1.5e-7)).toBe(2);
    expect(significantDigitsOf(0)).toBe(0);
  });

  test("a grid's measured digits are read in the laboratory's unit; conversion round-off is not a reading", () => {
    // Rs reported in sm³/sm³ with four digits (e.g. 101.2), stored in scf/STB (× 5.6146 …, many digits).
    const reported = [
      [101.2, 95.5],
      [null, 88.25],
    ];
    const stored = reported.map((row) =>
      row.map((v) =>
        v === null ? null : toCanonical(v, "gas_oil_ratio", "sm3/sm3"),
      ),
    );
    expect(String(stored[0]![0]).replace(/\D/g, "").length).toBeGreaterThan(10);
    expect(measuredDigits(stored)).toBeNull();
    expect(
      measuredDigits(stored, (v) =>
        fromCanonical(v, "gas_oil_ratio", "sm3/sm3"),
      ),
    ).toBe(4);
    expect(measuredDigits([[1.2345, 1.2, null]])).toBe(5);
  });

  test("the issue's numbers: 1.1388518499999998 ± 4.842082290679173e-15 and ± 0.0012", () => {
    // Five measured digits and a tiny estimate: the grid's five digits.
    expect(roundForExport(1.1388518499999998, 4.842082290679173e-15, 5)).toBe(
      1.1389,
    );
    expect(roundEstimate(4.842082290679173e-15)).toBe(4.8e-15);
    // Grid precision unknown: six digits.
    expect(roundForExport(1.1388518499999998, null, null)).toBe(1.13885);
    // An estimate of 0.012 leaves the value at the estimate's second digit (0.001): 1.139.
    expect(roundForExport(1.1388518499999998, 0.012, 6)).toBe(1.139);
    expect(roundEstimate(0.012345)).toBe(0.012);
    // Never fewer than two digits, whatever the estimate.
    expect(roundForExport(1.1388518499999998, 50, 6)).toBe(1.1);
    expect(roundForExport(-0.00001, 1, 6)).toBe(-0.00001);
    expect(Object.is(roundForExport(-0, null, 6), -0)).toBe(true);
  });
});

const lookup = lookupSheet({
  about: ["Isopleth lookup — sample =SUM(A1), revision 2", TABLE_CAUTION],
  pressureUnit: "psia",
  temperatureUnit: "°F",
  conditions: [
    { pressure: 3000, temperature: 212 },
    { pressure: 6000, temperature: 212 },
  ],
  properties: [
    {
      property: "oil_fvf",
      unit: "rb/STB",
      digits: 4,
      points: [
        {
          value: 1.1388518499999998,
          errorEstimate: 0.000123456,
          warnings: ["near-bubble-point"],
          method: "newton",
        },
        {
          value: null,
          errorEstimate: null,
          warnings: [],
          method: null,
          refused: {
            code: "outside-measured-range",
            message:
              "Point 2: pressure 6000 psia lies outside the measured range.",
          },
        },
      ],
    },
    {
      property: "gas_fvf",
      unit: "ft³/scf",
      digits: null,
      points: [
        {
          value: 0.00501234567,
          errorEstimate: 2e-7,
          warnings: [],
          method: "pchip",
        },
        undefined,
      ],
    },
    {
      property: "z_factor",
      unit: "–",
      digits: 3,
      points: [
        {
          value: 0.912345,
          errorEstimate: null,
          warnings: [],
          method: "linear",
        },
        { value: 0.95, errorEstimate: 0.001, warnings: [], method: "linear" },
      ],
    },
  ],
});

describe("a lookup as a sheet", () => {
  test("headers are words with units from the property catalogue", () => {
    expect(lookup.header).toEqual([
      "Pressure (psia)",
      "Temperature (°F)",
      "Oil formation volume factor (rb/STB)",
      "Oil formation volume factor error estimate (rb/STB)",
      "Oil formation volume factor method",
      "Oil formation volume factor warnings",
      "Gas formation volume factor (ft³/scf)",
      "Gas formation volume factor error estimate (ft³/scf)",
      "Gas formation volume factor method",
      "Gas formation volume factor warnings",
      "Gas deviation factor (dimensionless)",
      "Gas deviation factor error estimate (dimensionless)",
      "Gas deviation factor method",
      "Gas deviation factor warnings",
    ]);
  });

  test("values rounded to the grid's digits, estimates to two; a refused point keeps its reason", () => {
    expect(lookup.rows[0]).toEqual([
      3000,
      212,
      1.139,
      0.00012,
      "newton",
      "near-bubble-point",
      0.00501235,
      2e-7,
      "pchip",
      "",
      0.912,
      null,
      "linear",
      "",
    ]);
    expect(lookup.rows[1]!.slice(2, 6)).toEqual([
      null,
      null,
      null,
      "refused: Point 2: pressure 6000 psia lies outside the measured range.",
    ]);
    expect(lookup.rows[1]!.slice(6, 10)).toEqual([
      null,
      null,
      null,
      "not computed",
    ]);
  });

  test("CSV: a byte-order mark, °F intact, the caution and a formula-like label as one neutral comment cell", () => {
    const csv = sheetToDelimited(lookup);
    expect(csv.startsWith(UTF8_BOM)).toBe(true);
    expect(csv).toContain("\r\n");
    // What a spreadsheet receives: the bytes, decoded as UTF-8 (the mark tells it to).
    const bytes = new TextEncoder().encode(csv);
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const rows = parse(new TextDecoder().decode(bytes), {
      bom: true,
      relax_column_count: true,
    }) as string[][];
    expect(rows[0]).toEqual([
      "# Isopleth lookup — sample =SUM(A1), revision 2",
    ]);
    expect(rows[1]).toEqual([`# ${TABLE_CAUTION}`]);
    expect(rows[2]![1]).toBe("Temperature (°F)");
    expect(rows[2]![6]).toBe("Gas formation volume factor (ft³/scf)");
    expect(rows[3]!.slice(0, 4)).toEqual(["3000", "212", "1.139", "0.00012"]);
    expect(rows).toHaveLength(5);
  });

  test("the clipboard form: tab-separated, no mark, no comment lines", () => {
    const tsv = sheetToDelimited(lookup, {
      delimiter: "\t",
      bom: false,
      about: false,
    });
    expect(tsv.startsWith("Pressure (psia)\tTemperature (°F)\t")).toBe(true);
    expect(tsv.split("\r\n")).toHaveLength(4);
  });
});

describe("a black-oil table as a sheet", () => {
  const sample = generateSample({
    apiGravity: 35,
    gasGravity: 0.75,
    rsb: 600,
    pressures: Array.from({ length: 23 }, (_, i) => 500 + 250 * i),
    temperatures: [120, 150, 180, 210, 240],
    noise: 0.01,
    seed: 3,
  });
  const table = buildBlackOilTable({
    grids: sample.grids,
    temperature: 212,
    pressures: parsePressureSpec("500:6000:500").pressures,
    method: "auto",
  });
  const json = formatTableJson(table, {
    units: "metric",
    sampleLabel: "Invented sample A (well 7)",
    revision: 4,
    generatedAt: "2026-01-02T03:04:05.000Z",
  });
  const sheet = tableSheet(json, ["UNAPPROVED DRAFT: do not use"]);

  test("headers in words with the metric units; the numbers are the JSON form's", () => {
    expect(sheet.header.slice(0, 3)).toEqual([
      "Pressure (bara)",
      "Solution gas–oil ratio (sm³/sm³)",
      "Oil formation volume factor (rm³/sm³)",
    ]);
    expect(sheet.header).toContain("Gas deviation factor (dimensionless)");
    expect(sheet.header).toContain(
      "Oil formation volume factor error estimate (rm³/sm³)",
    );
    const bo = sheet.header.indexOf("Oil formation volume factor (rm³/sm³)");
    sheet.rows.forEach((r, i) => {
      expect(r[0]).toBe(json.rows[i]!.pressure);
      expect(r[bo]).toBe(json.rows[i]!.oil_fvf);
    });
    const pb = sheet.rows.findIndex((r) =>
      r.some((c) => typeof c === "string" && c.startsWith("bubble point")),
    );
    expect(json.rows[pb]!.bubblePoint).toBe(true);
  });

  test("the about lines: draft first, temperature in °C, the caution", () => {
    expect(sheet.about[0]).toBe("UNAPPROVED DRAFT: do not use");
    expect(sheet.about).toContain("Temperature: 100 °C");
    expect(sheet.about.at(-1)).toBe(`Caution: ${TABLE_CAUTION}`);
    expect(sheet.about.join("\n")).toMatch(/standard conditions 15 °C/);
  });

  test("default pressures: the measured ones every grid covers", () => {
    const p = measuredTablePressures(sample.grids);
    expect(p[0]).toBe(500);
    expect(p.at(-1)).toBe(6000);
    expect(p).toHaveLength(23);
    const narrower = {
      ...sample.grids,
      gas_fvf: {
        ...sample.grids.gas_fvf!,
        pressures: sample.grids.gas_fvf!.pressures.slice(2, 10),
        values: sample.grids.gas_fvf!.values.slice(2, 10),
      },
    };
    expect(measuredTablePressures(narrower)).toEqual(
      PRESSURES_BETWEEN(1000, 2750),
    );
    expect(measuredTablePressures(narrower, true)).toHaveLength(23);
    expect(measuredTablePressures({})).toEqual([]);
  });
});

function PRESSURES_BETWEEN(low: number, high: number): number[] {
  const out: number[] = [];
  for (let p = low; p <= high; p += 250) out.push(p);
  return out;
}
