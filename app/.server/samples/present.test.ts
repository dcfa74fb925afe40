import { expect, test } from "vitest";
import {
  gridInOutputUnits,
  reportBaseOf,
  OUTPUT_SIGNIFICANT_DIGITS,
  outputNumber,
  presentSample,
} from "./present";

const SAMPLE = {
  samplingDepthFt: 9120,
  reservoirPressurePsia: 4650,
  reservoirTemperatureF: 204,
  standardPressurePsia: 14.696,
  standardTemperatureF: 60,
};
const BUBBLE_POINTS = [
  { temperatureF: 160, bubblePointPsia: 2100.5 },
  { temperatureF: 200, bubblePointPsia: 2480.25 },
  { temperatureF: 250, bubblePointPsia: 2900 },
];

test("field units are the canonical ones: the numbers pass through unchanged", () => {
  const shown = presentSample(SAMPLE, "field", BUBBLE_POINTS);
  expect(shown.units).toEqual({
    pressure: "psia",
    temperature: "°F",
    depth: "ft",
  });
  expect(shown.reservoirPressure).toBe(4650);
  expect(shown.reservoirTemperature).toBe(204);
  expect(shown.samplingDepth).toBe(9120);
  expect(shown.bubblePoints).toEqual([
    { temperature: 160, pressure: 2100.5 },
    { temperature: 200, pressure: 2480.25 },
    { temperature: 250, pressure: 2900 },
  ]);
  // 200 °F is the measured temperature nearest to the reservoir's 204 °F
  expect(shown.bubblePoint).toBe(2480.25);
});

test("metric: converted, then rounded to the one number of significant digits", () => {
  expect(OUTPUT_SIGNIFICANT_DIGITS).toBe(10);
  const shown = presentSample(SAMPLE, "metric", BUBBLE_POINTS);
  expect(shown.units).toEqual({
    pressure: "bara",
    temperature: "°C",
    depth: "m",
  });
  // 4650 psia = 320.60621413232… bara; 204 °F = 95.5555… °C; 9120 ft = 2779.776 m
  expect(shown.reservoirPressure).toBe(320.6062141);
  expect(shown.reservoirTemperature).toBe(95.55555556);
  expect(shown.samplingDepth).toBe(2779.776);
  expect(shown.bubblePoints[0]).toEqual({
    temperature: 71.11111111,
    pressure: outputNumber(2100.5 * 0.0689475729316836),
  });
  expect(shown.bubblePoint).toBe(shown.bubblePoints[1]!.pressure);
  for (const v of [
    shown.reservoirPressure!,
    ...shown.bubblePoints.flatMap((b) => [b.temperature, b.pressure]),
  ])
    expect(v).toBe(Number(v.toPrecision(10)));
});

test("standard conditions keep their canonical values and are named by their preset", () => {
  const shown = presentSample(SAMPLE, "metric");
  expect(shown.standardConditions?.pressurePsia).toBe(14.696);
  expect(shown.standardConditions?.temperatureF).toBe(60);
  expect(shown.standardConditions?.label).toMatch(/60 °F/);
  const odd = presentSample(
    {
      ...SAMPLE,
      standardPressurePsia: 14.5,
      standardTemperatureF: 59.123456789,
    },
    "field",
  );
  expect(odd.standardConditions?.label).toBe("59.1235 °F, 14.5 psia");
});

test("missing values stay missing; without a reservoir temperature the last bubble point is the one", () => {
  const shown = presentSample(
    {
      reservoirPressurePsia: null,
      reservoirTemperatureF: null,
    },
    "metric",
    BUBBLE_POINTS,
  );
  expect(shown.reservoirPressure).toBeNull();
  expect(shown.reservoirTemperature).toBeNull();
  expect(shown.samplingDepth).toBeNull();
  expect(shown.standardConditions).toBeNull();
  expect(shown.bubblePoint).toBe(shown.bubblePoints[2]!.pressure);
  expect(presentSample(SAMPLE, "field").bubblePoint).toBeNull();
});

test("a grid in output units follows the same rule", () => {
  const grid = gridInOutputUnits(
    {
      property: "oil_fvf",
      pressures: [4650],
      temperatures: [204],
      values: [[1.2345678901234], [null]],
    },
    "metric",
  );
  expect(grid.pressures).toEqual([320.6062141]);
  expect(grid.temperatures).toEqual([95.55555556]);
  expect(grid.values).toEqual([[1.23456789], [null]]);
});

test("a grid's Rs comes out on the output's base, rebased from the report's (hand calculation, ideal gas)", () => {
  // A metric report (15 °C, 101.325 kPa) with Rs 100 sm³/sm³ is stored as 100 × 5.614583 scf/STB (unit
  // factor only, 1 bbl = 5.614583 ft³): in metric units it is 100 again. A 14.65 psia report's 768 scf/STB
  // is 768 × 14.65/14.696 = 765.5960806 scf/STB on the field base (60 °F, 14.696 psia).
  const metricReport = reportBaseOf({
    standardPressurePsia: 101.325 / 6.894757293168,
    standardTemperatureF: 59,
  });
  const rs = (v: number) => ({
    property: "solution_gor" as const,
    pressures: [3000],
    temperatures: [200],
    values: [[v]],
  });
  expect(
    gridInOutputUnits(rs(100 * 5.614583333333333), "metric", metricReport)
      .values,
  ).toEqual([[100]]);
  expect(
    gridInOutputUnits(rs(768), "field", {
      pressurePsia: 14.65,
      temperatureF: 60,
    }).values,
  ).toEqual([[765.5960806]]);
});
