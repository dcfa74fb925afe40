// The three output forms of a table: CSV parsed back gives the JSON numbers, the text layout's columns are
// in the units its comments state, metric output, another standard-conditions base, enough digits to keep
// rows apart, and bad options. The sample is invented (generated from published correlations).
import { parse } from "csv-parse/sync";
import { describe, expect, test } from "vitest";
import { generateSample } from "../properties";
import { defineStandardConditions } from "../units";
import {
  buildBlackOilTable,
  formatTableCsv,
  formatTableJson,
  formatTableText,
  parsePressureSpec,
  TABLE_CAUTION,
  TABLE_COLUMNS,
  TableError,
  type TableFormatOptions,
} from "./index";

const PRESSURES = Array.from({ length: 23 }, (_, i) => 500 + 250 * i);
const TEMPERATURES = [120, 150, 180, 210, 240];
const sample = generateSample({
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  pressures: PRESSURES,
  temperatures: TEMPERATURES,
  noise: 0.01,
  seed: 3,
});
const table = buildBlackOilTable({
  grids: sample.grids,
  temperature: 212,
  pressures: parsePressureSpec("500:6000:250").pressures,
  method: "auto",
});
const OPTIONS: TableFormatOptions = {
  units: "field",
  sampleLabel: "Invented sample A (well 7)",
  revision: 4,
  generatedAt: "2024-05-06T07:08:09Z",
};
const BAR = 14.503773773022; // psi per bar

const FIELD_HEADER = [
  "pressure (psia)",
  "Rs (scf/STB)",
  "Bo (rb/STB)",
  "oil viscosity (cP)",
  "Bg (ft3/scf)",
  "gas viscosity (cP)",
  "z-factor (-)",
  "branch",
  "note",
];
const METRIC_HEADER = [
  "pressure (bara)",
  "Rs (sm3/sm3)",
  "Bo (rm3/sm3)",
  "oil viscosity (mPa.s)",
  "Bg (rm3/sm3)",
  "gas viscosity (mPa.s)",
  "z-factor (-)",
  "branch",
  "note",
];

describe("CSV: parsed back, the same numbers as JSON", () => {
  test.each([
    ["field", FIELD_HEADER],
    ["metric", METRIC_HEADER],
  ] as const)("%s units", (units, header) => {
    const json = formatTableJson(table, { ...OPTIONS, units });
    const records: string[][] = parse(
      formatTableCsv(table, { ...OPTIONS, units }),
    );
    expect(records[0]).toEqual(header);
    expect(records).toHaveLength(json.rows.length + 1);
    json.rows.forEach((row, i) => {
      const rec = records[i + 1]!;
      expect(Number(rec[0])).toBe(row.pressure);
      TABLE_COLUMNS.forEach((key, j) =>
        expect(Number(rec[j + 1])).toBe(row[key]),
      );
      expect(rec[7]).toBe(row.branch);
      expect(rec[8]!.includes("bubble point")).toBe(row.bubblePoint);
      expect(rec[8]!.includes("corrected")).toBe(row.corrected.length > 0);
    });
  });

  test("metric numbers are the field numbers converted (bara, sm³/sm³ at 15 °C and 101.325 kPa)", () => {
    const field = formatTableJson(table, OPTIONS);
    const metric = formatTableJson(table, { ...OPTIONS, units: "metric" });
    field.rows.forEach((row, i) => {
      const m = metric.rows[i]!;
      expect(m.pressure / (row.pressure / BAR)).toBeCloseTo(1, 6);
      // 1 scf/STB = 0.177765 sm³/sm³ with the change of reference conditions (domain brief §5)
      expect(m.solution_gor! / row.solution_gor!).toBeCloseTo(0.177765, 5);
      expect(m.oil_fvf).toBe(row.oil_fvf);
      expect(m.oil_viscosity).toBe(row.oil_viscosity);
    });
    expect(metric.units).toMatchObject({
      system: "metric",
      pressure: "bara",
      temperature: "deg C",
      solution_gor: "sm3/sm3",
      gas_fvf: "rm3/sm3",
    });
    expect(metric.temperature).toBe(100);
    expect(metric.standardConditions).toEqual({
      label: "15 deg C, 1.01325 bara",
      pressure: 1.01325,
      temperature: 15,
    });
  });
});

describe("text: our own plain layout", () => {
  const text = formatTableText(table, OPTIONS);
  const lines = text.trimEnd().split("\n");
  const comments = lines.filter((l) => l.startsWith("#"));
  const data = lines.filter((l) => !l.startsWith("#"));

  test("comment lines state sample, revision, temperature, bubble point, method, units, standard conditions, time and the caution", () => {
    expect(comments).toContain("# sample: Invented sample A (well 7)");
    expect(comments).toContain("# revision: 4");
    expect(comments).toContain("# temperature: 212 deg F");
    expect(comments).toContain(
      "# method: automatic: newton [3,3], pchip where newton overshoots",
    );
    expect(comments).toContain(
      "# units: pressure psia; Rs scf/STB; Bo rb/STB; oil_viscosity cP; Bg ft3/scf; gas_viscosity cP; z dimensionless",
    );
    expect(comments).toContain("# standard conditions: 60 deg F, 14.696 psia");
    expect(comments).toContain("# generated: 2024-05-06T07:08:09.000Z");
    expect(comments).toContain(`# caution: ${TABLE_CAUTION}`);
    expect(
      comments.some((l) =>
        /^# bubble point at this temperature: \d+\.\d+ psia; Rs there 600 scf\/STB$/.test(
          l,
        ),
      ),
    ).toBe(true);
    expect(
      comments.some((l) =>
        /^# rows 1-\d+ saturated \(at or below the bubble point; row \d+ is the bubble point\), rows \d+-24 undersaturated/.test(
          l,
        ),
      ),
    ).toBe(true);
  });

  test("every other line is whitespace-separated numbers in the stated units, equal to the JSON values", () => {
    const json = formatTableJson(table, OPTIONS);
    expect(data).toHaveLength(json.rows.length);
    const header = comments.at(-1)!.slice(1).trim().split(/\s+/);
    expect(header).toEqual([
      "pressure",
      "Rs",
      "Bo",
      "oil_viscosity",
      "Bg",
      "gas_viscosity",
      "z",
    ]);
    data.forEach((line, i) => {
      const fields = line.trim().split(/\s+/);
      expect(fields).toHaveLength(7);
      for (const f of fields) expect(f).toMatch(/^-?\d+(\.\d+)?$/);
      const row = json.rows[i]!;
      expect(Number(fields[0])).toBe(row.pressure);
      TABLE_COLUMNS.forEach((key, j) =>
        expect(Number(fields[j + 1])).toBe(row[key]),
      );
    });
  });

  test("columns line up (right-aligned, fixed decimals per column)", () => {
    const widths = data.map((l) => l.length);
    expect(new Set(widths).size).toBe(1);
    expect(comments.at(-1)!.length).toBe(widths[0]);
  });

  test("corrections are listed with their interpolated and corrected values", () => {
    expect(table.corrections.length).toBeGreaterThan(0);
    expect(comments).toContain(
      `# corrected to keep the order simulators need: ${table.corrections.length} value${table.corrections.length === 1 ? "" : "s"}`,
    );
    expect(
      comments.filter((l) =>
        /^# {3}row \d+, (Rs|Bo|Bg|oil_viscosity|gas_viscosity|z): [\d.]+ -> [\d.]+ \(/.test(
          l,
        ),
      ),
    ).toHaveLength(Math.min(50, table.corrections.length));
  });

  test("metric text states metric units", () => {
    const m = formatTableText(table, { ...OPTIONS, units: "metric" });
    expect(m).toContain(
      "# units: pressure bara; Rs sm3/sm3; Bo rm3/sm3; oil_viscosity mPa.s; Bg rm3/sm3; gas_viscosity mPa.s; z dimensionless\n",
    );
    expect(m).toContain("# temperature: 100 deg C\n");
    expect(m).toContain("# standard conditions: 15 deg C, 1.01325 bara\n");
  });

  test("a sample label with line breaks stays on its comment line", () => {
    const t = formatTableText(table, { ...OPTIONS, sampleLabel: "two\nlines" });
    expect(t).toContain("# sample: two lines\n");
  });
});

describe("JSON", () => {
  const json = formatTableJson(table, OPTIONS);
  test("names the sample, revision, method, units, standard conditions and time, with the caution", () => {
    expect(json).toMatchObject({
      kind: "black-oil-table",
      sample: "Invented sample A (well 7)",
      revision: 4,
      generatedAt: "2024-05-06T07:08:09.000Z",
      method: { name: "auto", degree: [3, 3] },
      units: {
        system: "field",
        pressure: "psia",
        temperature: "deg F",
        solution_gor: "scf/STB",
        oil_fvf: "rb/STB",
        oil_viscosity: "cP",
        gas_fvf: "ft3/scf",
        gas_viscosity: "cP",
        z_factor: "-",
      },
      standardConditions: {
        label: "60 deg F, 14.696 psia",
        pressure: 14.696,
        temperature: 60,
      },
      temperature: 212,
      solutionGorAtBubblePoint: 600,
      caution: TABLE_CAUTION,
    });
    expect(json.columns.map((c) => c.key)).toEqual([
      "pressure",
      ...TABLE_COLUMNS,
    ]);
    expect(json.bubblePointPressure).toBe(
      json.rows.find((r) => r.bubblePoint)!.pressure,
    );
  });

  test("corrections come in output units, with reasons naming the pressure in those units", () => {
    const metric = formatTableJson(table, { ...OPTIONS, units: "metric" });
    const c = metric.corrections[0]!;
    expect(c.reason).toMatch(
      new RegExp(`^(Rs|Bo|Bg) at ${metric.rows[c.row]!.pressure} bara: `),
    );
    expect(metric.rows[c.row]![c.column]).toBe(c.corrected);
    expect(metric.rows[c.row]!.corrected).toContain(c.column);
  });

  test("error estimates are given per value, in the value's unit (2 significant digits)", () => {
    const row = json.rows[5]!;
    for (const key of TABLE_COLUMNS)
      expect(row.errorEstimates[key]).toBeGreaterThanOrEqual(0);
    const cell = table.rows[5]!.cells.gas_fvf!;
    expect(row.errorEstimates.gas_fvf).toBe(
      Number((cell.errorEstimate * 5.614583333333333).toPrecision(2)),
    );
  });
});

describe("digits and bases", () => {
  test("pressures a hair apart stay apart: a column gets more digits when 7 would merge two rows", () => {
    const t = buildBlackOilTable({
      grids: sample.grids,
      temperature: 212,
      pressures: [1000, 1000.00001, 1000.00002],
      method: "linear",
    });
    // the bubble-point row comes after them (pb ≈ 2636 psia)
    const rows = formatTableJson(t, OPTIONS).rows.filter((r) => r.requested);
    expect(rows.map((r) => r.pressure)).toEqual([1000, 1000.00001, 1000.00002]);
    expect(new Set(rows.map((r) => r.oil_fvf)).size).toBe(3);
    const records: string[][] = parse(formatTableCsv(t, OPTIONS));
    expect(records.slice(1, 4).map((r) => r[0])).toEqual([
      "1000",
      "1000.00001",
      "1000.00002",
    ]);
  });

  test("another standard-conditions base re-expresses Rs and Bg on it (ideal gas, domain brief §5)", () => {
    const base = defineStandardConditions({
      id: "lab",
      label: "lab",
      pressure: { value: 14.65, unit: "psia" },
      temperature: { value: 60, unit: "degF" },
    });
    const lab = formatTableJson(table, {
      ...OPTIONS,
      standardConditions: base,
    });
    const field = formatTableJson(table, OPTIONS);
    lab.rows.forEach((row, i) => {
      expect(row.solution_gor! / field.rows[i]!.solution_gor!).toBeCloseTo(
        14.696 / 14.65,
        6,
      );
      expect(row.gas_fvf! / field.rows[i]!.gas_fvf!).toBeCloseTo(
        14.65 / 14.696,
        6,
      );
      expect(row.oil_fvf).toBe(field.rows[i]!.oil_fvf);
    });
    expect(lab.standardConditions.label).toBe("60 deg F, 14.65 psia");
  });
});

describe("bad options", () => {
  const failure = (options: Partial<TableFormatOptions>): string => {
    try {
      formatTableCsv(table, { ...OPTIONS, ...options } as TableFormatOptions);
    } catch (e) {
      if (e instanceof TableError) return `${e.code}: ${e.message}`;
      throw e;
    }
    return "no error";
  };
  test.each([
    [
      { units: "imperial" as never },
      /^INVALID_OPTIONS: units must be 'field' or 'metric'; got imperial\./,
    ],
    [
      { generatedAt: "yesterday" },
      /^INVALID_OPTIONS: generatedAt must be a date or an ISO 8601 time; got yesterday\./,
    ],
    [{ revision: Number.NaN }, /^INVALID_OPTIONS: revision must be a number/],
  ])("%#: %s", (options, message) => {
    expect(failure(options)).toMatch(message);
  });
});
