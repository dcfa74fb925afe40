import { expect, test } from "vitest";
import cceCsv from "../../../reference-data/properties/dake-cce-200f.csv?raw";
import { PropertyInputError } from "./errors";
import { fitYFunction, smoothedRelativeVolume, yFunction } from "./y-function";

// Dake, Fundamentals of Reservoir Engineering, Table 2.1: CCE at 200 °F, pb = 3330 psia [S];
// reference-data/properties/dake-cce-200f.csv. Y values and the line are ours [C] (the book gives the data).
const points = cceCsv
  .trim()
  .split("\n")
  .slice(1)
  .map((line) => {
    const [p, v] = line.split(",").map(Number);
    return { pressure: p ?? Number.NaN, relativeVolume: v ?? Number.NaN };
  });
const PSAT = 3330;

test("C21 Y(3000) = 4.074 and Y(2100) = 3.486 ±0.001 (Dake Table 2.1 data [S]; Y computed [C])", () => {
  expect(
    Math.abs(
      yFunction({
        saturationPressure: PSAT,
        pressure: 3000,
        relativeVolume: 1.027,
      }) - 4.074,
    ),
  ).toBeLessThanOrEqual(0.001);
  expect(
    Math.abs(
      yFunction({
        saturationPressure: PSAT,
        pressure: 2100,
        relativeVolume: 1.168,
      }) - 3.486,
    ),
  ).toBeLessThanOrEqual(0.001);
});

test("C21 line fit Y = 2.0910 + 6.590e-4 p with the 3290-psia point +0.60 off the line and flagged (domain §4 [C]; ±0.0005 / ±0.005e-4 / ±0.01)", () => {
  const fit = fitYFunction({ saturationPressure: PSAT, points });
  expect(Math.abs(fit.intercept - 2.091)).toBeLessThanOrEqual(0.0005);
  expect(Math.abs(fit.slope - 6.59e-4)).toBeLessThanOrEqual(0.005e-4);
  const flagged = fit.points.filter((p) => p.offLine);
  expect(flagged.map((p) => p.pressure)).toEqual([3290]);
  expect(Math.abs((flagged[0]?.residual ?? 0) - 0.6)).toBeLessThanOrEqual(0.01);
  expect(
    fit.warnings.some(
      (w) => w.value === 3290 && /close to psat/.test(w.message),
    ),
  ).toBe(true);
  // smoothed relative volumes stay within 0.1 % of the four retained readings
  for (const p of fit.points.filter((q) => q.usedInFit)) {
    expect(
      Math.abs(p.smoothedRelativeVolume / p.relativeVolume - 1),
    ).toBeLessThan(1e-3);
    expect(smoothedRelativeVolume(fit, p.pressure)).toBeCloseTo(
      p.smoothedRelativeVolume,
      12,
    );
  }
});

test("without automatic exclusion all five points are fitted and the 3290 point still shows as off the line", () => {
  const fit = fitYFunction({
    saturationPressure: PSAT,
    points,
    autoExclude: false,
  });
  expect(fit.points.every((p) => p.usedInFit)).toBe(true);
  expect(fit.slope).toBeGreaterThan(1e-3); // the hooked point pulls the line
  expect(fit.points.find((p) => p.pressure === 3290)?.offLine).toBe(true);
});

test("points at or above psat are returned untouched; V ≤ 1 below psat is flagged; too few points is an error", () => {
  const fit = fitYFunction({
    saturationPressure: PSAT,
    points: [
      ...points,
      { pressure: 3500, relativeVolume: 0.99 },
      { pressure: 1800, relativeVolume: 0.999 },
    ],
    exclude: [3290],
  });
  expect(fit.ignored).toEqual([{ pressure: 3500, relativeVolume: 0.99 }]);
  expect(fit.points.find((p) => p.pressure === 1800)?.y).toBeNull();
  expect(fit.warnings.some((w) => w.value === 1800)).toBe(true);
  expect(() =>
    fitYFunction({
      saturationPressure: PSAT,
      points: [{ pressure: 3000, relativeVolume: 1.027 }],
    }),
  ).toThrow(PropertyInputError);
  expect(() =>
    yFunction({
      saturationPressure: PSAT,
      pressure: 3400,
      relativeVolume: 1.01,
    }),
  ).toThrow(/below psat/);
});
