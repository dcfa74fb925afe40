// The typed-array batch form (reference: the library's own contract in README "Many points"; single-point
// results are the reference for every entry).
import { describe, expect, test } from "vitest";
import {
  interpolateGrid,
  interpolateGridMany,
  InterpolationError,
  WARNING_FLAGS,
  warningsFromFlags,
} from "./index";
import type { Grid } from "./index";
import { gridFrom } from "./grids.test-helpers";

const f = (p: number, t: number): number =>
  1.1 + 2e-4 * p - 3e-8 * p * p + 1e-3 * t; // invented
const grid = gridFrom(
  [1000, 1400, 1800, 2300, 2900, 3500, 4200],
  [100, 140, 180, 220, 260],
  f,
);
const columns = (
  pts: { pressure: number; temperature: number }[],
): { pressures: Float64Array; temperatures: Float64Array } => ({
  pressures: Float64Array.from(pts.map((p) => p.pressure)),
  temperatures: Float64Array.from(pts.map((p) => p.temperature)),
});
const pts = [
  { pressure: 1000, temperature: 100 },
  { pressure: 1234, temperature: 155 },
  { pressure: 3999, temperature: 259 },
  { pressure: 4200, temperature: 260 },
  { pressure: 2600, temperature: 200 },
];

describe("BatchResult", () => {
  test.each(["linear", "newton", "pchip"] as const)(
    "%s: every entry matches interpolateGrid, stencil spans included",
    (method) => {
      const b = interpolateGridMany(grid, columns(pts), { method });
      expect(b.count).toBe(pts.length);
      expect(b.branches).toBeNull();
      expect(b.alternatives).toBeNull();
      pts.forEach((pt, k) => {
        const r = interpolateGrid(grid, pt, { method });
        expect(b.values[k]).toBe(r.value);
        expect(b.errorEstimates[k]).toBe(r.errorEstimate);
        expect(warningsFromFlags(b.warnings[k]!)).toEqual(r.warnings);
        expect(b.pressureStart[k]).toBe(r.stencil.pressure[0]);
        expect(b.pressureCount[k]).toBe(r.stencil.pressure.length);
        expect(b.temperatureStart[k]).toBe(r.stencil.temperature[0]);
        expect(b.temperatureCount[k]).toBe(r.stencil.temperature.length);
      });
    },
  );

  test("extrapolated points carry the bit; reuse overwrites the same arrays", () => {
    const out = interpolateGridMany(
      grid,
      columns([
        { pressure: 900, temperature: 120 },
        { pressure: 2000, temperature: 120 },
      ]),
      {
        method: "newton",
        extrapolate: true,
      },
    );
    expect(out.warnings[0]! & WARNING_FLAGS.extrapolated).toBe(
      WARNING_FLAGS.extrapolated,
    );
    expect(out.warnings[1]).toBe(0);
    const values = out.values;
    const again = interpolateGridMany(
      grid,
      columns([
        { pressure: 1500, temperature: 150 },
        { pressure: 2500, temperature: 250 },
      ]),
      { method: "newton" },
      out,
    );
    expect(again).toBe(out);
    expect(again.values).toBe(values);
    expect(again.values[0]).toBe(
      interpolateGrid(
        grid,
        { pressure: 1500, temperature: 150 },
        { method: "newton" },
      ).value,
    );
    expect(again.warnings[0]).toBe(0);
    expect(() =>
      interpolateGridMany(grid, columns(pts), { method: "newton" }, out),
    ).toThrow(InterpolationError);
  });

  test("with bubble points the branch of each point is given", () => {
    const g: Grid = { ...grid, bubblePoints: [2000, 2200, 2400, 2600, 2800] };
    const b = interpolateGridMany(g, columns(pts), { method: "newton" });
    expect(b.branches).not.toBeNull();
    pts.forEach((pt, k) => {
      const r = interpolateGrid(g, pt, { method: "newton" });
      expect(b.branches![k]).toBe(r.branch === "saturated" ? 1 : 2);
      expect(b.values[k]).toBe(r.value);
    });
  });

  test("an empty batch is fine", () => {
    const b = interpolateGridMany(
      grid,
      { pressures: new Float64Array(0), temperatures: new Float64Array(0) },
      { method: "pchip" },
    );
    expect(b.count).toBe(0);
  });
});
