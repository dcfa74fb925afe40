// explainInterpolation: plain data showing how a number was obtained.
import { describe, expect, test } from "vitest";
import { explainInterpolation, interpolateGrid } from "./index";
import type { Grid } from "./index";

/** Only JSON-like values: numbers, strings, booleans, null, arrays and plain objects. */
function isPlainData(x: unknown): boolean {
  if (x === null || ["number", "string", "boolean"].includes(typeof x))
    return true;
  if (Array.isArray(x)) return x.every(isPlainData);
  if (typeof x === "object" && Object.getPrototypeOf(x) === Object.prototype)
    return Object.values(x).every(isPlainData);
  return false;
}

// f(p, t) = p² + t on a small invented grid
const g: Grid = {
  pressures: [0, 1, 2, 3],
  temperatures: [0, 1],
  values: [0, 1, 2, 3].map((p) => [p * p, p * p + 1]),
};

describe("explanation (reference: from memory — the divided differences of x² on 0,1,2,3 are 1,3,5 then 1,1 then 0)", () => {
  test("step one lists each column's zone with its divided-difference table", () => {
    const e = explainInterpolation(
      g,
      { pressure: 1.5, temperature: 0.5 },
      { method: "newton", degree: [2, 1] },
    );
    expect(e.degree).toEqual([2, 1]);
    expect(e.stepOne).toHaveLength(2);
    const first = e.stepOne[0]!;
    expect(first.axis).toBe("pressure");
    expect(first.temperature).toBe(0);
    // degree 2 exactly midway in cell [1, 2]: the zone is rows 0, 1, 2; row 3 is the extra node for the estimate
    expect(first.nodes.map((n) => [n.at, n.index, n.role])).toEqual([
      [0, 0, "zone"],
      [1, 1, "zone"],
      [2, 2, "zone"],
      [3, 3, "error-check"],
    ]);
    expect(first.dividedDifferences).toEqual([
      [0, 1, 4, 9],
      [1, 3, 5],
      [1, 1],
      [0],
    ]);
    expect(first.value).toBe(2.25);
    expect(Math.abs(first.correction)).toBe(0);
    // step two: along temperature through the new row (2.25 at t=0, 3.25 at t=1)
    expect(e.stepTwo.axis).toBe("temperature");
    expect(e.stepTwo.nodes.map((n) => n.value)).toEqual([2.25, 3.25]);
    expect(e.stepTwo.dividedDifferences).toEqual([[2.25, 3.25], [1]]);
    expect(e.value).toBe(2.75);
    expect(e.errorParts.pressure).toBe(0);
    expect(e.stencil).toMatchObject({
      pressure: [0, 1, 2],
      temperature: [0, 1],
    });
  });

  test("the explanation agrees with interpolateGrid", () => {
    for (const method of ["linear", "newton", "pchip"] as const) {
      const point = { pressure: 2.2, temperature: 0.3 };
      const e = explainInterpolation(g, point, { method });
      const r = interpolateGrid(g, point, { method });
      expect(e.value).toBeCloseTo(r.value, 13);
      expect(e.errorEstimate).toBeCloseTo(r.errorEstimate, 13);
      expect(e.warnings).toEqual(r.warnings);
      expect(e.stencil).toEqual(r.stencil);
      // the error estimate is made of its parts (README "Error estimate")
      const parts = e.errorParts;
      expect(parts.growth).toBe(1);
      expect(parts.factor).toBeGreaterThanOrEqual(2);
      expect(
        parts.growth *
          (parts.factor * (parts.pressure + parts.temperature) +
            parts.floor +
            parts.rounding),
      ).toBeCloseTo(e.errorEstimate, 15);
      expect(e.errorParts.rounding).toBeGreaterThan(0);
      expect(isPlainData(e)).toBe(true);
    }
  });

  test("pchip steps show the shape-preserving and the three-point slopes", () => {
    const e = explainInterpolation(
      g,
      { pressure: 1.5, temperature: 0 },
      { method: "pchip" },
    );
    const col = e.stepOne[0]!;
    expect(col.dividedDifferences).toBeNull();
    expect(col.pchip?.cell).toEqual([1, 2]);
    // reference: SciPy/Moler pchip at interior nodes of x² on a unit grid: harmonic means of the
    // neighbouring slopes 1,3 and 3,5 → 2·1·3/(1+3) = 1.5 and 2·3·5/(3+5) = 3.75; three-point slopes 2 and 4
    expect(col.pchip?.derivatives[0]).toBeCloseTo(1.5, 14);
    expect(col.pchip?.derivatives[1]).toBeCloseTo(3.75, 14);
    expect(col.pchip?.threePointDerivatives).toEqual([2, 4]);
  });
});
