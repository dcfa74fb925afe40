// The interpolation engine (app/core/interpolation) on grids from the synthetic sample generator, with the
// generator's own noise-free model as ground truth: interpolated values at off-grid points are compared with
// the correlations' values at the same points. The fluid is invented (35 °API, γg 0.75, Rsb 600 scf/STB).
import { describe, expect, test } from "vitest";
import { interpolateGrid, type Grid, type Method } from "../interpolation";
import { PROPERTY_KEYS, type PropertyKey } from "../units";
import { createSampleModel, generateSample } from "./generate-sample";

const PRESSURES = Array.from({ length: 23 }, (_, i) => 500 + 250 * i); // 500 … 6000 psia
const TEMPERATURES = [120, 150, 180, 210, 240];
const DESCRIPTION = {
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  pressures: PRESSURES,
  temperatures: TEMPERATURES,
};
const sample = generateSample(DESCRIPTION);
const model = createSampleModel(DESCRIPTION);
const NEWTON = {
  method: "newton" as Method,
  degree: [3, 3] as [number, number],
};
const LINEAR = { method: "linear" as Method };

const grid = (key: PropertyKey): Grid => sample.grids[key];
const relativeError = (value: number, truth: number): number =>
  Math.abs(value / truth - 1);

describe("smooth stretches: newton [3,3] is closer to the correlation than linear", () => {
  // Cell midpoints on rows that lie on one branch at every temperature: more than 500 psi (two grid steps)
  // below the lowest bubble point or above the highest one.
  const pbLow = Math.min(...sample.bubblePoints);
  const pbHigh = Math.max(...sample.bubblePoints);
  const points: Array<{ pressure: number; temperature: number }> = [];
  for (let i = 0; i + 1 < PRESSURES.length; i++) {
    for (let j = 0; j + 1 < TEMPERATURES.length; j++) {
      const pressure = PRESSURES[i]! + 125;
      const temperature = TEMPERATURES[j]! + 15;
      if (pressure < pbLow - 500 || pressure > pbHigh + 500)
        points.push({ pressure, temperature });
    }
  }

  test("the smooth stretches hold enough off-grid points on both branches", () => {
    expect(
      points.filter((p) => p.pressure < pbLow).length,
    ).toBeGreaterThanOrEqual(16);
    expect(
      points.filter((p) => p.pressure > pbHigh).length,
    ).toBeGreaterThanOrEqual(40);
  });

  test.each(PROPERTY_KEYS)(
    "%s: newton no worse than linear at ≥ 90 percent of points, RMS error ≥ 4× smaller, max error smaller",
    (key) => {
      let atLeastAsClose = 0;
      let sumNewton = 0;
      let sumLinear = 0;
      let maxNewton = 0;
      let maxLinear = 0;
      for (const point of points) {
        const truth = model.evaluate(point.pressure, point.temperature)[key];
        const newton = relativeError(
          interpolateGrid(grid(key), point, NEWTON).value,
          truth,
        );
        const linear = relativeError(
          interpolateGrid(grid(key), point, LINEAR).value,
          truth,
        );
        if (newton <= linear + 1e-12) atLeastAsClose++;
        sumNewton += newton * newton;
        sumLinear += linear * linear;
        maxNewton = Math.max(maxNewton, newton);
        maxLinear = Math.max(maxLinear, linear);
      }
      expect(atLeastAsClose / points.length).toBeGreaterThanOrEqual(0.9);
      expect(Math.sqrt(sumNewton)).toBeLessThan(Math.sqrt(sumLinear) / 4);
      expect(maxNewton).toBeLessThan(maxLinear);
    },
  );
});

describe("the bubble point is never crossed", () => {
  const OIL_KEYS = [
    "oil_fvf",
    "solution_gor",
    "oil_viscosity",
    "oil_density",
  ] as const;
  // A dense sweep across the bubble point: 500 psi either side of pb(T), at on-grid and off-grid temperatures.
  const sweep: Array<{ pressure: number; temperature: number; pb: number }> =
    [];
  for (let b = 0; b <= 12; b++) {
    const temperature = 120 + 10 * b;
    const pb = model.bubblePoint(temperature);
    for (let a = 0; a <= 100; a++)
      sweep.push({ pressure: pb - 500 + 10 * a + 3, temperature, pb });
  }

  test("every point is put on the branch the correlation puts it on; the engine's pb(T) matches the correlation within 1 psi", () => {
    for (const { pressure, temperature, pb } of sweep) {
      const r = interpolateGrid(
        grid("oil_fvf"),
        { pressure, temperature },
        NEWTON,
      );
      expect(Math.abs((r.bubblePointPressure ?? Number.NaN) - pb)).toBeLessThan(
        1,
      );
      if (Math.abs(pressure - pb) > 1) {
        expect(r.branch).toBe(model.evaluate(pressure, temperature).branch);
      }
    }
  });

  // Above pb, Rs is the constant Rsb. The engine builds each column's bubble-point node (pb lies between grid
  // rows) from both branches' extrapolations, which puts that node within ~0.06 scf/STB of Rsb here; so the
  // check allows 0.1 scf/STB (1.7e-4 relative). Reading the same table blind to the bubble point bends Rs
  // above pb by more than 5 scf/STB — the check has teeth.
  test.each(["newton", "linear"] as const)(
    "%s: Rs above pb stays at Rsb (±0.1 scf/STB) and below pb never exceeds it",
    (method) => {
      const options = method === "newton" ? NEWTON : LINEAR;
      const blind: Grid = { ...grid("solution_gor"), bubblePoints: undefined };
      let worstAbove = 0;
      let worstBlindAbove = 0;
      for (const { pressure, temperature, pb } of sweep) {
        const rs = interpolateGrid(
          grid("solution_gor"),
          { pressure, temperature },
          options,
        ).value;
        if (pressure > pb + 1) {
          worstAbove = Math.max(worstAbove, Math.abs(rs - 600));
          const blindRs = interpolateGrid(
            blind,
            { pressure, temperature },
            options,
          ).value;
          worstBlindAbove = Math.max(worstBlindAbove, Math.abs(blindRs - 600));
        }
        if (pressure < pb - 1) expect(rs).toBeLessThanOrEqual(600 + 1e-9);
      }
      expect(worstAbove).toBeLessThanOrEqual(0.1);
      expect(worstBlindAbove).toBeGreaterThan(5);
    },
  );

  test("newton: Bo never exceeds its bubble-point value (the maximum of the Bo curve) at any temperature", () => {
    for (const { pressure, temperature, pb } of sweep) {
      const bo = interpolateGrid(
        grid("oil_fvf"),
        { pressure, temperature },
        NEWTON,
      ).value;
      expect(bo).toBeLessThanOrEqual(
        model.evaluate(pb, temperature).oil_fvf + 1e-5,
      );
    }
  });

  test.each(OIL_KEYS)(
    "%s near pb: newton on the branches is ≥ 3× closer to the correlation than the same table read without bubble points",
    (key) => {
      const blind: Grid = { ...grid(key), bubblePoints: undefined };
      let worstAware = 0;
      let worstBlind = 0;
      let blindRsAboveRsb = 0;
      for (const point of sweep) {
        const truth = model.evaluate(point.pressure, point.temperature)[key];
        worstAware = Math.max(
          worstAware,
          relativeError(interpolateGrid(grid(key), point, NEWTON).value, truth),
        );
        const blindValue = interpolateGrid(blind, point, NEWTON).value;
        worstBlind = Math.max(worstBlind, relativeError(blindValue, truth));
        if (
          key === "solution_gor" &&
          point.pressure > point.pb + 1 &&
          Math.abs(blindValue - 600) > 1e-6
        )
          blindRsAboveRsb++;
      }
      expect(worstAware).toBeLessThan(worstBlind / 3);
      expect(worstAware).toBeLessThan(0.01);
      // crossing the kink is what the blind read does: it bends Rs above pb away from Rsb
      if (key === "solution_gor") expect(blindRsAboveRsb).toBeGreaterThan(0);
    },
  );
});
