// Arbitraries and small helpers shared by the interpolation tests (not part of the library).
import fc from "fast-check";
import type { Grid } from "./index";

/** A strictly increasing axis of n nodes from `start`, gaps between 0.3 and 1 times `unit` (never extreme). */
export function axisArb(
  n: number,
  start: number,
  unit: number,
): fc.Arbitrary<number[]> {
  return fc
    .array(fc.double({ min: 0.3, max: 1, noNaN: true }), {
      minLength: n,
      maxLength: n,
    })
    .map((gaps) => {
      const out: number[] = [];
      let x = start;
      for (let i = 0; i < n; i++) {
        if (i > 0) x += gaps[i]! * unit;
        out.push(x);
      }
      return out;
    });
}

/** Grid shape and axes: N pressures and M temperatures within the given bounds. */
export function axesArb(
  nMin: number,
  nMax: number,
  mMin: number,
  mMax: number,
): fc.Arbitrary<{ pressures: number[]; temperatures: number[] }> {
  return fc
    .tuple(
      fc.integer({ min: nMin, max: nMax }),
      fc.integer({ min: mMin, max: mMax }),
    )
    .chain(([n, m]) =>
      fc.record({
        pressures: axisArb(n, 500, 400),
        temperatures: axisArb(m, 60, 25),
      }),
    );
}

/** A grid with values from f. */
export function gridFrom(
  pressures: number[],
  temperatures: number[],
  f: (p: number, t: number) => number,
): Grid {
  return {
    pressures,
    temperatures,
    values: pressures.map((p) => temperatures.map((t) => f(p, t))),
  };
}

/** A number in [lo, hi] from a fraction in [0, 1]. */
export function lerp(lo: number, hi: number, u: number): number {
  return lo + (hi - lo) * u;
}

export const unit = fc.double({ min: 0, max: 1, noNaN: true });

/** Deterministic pseudo-random numbers (mulberry32), so a failing generated case can be replayed from its seed. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
