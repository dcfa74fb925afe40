// The calibrated error estimate (README "Error estimate"). Reference: tables generated from published
// correlations (Standing 1947; Vasquez & Beggs 1980; Beggs & Robinson 1975; Sutton 1985 with Dranchuk &
// Abou-Kassem 1975; Lee, Gonzalez & Eakin 1966 — see calibration.test-helpers.ts), rounded as laboratories
// print them, for invented fluids; the truth is the unrounded correlation at each point.
import { afterEach, describe, expect, test } from "vitest";
import {
  CALIBRATION_METHODS,
  measureCoverage,
  referenceTables,
} from "./calibration.test-helpers";
import { ESTIMATE_CALIBRATION, valueResolution } from "./estimate";
import { interpolateGrid, interpolateGridMany } from "./index";
import type { Grid, Method } from "./types";

const TABLES = referenceTables(20261204, 60, { fluids: 2 });
const SMOOTH = TABLES.filter((t) => t.kind !== "kink");
const KINK = TABLES.filter((t) => t.kind === "kink");

describe("calibration on reference tables (fixed seed)", () => {
  test.each(CALIBRATION_METHODS.map((m) => [m.name, m] as const))(
    "%s: within the estimate at ≥ 90 % of off-node points, within 3× at ≥ 99 %, median estimate ≤ 10× the median error",
    (_name, method) => {
      const r = measureCoverage(SMOOTH, method);
      expect(r.points).toBeGreaterThan(10_000);
      expect(r.flagged).toBe(0); // smooth tables raise no kink flag
      expect(r.within1).toBeGreaterThanOrEqual(0.9);
      expect(r.within3).toBeGreaterThanOrEqual(0.99);
      expect(r.sharpness).toBeLessThanOrEqual(10);
      expect(r.sharpness).toBeGreaterThanOrEqual(1);
    },
  );

  const saved = { ...ESTIMATE_CALIBRATION };
  afterEach(() => Object.assign(ESTIMATE_CALIBRATION, saved));

  test.each(["linear", "newton", "pchip"] as const)(
    "%s: without the safety factor and the rounding floor the coverage falls short (the calibration is what makes it hold)",
    (method) => {
      const cal = ESTIMATE_CALIBRATION as Record<string, number>;
      cal[method] = 1;
      cal.newtonEven = 1;
      cal.floor = 0;
      const m = CALIBRATION_METHODS.find((x) => x.options.method === method)!;
      expect(measureCoverage(SMOOTH, m).within1).toBeLessThan(0.9);
    },
  );

  test("oil tables across pb with no bubble points given: the kink is found and flagged estimate-unreliable", () => {
    for (const m of CALIBRATION_METHODS) {
      const all = measureCoverage(KINK, m, true);
      const clean = measureCoverage(KINK, m, false);
      expect(clean.flagged / all.points).toBeGreaterThan(0.3);
    }
  });
});

describe("value resolution (the floor): the last digit the laboratory printed", () => {
  test("fixed decimals, fixed significant digits, and values that are not printed numbers", () => {
    const r = (xs: number[]) =>
      Array.from(valueResolution(Float64Array.from(xs)));
    for (const [got, want] of [
      [r([1.2345, 1.2, 1.3001]), [1e-4, 1e-4, 1e-4]], // Bo to 4 decimals (1.2 lost its zeros)
      [r([57, 523, 1200, 0]), [1, 1, 1, 1]], // Rs in whole scf/STB
      [r([0.312, 1.45, 2.07, 12.3]), [0.001, 0.01, 0.01, 0.1]], // µo to 3 significant digits
      [r([1.2345, 1.0 / 3]), [0, 0]], // a computed value: nothing inferred
    ] as const)
      got.forEach((g, i) => expect(g).toBeCloseTo(want[i]!, 15));
  });
});

// A small invented table (made up for these tests) of a smooth function of p and T.
const f = (p: number, t: number): number =>
  1.1 + 0.00012 * p - 1.1e-8 * p * p + 0.0009 * (t - 150);
const P = [1000, 1500, 2000, 2500, 3000, 3500];
const T = [150, 200, 250];
const table = (ts: number[]): Grid => ({
  pressures: P,
  temperatures: ts,
  values: P.map((p) => ts.map((t) => Number(f(p, t).toFixed(4)))),
});
const METHODS: Method[] = ["linear", "newton", "pchip"];

describe("outside the table the estimate grows with the distance and is flagged", () => {
  test.each(METHODS)(
    "%s: above the last pressure and beyond the last temperature",
    (method) => {
      for (const grid of [table([200]), table(T)]) {
        let prev = 0;
        for (const dp of [0, 100, 250, 500, 1000, 2000]) {
          const r = interpolateGrid(
            grid,
            { pressure: 3500 + dp, temperature: 200 },
            { method, extrapolate: true },
          );
          if (dp > 0) {
            expect(r.errorEstimate).toBeGreaterThan(prev);
            expect(r.warnings).toContain("estimate-unreliable");
          }
          prev = r.errorEstimate;
        }
      }
      let prev = 0;
      for (const dt of [10, 25, 50, 100]) {
        const r = interpolateGrid(
          table(T),
          { pressure: 2200, temperature: 250 + dt },
          { method, extrapolate: true },
        );
        expect(r.errorEstimate).toBeGreaterThan(prev);
        prev = r.errorEstimate;
      }
    },
  );
});

describe("where the table says nothing the estimate is NaN with estimate-unavailable", () => {
  test.each(METHODS)(
    "%s: a one-temperature table asked at another temperature (was 1.382 ± 2.45e-15)",
    (method) => {
      const grid = table([200]);
      const r = interpolateGrid(
        grid,
        { pressure: 2200, temperature: 201 },
        { method, extrapolate: true },
      );
      expect(Number.isFinite(r.value)).toBe(true);
      expect(r.errorEstimate).toBeNaN();
      expect(r.warnings).toContain("estimate-unavailable");
      // at its own temperature it has an estimate
      const own = interpolateGrid(
        grid,
        { pressure: 2200, temperature: 200 },
        { method },
      );
      expect(own.errorEstimate).toBeGreaterThan(0);
      expect(own.warnings).not.toContain("estimate-unavailable");
      const batch = interpolateGridMany(
        grid,
        {
          pressures: Float64Array.of(2200, 2200),
          temperatures: Float64Array.of(200, 201),
        },
        { method, extrapolate: true },
      );
      expect(batch.errorEstimates[0]).toBe(own.errorEstimate);
      expect(batch.errorEstimates[1]).toBeNaN();
    },
  );

  test.each(METHODS)(
    "%s: a point above the bubble point of a table with no undersaturated data",
    (method) => {
      // bubble point at the last measured pressure: the undersaturated branch is that one node
      const grid: Grid = { ...table(T), bubblePoints: [3500, 3500, 3500] };
      const r = interpolateGrid(
        grid,
        { pressure: 3600, temperature: 210 },
        { method, extrapolate: true },
      );
      expect(r.branch).toBe("undersaturated");
      expect(r.errorEstimate).toBeNaN();
      expect(r.warnings).toContain("estimate-unavailable");
      const below = interpolateGrid(
        grid,
        { pressure: 3400, temperature: 210 },
        { method },
      );
      expect(Number.isFinite(below.errorEstimate)).toBe(true);
    },
  );

  test("undersaturated values in one column only, asked at another temperature", () => {
    const base = table(T);
    // columns 0 and 1 end at their bubble point (3000); column 2 has undersaturated values
    const grid: Grid = {
      ...base,
      values: base.values.map((row, i) =>
        row.map((v, j) => (P[i]! > 3000 && j < 2 ? null : v)),
      ),
      bubblePoints: [3000, 3000, 3000],
    };
    const r = interpolateGrid(
      grid,
      { pressure: 3200, temperature: 180 },
      { method: "newton", extrapolate: true },
    );
    expect(r.errorEstimate).toBeNaN();
    expect(r.warnings).toContain("estimate-unavailable");
  });
});

describe("estimate-unreliable next to a hole", () => {
  test("a zone moved by a missing cell carries missing-data and estimate-unreliable", () => {
    const base = table(T);
    const grid: Grid = {
      ...base,
      values: base.values.map((row, i) =>
        row.map((v, j) => (i === 2 && j === 1 ? null : v)),
      ),
    };
    const r = interpolateGrid(
      grid,
      { pressure: 2200, temperature: 190 },
      { method: "newton" },
    );
    expect(r.warnings).toContain("missing-data");
    expect(r.warnings).toContain("estimate-unreliable");
    expect(Number.isFinite(r.errorEstimate)).toBe(true);
  });
});
