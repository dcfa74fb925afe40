// The plot numbers: surfaces and curves come from the engine, refused points stay empty instead of failing
// the whole plot, and query points are flagged. Reference values: invented functions chosen so that the
// methods used are exact on them (a plane for linear and Newton), stated beside each check.
import { describe, expect, test } from "vitest";
import { interpolateGrid } from "~/core/interpolation";
import {
  axisWith,
  curveOf,
  evaluatePoints,
  evaluateQueries,
  measuredPoints,
  surfaceOf,
} from "./compute";
import type { PlotGrid } from "./types";

const P = [500, 1000, 1500, 2000, 2500, 3000];
const T = [150, 180, 210, 240];
// invented plane: linear and Newton interpolation reproduce it exactly
const plane = (p: number, t: number) => 1.05 + 0.0001 * p + 0.0005 * t;
const grid: PlotGrid = {
  pressures: P,
  temperatures: T,
  values: P.map((p) => T.map((t) => plane(p, t))),
};

describe("axisWith", () => {
  test("even steps merged with the measured nodes, sorted, without duplicates", () => {
    expect(axisWith(0, 10, 3, [5, 2, 10, 11])).toEqual([0, 2, 5, 10]);
    expect(axisWith(4, 4, 10)).toEqual([4]);
  });
});

describe("surfaceOf", () => {
  test("covers the measured range on an evenly spaced grid (Plotly refines uneven ones enormously), exact on a plane", () => {
    const s = surfaceOf(grid, "newton", 3, { pressures: 11, temperatures: 4 });
    expect(s.pressures).toEqual([
      500, 750, 1000, 1250, 1500, 1750, 2000, 2250, 2500, 2750, 3000,
    ]);
    expect(s.temperatures).toEqual([150, 180, 210, 240]);
    expect(s.z).toHaveLength(s.temperatures.length);
    s.z.forEach((row, k) => {
      expect(row).toHaveLength(s.pressures.length);
      row.forEach((v, i) =>
        expect(v).toBeCloseTo(plane(s.pressures[i]!, s.temperatures[k]!), 10),
      );
    });
    expect(s.min).toBeCloseTo(plane(500, 150), 10);
    expect(s.max).toBeCloseTo(plane(3000, 240), 10);
  });

  test("points the engine refuses (an unmeasured corner) are left null, the rest is drawn", () => {
    // the two highest pressures were not measured at the two highest temperatures
    const holes: PlotGrid = {
      ...grid,
      values: grid.values.map((row, i) =>
        row.map((v, j) => (i >= 4 && j >= 2 ? null : v)),
      ),
    };
    const s = surfaceOf(holes, "linear", undefined, {
      pressures: 11,
      temperatures: 4,
    });
    const flat = s.z.flat();
    const empty = flat.filter((v) => v === null).length;
    expect(empty).toBeGreaterThan(0);
    expect(empty).toBeLessThan(flat.length / 2);
    // where drawn, it agrees with the engine point by point
    s.z.forEach((row, k) =>
      row.forEach((v, i) => {
        if (v === null) return;
        const r = interpolateGrid(
          holes,
          { pressure: s.pressures[i]!, temperature: s.temperatures[k]! },
          { method: "linear" },
        );
        expect(v).toBeCloseTo(r.value, 12);
      }),
    );
  });
});

describe("evaluatePoints", () => {
  test("out-of-range points are refused one by one without extrapolation, the others computed", () => {
    const ps = Float64Array.from([400, 1200, 3500, 2000]);
    const ts = Float64Array.from([200, 200, 200, 200]);
    const e = evaluatePoints(grid, ps, ts, "auto", 3, false);
    expect(Array.from(e.refused)).toEqual([1, 0, 1, 0]);
    expect(e.values[1]).toBeCloseTo(plane(1200, 200), 10);
    expect(e.values[3]).toBeCloseTo(plane(2000, 200), 10);
    expect(Number.isNaN(e.values[0]!)).toBe(true);
  });

  test("a bad grid still throws", () => {
    const bad: PlotGrid = {
      pressures: [2, 1],
      temperatures: [1],
      values: [[1], [2]],
    };
    expect(() =>
      evaluatePoints(
        bad,
        Float64Array.from([1.5]),
        Float64Array.from([1]),
        "linear",
        undefined,
        false,
      ),
    ).toThrow();
  });
});

describe("evaluateQueries", () => {
  test("inside, extrapolated and labelled", () => {
    const q = evaluateQueries(
      grid,
      [
        { pressure: 1750, temperature: 200 },
        { pressure: 3300, temperature: 200, label: "Res." },
      ],
      "auto",
      3,
    );
    expect(q[0]).toMatchObject({ label: "Q1", flag: "inside" });
    expect(q[0]!.value).toBeCloseTo(plane(1750, 200), 10);
    expect(q[1]).toMatchObject({ label: "Res.", flag: "extrapolated" });
    expect(q[1]!.value).not.toBeNull();
  });

  test("inside the table's range but past a column's last measured cell: beyond the envelope", () => {
    const holes: PlotGrid = {
      ...grid,
      values: grid.values.map((row, i) =>
        row.map((v, j) => (i >= 4 && j >= 2 ? null : v)),
      ),
    };
    const [q] = evaluateQueries(
      holes,
      [{ pressure: 2900, temperature: 235 }],
      "linear",
      undefined,
    );
    expect(q!.flag).toBe("beyond-envelope");
    expect(q!.value).toBeCloseTo(plane(2900, 235), 10);
  });
});

describe("curveOf", () => {
  test("bubble point from the engine, the measured column at a measured temperature, exact on a plane", () => {
    const withPb: PlotGrid = {
      ...grid,
      bubblePoints: [1800, 1900, 2000, 2100],
    };
    const c = curveOf(withPb, 210, "newton", 3, 20);
    expect(c.bubblePoint?.pressure).toBeCloseTo(2000, 6);
    expect(c.pressures).toContain(c.bubblePoint!.pressure);
    expect(c.measured.map((m) => m.pressure)).toEqual(P);
    const noColumn = curveOf(withPb, 200, "newton", 3, 20);
    expect(noColumn.measured).toEqual([]);
    c.values.forEach((v, i) =>
      expect(v).toBeCloseTo(plane(c.pressures[i]!, 210), 8),
    );
  });

  test("no bubble points: none marked", () => {
    expect(curveOf(grid, 180, "pchip", undefined).bubblePoint).toBeNull();
  });
});

test("measuredPoints skips empty cells", () => {
  const g: PlotGrid = {
    pressures: [1, 2],
    temperatures: [1, 2],
    values: [
      [1, null],
      [3, 4],
    ],
  };
  expect(measuredPoints(g)).toHaveLength(3);
});
