// The stencil lists exactly the cells used (issue 13, item 5): per column, only measured cells; the
// inserted bubble-point node is reported separately. Reference: the zone rule (README) worked by hand on
// invented tables.
import { describe, expect, test } from "vitest";
import { explainInterpolation, interpolateGrid } from "./index";
import type { Grid, Options, Result } from "./index";

function measuredOnly(grid: Grid, r: Result): void {
  for (const col of r.stencil.columns)
    for (const i of col.pressure) {
      const v = grid.values[i]![col.temperature];
      expect(v === null || v === undefined).toBe(false);
    }
  // the unions agree with the columns
  expect(r.stencil.temperature).toEqual(
    r.stencil.columns.map((c) => c.temperature),
  );
  expect(r.stencil.pressure).toEqual(
    [...new Set(r.stencil.columns.flatMap((c) => c.pressure))].sort(
      (a, b) => a - b,
    ),
  );
}

describe("stencil columns", () => {
  test("a complete table: every column of the zone uses the zone's rows", () => {
    const grid: Grid = {
      pressures: [1000, 2000, 3000, 4000, 5000],
      temperatures: [100, 150, 200],
      values: [1, 2, 3, 4, 5].map((i) => [i, i + 0.1, i + 0.2]),
    };
    const r = interpolateGrid(
      grid,
      { pressure: 2500, temperature: 120 },
      { method: "newton", degree: [3, 1] },
    );
    // cubic in pressure at 2500: cell 1, zone rows 0–3; linear in temperature at 120: columns 0, 1
    expect(r.stencil.columns).toEqual([
      { temperature: 0, pressure: [0, 1, 2, 3] },
      { temperature: 1, pressure: [0, 1, 2, 3] },
    ]);
    measuredOnly(grid, r);
  });

  test("missing cells: a column uses its own rows, and no listed cell is unmeasured", () => {
    // column 1 lacks row 2: its cubic zone around 2500 skips it (rows 0, 1, 3, 4), column 0 keeps 0–3
    const grid: Grid = {
      pressures: [1000, 2000, 3000, 4000, 5000],
      temperatures: [100, 150],
      values: [
        [1.0, 1.1],
        [2.0, 2.1],
        [3.0, null],
        [4.0, 4.1],
        [5.0, 5.1],
      ],
    };
    for (const method of ["newton", "pchip", "linear"] as const) {
      const options: Options = { method, degree: [3, 1] };
      const r = interpolateGrid(
        grid,
        { pressure: 2500, temperature: 120 },
        options,
      );
      measuredOnly(grid, r);
      expect(r.stencil.columns.map((c) => c.temperature)).toEqual([0, 1]);
      expect(r.stencil.columns[1]!.pressure).not.toContain(2);
      expect(
        explainInterpolation(
          grid,
          { pressure: 2500, temperature: 120 },
          options,
        ).stencil,
      ).toEqual(r.stencil);
    }
    const r = interpolateGrid(
      grid,
      { pressure: 2500, temperature: 120 },
      { method: "newton", degree: [3, 1] },
    );
    expect(r.stencil.columns).toEqual([
      { temperature: 0, pressure: [0, 1, 2, 3] },
      { temperature: 1, pressure: [0, 1, 3, 4] },
    ]);
    // the bounding span would have claimed cell (row 2, column 1), never measured
    expect(r.stencil.pressure).toEqual([0, 1, 2, 3, 4]);
  });

  test("bubble points: the inserted node is flagged, never listed as a grid cell", () => {
    // pb = 2500 between rows 1 and 2 in both columns: a saturated point uses rows 0, 1 and the node
    const grid: Grid = {
      pressures: [1000, 2000, 3000, 4000],
      temperatures: [100, 150],
      values: [
        [1.1, 1.11],
        [1.2, 1.21],
        [1.19, 1.2],
        [1.18, 1.19],
      ],
      bubblePoints: [2500, 2500],
    };
    const r = interpolateGrid(
      grid,
      { pressure: 1800, temperature: 120 },
      { method: "newton", degree: [2, 1] },
    );
    expect(r.branch).toBe("saturated");
    expect(r.stencil.columns).toEqual([
      { temperature: 0, pressure: [0, 1], bubblePointNode: true },
      { temperature: 1, pressure: [0, 1], bubblePointNode: true },
    ]);
    measuredOnly(grid, r);
    // on a grid row, pb is a measured cell (row 1 for pb = 2000) and no node is inserted
    const onRow = interpolateGrid(
      { ...grid, bubblePoints: [2000, 2000] },
      { pressure: 1500, temperature: 120 },
      { method: "newton", degree: [1, 1] },
    );
    expect(onRow.stencil.columns).toEqual([
      { temperature: 0, pressure: [0, 1] },
      { temperature: 1, pressure: [0, 1] },
    ]);
  });
});
