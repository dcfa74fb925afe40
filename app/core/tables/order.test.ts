// The ordering numerics on their own: least-squares order (checked against brute force on small cases),
// strict order with the minimum slope, anchors kept, bounds respected, positivity repair.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  enforceDecreasing,
  enforceIncreasing,
  isotonicIncreasing,
  makePositive,
  MIN_SLOPE_FRACTION,
} from "./order";

const xs = (n: number): number[] =>
  Array.from({ length: n }, (_, i) => 500 + 250 * i + (i % 3) * 17);

function isStrictlyIncreasing(y: readonly number[]): boolean {
  return y.every((v, i) => i === 0 || v > y[i - 1]!);
}

describe("isotonicIncreasing (pool adjacent violators)", () => {
  test("a textbook case: 1, 3, 2, 4 → 1, 2.5, 2.5, 4", () => {
    expect(isotonicIncreasing([1, 3, 2, 4])).toEqual([1, 2.5, 2.5, 4]);
    expect(isotonicIncreasing([3, 2, 1])).toEqual([2, 2, 2]);
    expect(isotonicIncreasing([1, 2, 3])).toEqual([1, 2, 3]);
  });

  test("no non-decreasing sequence is closer in least squares (brute force over the block partitions)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -20, max: 20 }), {
          minLength: 1,
          maxLength: 7,
        }),
        (y) => {
          const fit = isotonicIncreasing(y);
          const ss = (f: readonly number[]): number =>
            f.reduce((s, v, i) => s + (v - y[i]!) ** 2, 0);
          // every non-decreasing fit is piecewise constant on blocks with block means; try all 2^(n−1) partitions
          let best = Infinity;
          for (let mask = 0; mask < 1 << (y.length - 1); mask++) {
            const f: number[] = [];
            let start = 0;
            for (let i = 0; i < y.length; i++) {
              if (i === y.length - 1 || mask & (1 << i)) {
                const block = y.slice(start, i + 1);
                const mean = block.reduce((a, b) => a + b, 0) / block.length;
                for (let k = start; k <= i; k++) f.push(mean);
                start = i + 1;
              }
            }
            if (f.every((v, i) => i === 0 || v >= f[i - 1]! - 1e-12))
              best = Math.min(best, ss(f));
          }
          expect(fit.every((v, i) => i === 0 || v >= fit[i - 1]!)).toBe(true);
          expect(ss(fit)).toBeLessThanOrEqual(best + 1e-9);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("enforceIncreasing / enforceDecreasing", () => {
  const noisy = fc.array(fc.double({ min: -1, max: 1, noNaN: true }), {
    minLength: 2,
    maxLength: 40,
  });

  test("the result is strictly ordered and ordered data are left alone", () => {
    fc.assert(
      fc.property(
        noisy,
        fc.double({ min: 0, max: 0.01, noNaN: true }),
        (eps, slope) => {
          const x = xs(eps.length);
          const y = eps.map((e, i) => 1.2 + slope * (x[i]! - 500) + 0.01 * e);
          const up = y.slice();
          enforceIncreasing(x, up, { anchor: null });
          expect(isStrictlyIncreasing(up)).toBe(true);
          const down = y.slice();
          enforceDecreasing(x, down, { anchor: null });
          expect(isStrictlyIncreasing(down.map((v) => -v))).toBe(true);
          const ordered = x.map((p) => 1 + 1e-4 * p);
          const copy = ordered.slice();
          enforceIncreasing(x, copy, { anchor: null });
          expect(copy).toEqual(ordered);
        },
      ),
      { numRuns: 300 },
    );
  });

  test("an anchored end keeps its value exactly, and the others stay below (increasing) or above (decreasing from it)", () => {
    fc.assert(
      fc.property(noisy, (eps) => {
        const x = xs(eps.length);
        const y = eps.map((e, i) => 1.3 + 1e-5 * x[i]! + 0.02 * e);
        const last = y[y.length - 1]!;
        const up = y.slice();
        enforceIncreasing(x, up, { anchor: y.length - 1 });
        expect(up[up.length - 1]).toBe(last);
        expect(isStrictlyIncreasing(up)).toBe(true);
        const first = y[0]!;
        const down = y.slice();
        enforceDecreasing(x, down, { anchor: 0 });
        expect(down[0]).toBe(first);
        expect(isStrictlyIncreasing(down.map((v) => -v))).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  test("bounds hold: a positive decreasing column stays positive", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 1e-6, max: 1e-3, noNaN: true }), {
          minLength: 2,
          maxLength: 30,
        }),
        (y) => {
          const x = xs(y.length);
          const v = y.slice();
          enforceDecreasing(x, v, { anchor: null, lower: 0 });
          expect(v.every((e) => e > 0)).toBe(true);
          expect(isStrictlyIncreasing(v.map((e) => -e))).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });

  test("a pooled run keeps its mean and rises by the minimum slope, 10⁻³ of the column's trend", () => {
    const x = [1000, 2000, 3000, 4000, 5000];
    const y = [1, 2, 2.2, 1.8, 3]; // 2, 2.2 and 1.8 break the order and pool
    enforceIncreasing(x, y, { anchor: null });
    expect(y[0]).toBe(1);
    expect(y[4]).toBe(3);
    expect(isStrictlyIncreasing(y)).toBe(true);
    expect((y[1]! + y[2]! + y[3]!) / 3).toBeCloseTo(2, 12);
    expect((y[3]! - y[1]!) / 2000).toBeCloseTo(
      MIN_SLOPE_FRACTION * (2 / 4000),
      15,
    );
  });

  test("values already in order come back exactly, even next to a corrected run", () => {
    const x = [1000, 2000, 3000, 4000, 5000, 6000];
    const y = [1, 1.5, 1.4, 2, 2.5, 3];
    enforceIncreasing(x, y, { anchor: null });
    expect([y[0], y[3], y[4], y[5]]).toEqual([1, 2, 2.5, 3]);
    expect(y[1]! < y[2]!).toBe(true);
  });
});

describe("makePositive", () => {
  test("non-positive values are interpolated from the nearest positive ones, or copied at an end", () => {
    const x = [1, 2, 3, 4, 5];
    const y = [-1, 2, 0, 4, -3];
    expect(makePositive(x, y)).toBe(true);
    expect(y).toEqual([2, 2, 3, 4, 4]);
  });

  test("nothing positive: reported, not invented", () => {
    expect(makePositive([1, 2], [0, -1])).toBe(false);
  });
});
