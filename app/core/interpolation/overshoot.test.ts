// Overshoot: a Newton polynomial leaving the range of steadily rising (or falling) data is flagged, with
// the shape-preserving value alongside.
import { describe, expect, test } from "vitest";
import { interpolateGrid, interpolateGridMany, WARNING_FLAGS } from "./index";
import type { Grid } from "./index";

// a step in pressure (reference, from memory: the cubic through (0,0),(1,0),(2,0),(3,1) is x(x−1)(x−2)/6,
// which is −1/16 at x = 1.5, below every data value)
const step: Grid = {
  pressures: [0, 1, 2, 3, 4, 5],
  temperatures: [10, 20],
  values: [0, 0, 0, 1, 1, 1].map((v) => [v, v]),
};

describe("overshoot check (reference: common practice — cubic through a step rings; pchip does not)", () => {
  test("newton below the data on a rising step is flagged, with the pchip value given", () => {
    const r = interpolateGrid(
      step,
      { pressure: 1.5, temperature: 15 },
      { method: "newton", degree: [3, 1] },
    );
    expect(r.value).toBeCloseTo(-1 / 16, 12);
    expect(r.warnings).toContain("overshoot");
    const pchip = interpolateGrid(
      step,
      { pressure: 1.5, temperature: 15 },
      { method: "pchip" },
    );
    expect(r.alternative).toEqual({
      method: "pchip",
      value: pchip.value,
      errorEstimate: pchip.errorEstimate,
    });
    expect(pchip.value).toBeGreaterThanOrEqual(0);
    expect(pchip.value).toBeLessThanOrEqual(1);
  });

  test("a genuine maximum inside the zone is not an overshoot", () => {
    // values rise then fall: a peak is allowed to be higher than the data
    const peak: Grid = {
      pressures: [0, 1, 2, 3, 4],
      temperatures: [10, 20],
      values: [0, 3, 4, 3, 0].map((v) => [v, v]),
    };
    const r = interpolateGrid(
      peak,
      { pressure: 1.6, temperature: 15 },
      { method: "newton", degree: [3, 1] },
    );
    expect(r.warnings).not.toContain("overshoot");
    expect(r.alternative).toBeUndefined();
  });

  test("the check works along temperature too, and in the typed batch", () => {
    const g: Grid = {
      pressures: [0, 10],
      temperatures: [0, 1, 2, 3, 4],
      values: [
        [0, 0, 0, 1, 1],
        [0, 0, 0, 1, 1],
      ],
    };
    const b = interpolateGridMany(
      g,
      {
        pressures: Float64Array.from([5, 5]),
        temperatures: Float64Array.from([1.5, 2.5]),
      },
      { method: "newton", degree: [1, 3] },
    );
    expect(b.warnings[0]! & WARNING_FLAGS.overshoot).toBe(
      WARNING_FLAGS.overshoot,
    );
    expect(b.alternatives).not.toBeNull();
    expect(b.alternatives![0]).not.toBe(b.values[0]);
    expect(b.alternatives![0]).toBeGreaterThanOrEqual(0);
    // 2.5 lies midway in the steep cell: the cubic stays within [0, 1] there (reference: symmetry)
    expect(b.warnings[1]! & WARNING_FLAGS.overshoot).toBe(0);
    expect(b.alternatives![1]).toBe(b.values[1]);
    const calm = interpolateGridMany(
      g,
      {
        pressures: Float64Array.from([5]),
        temperatures: Float64Array.from([2.5]),
      },
      { method: "newton", degree: [1, 3] },
    );
    expect(calm.alternatives).toBeNull();
  });
});
