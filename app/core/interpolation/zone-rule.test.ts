// The zone rule of issue 3, checked on examples worked by hand from the rule's text, and the axis search.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { AxisIndex, cellOf, orderedZone, zoneStart } from "./axis";
import { axisArb, lerp, unit } from "./grids.test-helpers";

const a = Float64Array.from([0, 1, 2, 3, 4, 5, 6]);
const zone = (t: number, m: number): number[] => {
  const s = zoneStart(a, 0, a.length, t, m, cellOf(a, 0, a.length, t));
  return Array.from({ length: m + 1 }, (_, i) => s + i);
};

describe("zone rule (reference: the rule as written in issue 3, worked by hand)", () => {
  test("cell: a[k] <= t <= a[k+1], a point on an inner node starts the next cell, the last node uses N-2", () => {
    expect(cellOf(a, 0, 7, 2.3)).toBe(2);
    expect(cellOf(a, 0, 7, 2)).toBe(2);
    expect(cellOf(a, 0, 7, 0)).toBe(0);
    expect(cellOf(a, 0, 7, 6)).toBe(5);
    expect(cellOf(a, 0, 7, -1)).toBe(0);
    expect(cellOf(a, 0, 7, 9)).toBe(5);
  });
  test("odd degree: s = k - (m-1)/2, centred on the cell", () => {
    expect(zone(2.3, 1)).toEqual([2, 3]);
    expect(zone(2.3, 3)).toEqual([1, 2, 3, 4]);
  });
  test("even degree: the side of the nearer node; exactly midway counts as nearer a[k]", () => {
    expect(zone(2.3, 2)).toEqual([1, 2, 3]);
    expect(zone(2.7, 2)).toEqual([2, 3, 4]);
    expect(zone(2.5, 2)).toEqual([1, 2, 3]);
    expect(zone(2.5, 4)).toEqual([0, 1, 2, 3, 4]);
    expect(zone(2.51, 4)).toEqual([1, 2, 3, 4, 5]);
  });
  test("clamped at both ends", () => {
    expect(zone(0.2, 3)).toEqual([0, 1, 2, 3]);
    expect(zone(6, 3)).toEqual([3, 4, 5, 6]);
    expect(zone(5.9, 4)).toEqual([2, 3, 4, 5, 6]);
    expect(zone(0.9, 2)).toEqual([0, 1, 2]);
  });
  test("ordered zone: the zone, then the extra node of the next degree (or, on a full axis, the lower zone first)", () => {
    const out = new Int32Array(8);
    expect(orderedZone(a, 0, 7, 2.3, 3, 2, out, 0)).toBe(5);
    // degree 4 at 2.3 (nearer a[2]): [0..4] → the extra node is 0
    expect(Array.from(out.slice(0, 5))).toEqual([1, 2, 3, 4, 0]);
    const b = Float64Array.from([0, 1, 2, 3]);
    // degree 3 on 4 nodes: the whole axis; degree 2 at 2.6 (nearer 3) is [1, 2, 3], then node 0
    expect(orderedZone(b, 0, 4, 2.6, 3, 2, out, 0)).toBe(4);
    expect(Array.from(out.slice(0, 4))).toEqual([1, 2, 3, 0]);
  });
});

describe("zone rule properties (reference: common practice; the (m+1)-zone must contain the m-zone)", () => {
  test("raising the degree by one adds exactly one node to the zone", () => {
    fc.assert(
      fc.property(
        fc
          .integer({ min: 3, max: 12 })
          .chain((n) =>
            fc.tuple(
              axisArb(n, 0, 1),
              fc.integer({ min: 1, max: n - 2 }),
              unit,
            ),
          ),
        ([nodes, m, u]) => {
          const x = Float64Array.from(nodes);
          const n = x.length;
          const t = lerp(x[0]! - 0.5, x[n - 1]! + 0.5, u);
          const k = cellOf(x, 0, n, t);
          const s = zoneStart(x, 0, n, t, m, k);
          const s2 = zoneStart(x, 0, n, t, m + 1, k);
          expect(s2 === s || s2 === s - 1).toBe(true);
        },
      ),
      { numRuns: 500 },
    );
  });
  test("the lookup-table search finds the same cell as a binary search", () => {
    fc.assert(
      fc.property(
        fc
          .integer({ min: 1, max: 40 })
          .chain((n) =>
            fc.tuple(
              axisArb(n, 100, 37),
              fc.array(unit, { minLength: 20, maxLength: 20 }),
            ),
          ),
        ([nodes, us]) => {
          const x = Float64Array.from(nodes);
          const index = new AxisIndex(x);
          const n = x.length;
          const probes = us
            .map((u) => lerp(x[0]! - 10, x[n - 1]! + 10, u))
            .concat(nodes);
          for (const t of probes)
            expect(index.cell(t)).toBe(cellOf(x, 0, n, t));
        },
      ),
      { numRuns: 300 },
    );
  });
});
