// Cells that were not measured (null): the zone moves or shrinks around them with a warning, or the
// engine refuses with a typed error; never NaN, never a silent wrong number.
import { describe, expect, test } from "vitest";
import {
  interpolateGrid,
  interpolateGridMany,
  InterpolationError,
} from "./index";
import type { Grid } from "./index";
import { gridFrom } from "./grids.test-helpers";

// invented smooth surface
const f = (p: number, t: number): number =>
  1.1 + 0.2 * Math.log(p / 500) * (1 + 0.003 * (t - 100)) + 1e-5 * t * t;
const P = [500, 900, 1300, 1800, 2400, 3000, 3700, 4500];
const T = [100, 130, 160, 200, 240, 280];
const complete = gridFrom(P, T, f);
const withHoles = (cells: [number, number][]): Grid => ({
  ...complete,
  values: complete.values.map((row, i) =>
    row.map((v, j) => (cells.some(([a, b]) => a === i && b === j) ? null : v)),
  ),
});

describe("missing cells (reference: issue 3 — shift or shrink with a warning, else a typed error)", () => {
  test("a hole inside the zone moves the zone, warns, and stays accurate", () => {
    const point = { pressure: 2100, temperature: 175 };
    const full = interpolateGrid(complete, point, { method: "newton" });
    expect(full.stencil.pressure).toContain(3);
    const r = interpolateGrid(withHoles([[3, 2]]), point, { method: "newton" });
    expect(r.warnings).toContain("missing-data");
    // reference: the invented function itself. The moved zone is less accurate than the full one, and
    // the error estimate says so honestly (same order as the true error)
    const truth = f(point.pressure, point.temperature);
    expect(Math.abs(r.value - truth)).toBeLessThan(2e-3);
    expect(Math.abs(r.value - truth)).toBeLessThan(3 * r.errorEstimate);
    expect(r.errorEstimate).toBeGreaterThan(full.errorEstimate);
    expect(Math.abs(full.value - truth)).toBeLessThan(3 * full.errorEstimate);
    expect(r.value).not.toBe(full.value);
  });

  test("a hole far from the point changes nothing and raises no warning", () => {
    const point = { pressure: 2100, temperature: 175 };
    const full = interpolateGrid(complete, point, { method: "newton" });
    const r = interpolateGrid(withHoles([[7, 5]]), point, { method: "newton" });
    expect(r.warnings).toEqual([]);
    expect(Math.abs(r.value - full.value)).toBeLessThan(1e-14);
    expect(r.stencil).toEqual(full.stencil);
  });

  test("pchip and linear also avoid holes", () => {
    for (const method of ["pchip", "linear"] as const) {
      const point = { pressure: 2100, temperature: 175 };
      const r = interpolateGrid(withHoles([[3, 2]]), point, { method });
      expect(r.warnings).toContain("missing-data");
      const err = Math.abs(r.value - f(point.pressure, point.temperature));
      expect(err).toBeLessThan(5e-3);
      expect(err).toBeLessThan(3 * r.errorEstimate);
    }
  });

  test("an unmeasured corner: the temperature zone shifts to columns that reach the pressure", () => {
    // the two hottest columns were not measured below 1800
    const g = withHoles([
      [0, 4],
      [1, 4],
      [2, 4],
      [0, 5],
      [1, 5],
      [2, 5],
    ]);
    // at 190 the cubic zone would be 130–240; 240 has no value at 1000, so the zone shifts to 100–200
    const r = interpolateGrid(
      g,
      { pressure: 1000, temperature: 190 },
      { method: "newton" },
    );
    expect(r.warnings).toContain("missing-data");
    expect(r.stencil.temperature).toEqual([0, 1, 2, 3]);
    expect(Math.abs(r.value - f(1000, 190))).toBeLessThan(3 * r.errorEstimate);
    // beyond 200 at this pressure there is nothing to interpolate from: only extrapolation could answer
    for (const temperature of [230, 270]) {
      let caught: unknown = null;
      try {
        interpolateGrid(
          g,
          { pressure: 1000, temperature },
          { method: "newton" },
        );
      } catch (err) {
        caught = err;
      }
      expect(caught).toBeInstanceOf(InterpolationError);
      expect((caught as InterpolationError).code).toBe("no-valid-zone");
      expect((caught as InterpolationError).message).toMatch(
        /at 240: 1800 to 4500; at 280: 1800 to 4500/,
      );
    }
    const x = interpolateGrid(
      g,
      { pressure: 1000, temperature: 270 },
      { method: "newton", extrapolate: true },
    );
    expect(x.warnings).toContain("extrapolated");
    expect(Number.isFinite(x.value)).toBe(true);
  });

  test("too few measured cells shrink the degree with a warning", () => {
    // column 2 keeps only three measured pressures: a cubic along pressure is impossible there
    const holes: [number, number][] = [0, 1, 2, 3, 4].map((i) => [i, 2]);
    const g = withHoles(holes);
    const r = interpolateGrid(
      g,
      { pressure: 3300, temperature: 160 },
      { method: "newton" },
    );
    expect(r.warnings).toContain("degree-reduced");
    expect(Number.isFinite(r.value)).toBe(true);
  });

  test("nothing measured at all is an error", () => {
    const g: Grid = {
      ...complete,
      values: complete.values.map((row) => row.map(() => null)),
    };
    expect(() =>
      interpolateGrid(
        g,
        { pressure: 1000, temperature: 150 },
        { method: "pchip" },
      ),
    ).toThrow(InterpolationError);
  });

  test("the typed batch on a grid with holes matches single points and flags the same warnings", () => {
    const g = withHoles([
      [3, 2],
      [4, 3],
    ]);
    const pts = [
      { pressure: 2100, temperature: 175 },
      { pressure: 600, temperature: 110 },
      { pressure: 2600, temperature: 210 },
    ];
    const b = interpolateGridMany(
      g,
      {
        pressures: Float64Array.from(pts.map((p) => p.pressure)),
        temperatures: Float64Array.from(pts.map((p) => p.temperature)),
      },
      { method: "newton" },
    );
    pts.forEach((pt, k) => {
      const r = interpolateGrid(g, pt, { method: "newton" });
      expect(b.values[k]).toBe(r.value);
      expect(b.warnings[k]! & 4).toBe(
        r.warnings.includes("missing-data") ? 4 : 0,
      );
      expect(b.pressureStart[k]).toBe(r.stencil.pressure[0]);
    });
  });
});
