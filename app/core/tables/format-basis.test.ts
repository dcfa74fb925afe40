// The bases of a table's numbers: Rs and Bg rebased from the report's standard conditions to the output's,
// gauge pressures (psig, barg), and the lines that name both. The sample is invented (generated from
// published correlations). Expected numbers are hand calculations: ideal gas at standard conditions,
// V₂ = V₁·(p₁/p₂)·(T₂/T₁) in absolute units; NIST SP 811: 1 atm = 101.325 kPa, 1 psi = 6.894757293168 kPa.
import { describe, expect, test } from "vitest";
import { generateSample } from "../properties";
import {
  buildBlackOilTable,
  formatTableJson,
  formatTableText,
  parsePressureSpec,
  tableBasisLines,
  type TableFormatOptions,
} from "./index";

const sample = generateSample({
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  pressures: Array.from({ length: 23 }, (_, i) => 500 + 250 * i),
  temperatures: [120, 150, 180, 210, 240],
});
const table = buildBlackOilTable({
  grids: sample.grids,
  temperature: 212,
  pressures: parsePressureSpec("1000:5000:500").pressures,
  method: "linear",
});
const OPTIONS: TableFormatOptions = {
  units: "field",
  sampleLabel: "Invented sample",
  revision: 1,
  generatedAt: "2024-05-06T07:08:09Z",
};
const US_GAS = { pressurePsia: 14.65, temperatureF: 60 };

describe("standard conditions", () => {
  test("a 14.65 psia report: Rs × 14.65/14.696 and Bg × 14.696/14.65 on the field base, named in JSON and text", () => {
    const plain = formatTableJson(table, OPTIONS);
    const rebased = formatTableJson(table, {
      ...OPTIONS,
      reportStandardConditions: US_GAS,
    });
    plain.rows.forEach((row, i) => {
      const r = rebased.rows[i]!;
      expect(r.solution_gor! / row.solution_gor!).toBeCloseTo(
        14.65 / 14.696,
        6,
      );
      expect(r.gas_fvf! / row.gas_fvf!).toBeCloseTo(14.696 / 14.65, 6);
      expect(r.oil_fvf).toBe(row.oil_fvf);
    });
    expect(rebased.standardConditions.label).toBe("60 deg F, 14.696 psia");
    expect(rebased.reportStandardConditions).toBe("60 °F, 14.65 psia");
    const text = formatTableText(table, {
      ...OPTIONS,
      reportStandardConditions: US_GAS,
    });
    expect(text).toMatch(/^# standard conditions: 60 deg F, 14.696 psia$/m);
    expect(text).toMatch(
      /^# Rs and Bg rebased from the report's standard conditions \(60 deg F, 14.65 psia\) as an ideal gas$/m,
    );
    // the field base itself is not "rebased"
    expect(tableBasisLines(OPTIONS)).toEqual([
      "standard conditions: 60 deg F, 14.696 psia",
    ]);
  });

  test("a metric report in metric units is not rebased: Rs is the stored scf/STB ÷ 5.614583", () => {
    const metricReport = {
      pressurePsia: 101.325 / 6.894757293168,
      temperatureF: 59,
    };
    const out = formatTableJson(table, {
      ...OPTIONS,
      units: "metric",
      reportStandardConditions: metricReport,
    });
    const row = out.rows.findIndex((r) => !r.bubblePoint);
    const stored = table.rows[row]!.cells.solution_gor!.value;
    expect(out.rows[row]!.solution_gor).toBeCloseTo(
      stored / ((42 * 231) / 1728),
      4,
    );
    expect(
      tableBasisLines({
        ...OPTIONS,
        units: "metric",
        reportStandardConditions: metricReport,
      }),
    ).toEqual(["standard conditions: 15 deg C, 1.01325 bara"]);
  });
});

test("gauge pressures: the pressure column in psig (absolute − 14.7 here), named in the basis lines", () => {
  const gauge = formatTableJson(table, {
    ...OPTIONS,
    pressureBasis: "gauge",
    barometricPressurePsia: 14.7,
  });
  const absolute = formatTableJson(table, OPTIONS);
  expect(gauge.units.pressure).toBe("psig");
  expect(gauge.pressureBasis).toBe("gauge");
  gauge.rows.forEach((r, i) =>
    expect(r.pressure).toBeCloseTo(absolute.rows[i]!.pressure - 14.7, 6),
  );
  expect(gauge.bubblePointPressure!).toBeCloseTo(
    absolute.bubblePointPressure! - 14.7,
    5,
  );
  // the standard conditions stay absolute
  expect(gauge.standardConditions.label).toBe("60 deg F, 14.696 psia");
  expect(
    tableBasisLines({ ...OPTIONS, units: "metric", pressureBasis: "gauge" }).at(
      -1,
    ),
  ).toBe(
    "pressures: gauge (barg); absolute = gauge + 14.696 psia (the sample's barometric pressure)",
  );
});

test("a refused row names its pressure on the caller's basis (psig with messageBasis gauge)", () => {
  expect(() =>
    buildBlackOilTable({
      grids: sample.grids,
      temperature: 212,
      pressures: [1000, 7014.696],
      method: "linear",
      messageBasis: { pressureBasis: "gauge", barometricPressurePsia: 14.696 },
    }),
  ).toThrow(/pressure 7000 psig lies outside/);
});
