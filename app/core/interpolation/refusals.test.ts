// Per-point refusal in the typed batch path, the extrapolation limit and snapping. Reference for the
// behaviour: issue 13 (items 1–3) and README, "Refused points", "Snapping". Unit factors from NIST SP 811
// (2008), appendix B.8: 1 psi = 1 lbf/in² = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² = 6894.757293168… Pa, 1 bar = 1e5 Pa;
// T(°F) = T(K) × 1.8 − 459.67, T(K) = T(°C) + 273.15.
import { describe, expect, test } from "vitest";
import {
  DEFAULT_MAX_EXTRAPOLATION,
  interpolateGrid,
  interpolateGridMany,
  InterpolationError,
  REFUSAL_CODES,
} from "./index";
import type { BatchResult, Grid, Options } from "./index";

const PA_PER_PSI = (0.45359237 * 9.80665) / 0.0254 ** 2;
const barToPsi = (bar: number): number => (bar * 1e5) / PA_PER_PSI;
const cToF = (c: number): number => (c + 273.15) * 1.8 - 459.67;

// invented table (smooth, no physical meaning)
const grid = (): Grid => ({
  pressures: [1000, 2000, 3000, 4000, 5000],
  temperatures: [100, 150, 200, 250, 300],
  values: [1000, 2000, 3000, 4000, 5000].map((p) =>
    [100, 150, 200, 250, 300].map((t) => 1 + p / 1e4 + t / 1e3),
  ),
});

function batch(
  g: Grid,
  points: [number, number][],
  options: Options,
  reuse?: BatchResult,
): BatchResult {
  return interpolateGridMany(
    g,
    {
      pressures: Float64Array.from(points, (x) => x[0]),
      temperatures: Float64Array.from(points, (x) => x[1]),
    },
    options,
    reuse,
  );
}

function code(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InterpolationError);
    return (e as InterpolationError).code;
  }
  return "no error";
}

describe("refused points in the typed batch", () => {
  test("no refusal: the refusals array is not even allocated", () => {
    for (const method of ["linear", "newton", "pchip"] as const) {
      const out = batch(grid(), [[2500, 175]], { method });
      expect(out.refusals).toBeNull();
    }
  });

  test("each point is answered or refused on its own, with the single-point form's code", () => {
    const g = grid();
    const holey: Grid = { ...g, values: g.values.map((r) => [...r]) };
    // the two hottest columns measured only up to 2000: nothing around (4500, 275) without extrapolation
    for (const i of [2, 3, 4]) holey.values[i] = [1.1, 1.2, 1.3, null, null];
    for (const gr of [g, holey]) {
      for (const method of ["linear", "newton", "pchip"] as const) {
        const points: [number, number][] = [
          [2500, 175],
          [9000, 175],
          [2500, 20],
          [4500, 275],
        ];
        const out = batch(gr, points, { method });
        points.forEach(([p, t], i) => {
          const expected = code(() =>
            interpolateGrid(gr, { pressure: p, temperature: t }, { method }),
          );
          const r = out.refusals?.[i] ?? 0;
          expect(r === 0 ? "no error" : REFUSAL_CODES[r - 1]).toBe(expected);
          if (r !== 0) {
            expect(Number.isNaN(out.values[i]!)).toBe(true);
            expect(Number.isNaN(out.errorEstimates[i]!)).toBe(true);
            expect(out.warnings[i]).toBe(0);
            expect(out.pressureCount[i]).toBe(0);
            expect(out.temperatureCount[i]).toBe(0);
          } else expect(Number.isFinite(out.values[i]!)).toBe(true);
        });
        expect(out.refusals).not.toBeNull();
      }
    }
    // the hole refuses (4500, 275) with no-valid-zone on the holey table, serves it on the complete one
    expect(batch(holey, [[4500, 275]], { method: "newton" }).refusals![0]).toBe(
      2,
    );
    expect(batch(g, [[4500, 275]], { method: "newton" }).refusals).toBeNull();
  });

  test("the single point and the array form still throw", () => {
    expect(
      code(() =>
        interpolateGrid(
          grid(),
          { pressure: 9000, temperature: 150 },
          { method: "newton" },
        ),
      ),
    ).toBe("out-of-range");
    expect(
      code(() =>
        interpolateGridMany(grid(), [{ pressure: 9000, temperature: 150 }], {
          method: "newton",
        }),
      ),
    ).toBe("out-of-range");
  });

  test("a reused result forgets the refusals of the last call", () => {
    const first = batch(grid(), [[9000, 150]], { method: "newton" });
    expect(first.refusals).not.toBeNull();
    const again = batch(grid(), [[2000, 150]], { method: "newton" }, first);
    expect(again).toBe(first);
    expect(again.refusals).toBeNull();
    expect(again.values[0]).toBeCloseTo(1.35, 12);
  });
});

describe("extrapolation limit (maxExtrapolation, a fraction of the axis span)", () => {
  const ext: Options = { method: "newton", extrapolate: true };
  test("default a quarter of the span, per axis", () => {
    expect(DEFAULT_MAX_EXTRAPOLATION).toBe(0.25);
    // pressure span 4000: up to 1000 beyond 5000 is served; temperature span 200: up to 50 beyond 300
    const out = batch(
      grid(),
      [
        [6000, 200],
        [6001, 200],
        [3000, 350],
        [3000, 350.5],
        [-0.5, 200],
      ],
      ext,
    );
    expect(Array.from(out.refusals!)).toEqual([0, 3, 0, 3, 3]);
    expect(out.warnings[0]! & 1).toBe(1); // extrapolated
    expect(
      code(() =>
        interpolateGrid(grid(), { pressure: 6001, temperature: 200 }, ext),
      ),
    ).toBe("extrapolation-too-far");
  });

  test("configurable; Infinity lifts it; without extrapolate it plays no part", () => {
    const far: [number, number][] = [[13000, 200]];
    expect(batch(grid(), far, { ...ext, maxExtrapolation: 2 }).refusals).toBe(
      null,
    );
    expect(
      batch(grid(), far, { ...ext, maxExtrapolation: 1 }).refusals![0],
    ).toBe(3);
    expect(
      batch(grid(), far, { ...ext, maxExtrapolation: Infinity }).refusals,
    ).toBeNull();
    expect(
      batch(grid(), far, { method: "newton", maxExtrapolation: 5 })
        .refusals![0],
    ).toBe(1);
  });

  test("bad values are refused as options", () => {
    for (const bad of [0, -1, Number.NaN, "1"])
      expect(
        code(() =>
          interpolateGrid(
            grid(),
            { pressure: 2000, temperature: 150 },
            { ...ext, maxExtrapolation: bad as number },
          ),
        ),
      ).toBe("invalid-options");
  });

  test("a one-temperature table: only the pressure axis is limited", () => {
    const one: Grid = {
      pressures: [1000, 2000, 3000],
      temperatures: [200],
      values: [[1.1], [1.2], [1.3]],
    };
    const out = batch(
      one,
      [
        [2000, 260],
        [3600, 200],
      ],
      ext,
    );
    expect(Array.from(out.refusals!)).toEqual([0, 3]);
  });

  test("the message never contradicts itself", () => {
    try {
      interpolateGrid(
        {
          pressures: [0, 9],
          temperatures: [100, 109],
          values: [
            [1, 2],
            [3, 4],
          ],
        },
        { pressure: 4, temperature: 111.25000000000001 },
        { method: "linear", extrapolate: true },
      );
      throw new Error("not refused");
    } catch (e) {
      const m = (e as Error).message;
      const [, distance, limit] =
        /is ([\d.e+-]+) above that range, farther than the extrapolation limit of ([\d.e+-]+)/.exec(
          m,
        )!;
      expect(distance).not.toBe(limit);
    }
  });
});

describe("snapping: a coordinate within round-off of a node is that node", () => {
  // the table was measured at 100–250 bara and 75–95 °C and stored in psia and °F by one route; the
  // point is converted by another (a rounded factor, °C → K → °F) and differs by round-off only
  const bars = [100, 150, 200, 250];
  const celsius = [75, 85, 95];
  const stored: Grid = {
    pressures: bars.map(barToPsi),
    temperatures: celsius.map((c) => (c * 9) / 5 + 32),
    values: bars.map((b) => celsius.map((c) => 1.2 + b / 1000 + c / 500)),
  };
  const typed = (bar: number, c: number) => ({
    pressure: bar * 14.503773773022,
    temperature: cToF(c),
  });

  test("the conversions really differ from the stored nodes", () => {
    expect(typed(250, 95).pressure).not.toBe(stored.pressures[3]);
    expect(typed(250, 75).temperature).not.toBe(stored.temperatures[0]);
    expect(typed(250, 75).temperature).toBeLessThan(stored.temperatures[0]!);
  });

  test("every measured corner is served as measured, on complete and holey tables, all methods", () => {
    const holey: Grid = {
      ...stored,
      values: stored.values.map((r, i) => (i === 1 ? [r[0]!, null, r[2]!] : r)),
    };
    for (const g of [stored, holey]) {
      for (const method of ["linear", "newton", "pchip"] as const) {
        for (const [i, bar] of bars.entries()) {
          for (const [j, c] of celsius.entries()) {
            const measured = g.values[i]![j];
            if (measured === null || measured === undefined) continue;
            const r = interpolateGrid(g, typed(bar, c), { method });
            expect(r.warnings).not.toContain("extrapolated");
            expect(Math.abs(r.value - measured)).toBeLessThan(1e-12);
            const pt = typed(bar, c);
            const out = batch(g, [[pt.pressure, pt.temperature]], { method });
            expect(out.refusals).toBeNull();
          }
        }
      }
    }
  });

  test("a point at the bubble point given with round-off stays on the saturated branch", () => {
    // pb = 2000 psig stored as psia (+ 14.696, the sample's barometric pressure); nothing was measured
    // above pb, so the undersaturated branch is empty and a point a hair above pb would have no zone
    const pb = 2000 + 14.696;
    const g: Grid = {
      pressures: [1014.696, 1514.696, pb, 3014.696],
      temperatures: [200],
      values: [[1.2], [1.25], [1.3], [null]],
      bubblePoints: [pb],
    };
    const p = 2000.0000000000002 + 14.696; // the same pressure, with round-off from another route
    expect(p).toBeGreaterThan(pb);
    const r = interpolateGrid(
      g,
      { pressure: p, temperature: 200 },
      { method: "newton" },
    );
    expect(r.branch).toBe("saturated");
    expect(r.warnings).toEqual(["degree-reduced"]); // three saturated nodes: a quadratic
    expect(Math.abs(r.value - 1.3)).toBeLessThan(1e-12);
    // a real difference (1 psi) is above pb: no undersaturated data, refused
    expect(
      code(() =>
        interpolateGrid(
          g,
          { pressure: pb + 1, temperature: 200 },
          { method: "newton" },
        ),
      ),
    ).toBe("no-valid-zone");
    const out = batch(
      g,
      [
        [p, 200],
        [pb + 1, 200],
      ],
      { method: "newton" },
    );
    expect(Array.from(out.refusals!)).toEqual([0, 2]);
    expect(out.branches![1]).toBe(2);
  });
});
