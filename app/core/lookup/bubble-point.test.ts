// The batch bubble-point pressure (one-row grid through the typed-array path) against the engine's own
// pb(T) from single-point calls: random grids, missing bubble points, every method and degree, and
// temperatures inside and outside the measured range.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { interpolateGrid, type Grid, type Method } from "../interpolation";
import { bubblePointsAt } from "./bubble-point";

const axis = (n: number, start: number, unit: number) =>
  fc
    .array(fc.double({ min: 0.3, max: 1, noNaN: true }), {
      minLength: n,
      maxLength: n,
    })
    .map((gaps) => {
      let x = start;
      return gaps.map((g, i) => (i === 0 ? x : (x += g * unit)));
    });

const gridArb = fc
  .record({
    n: fc.integer({ min: 2, max: 12 }),
    m: fc.integer({ min: 1, max: 7 }),
  })
  .chain(({ n, m }) =>
    fc.record({
      pressures: axis(n, 500, 400),
      temperatures: axis(m, 100, 30),
      slope: fc.double({ min: 0, max: 12, noNaN: true }),
      base: fc.double({ min: 0.2, max: 0.8, noNaN: true }),
      known: fc.array(fc.boolean(), { minLength: m, maxLength: m }),
    }),
  )
  .map(({ pressures, temperatures, slope, base, known }): Grid => {
    const pLo = pressures[0]!;
    const pHi = pressures[pressures.length - 1]!;
    const bubblePoints = temperatures.map((t, j) =>
      known[j] || j === 0
        ? pLo + base * (pHi - pLo) + slope * (t - temperatures[0]!)
        : null,
    );
    return {
      pressures,
      temperatures,
      values: pressures.map((p) =>
        temperatures.map((t) => 1 + p * 1e-4 + t * 1e-3),
      ),
      bubblePoints,
    };
  });

describe("bubblePointsAt agrees with the engine's bubblePointPressure", () => {
  test("random grids, methods, degrees and temperatures (inside and outside the range)", () => {
    fc.assert(
      fc.property(
        gridArb,
        fc.constantFrom<Method>("newton", "pchip", "linear"),
        fc.integer({ min: 1, max: 5 }),
        fc.array(fc.double({ min: -0.3, max: 1.3, noNaN: true }), {
          minLength: 1,
          maxLength: 12,
        }),
        (grid, method, degree, fractions) => {
          const T = grid.temperatures;
          const tLo = T[0]!;
          const span = Math.max(T[T.length - 1]! - tLo, 10);
          const ts = Float64Array.from(fractions, (f) => tLo + f * span);
          const batch = bubblePointsAt(grid, ts, method, degree)!;
          const steps = grid.pressures
            .slice(1)
            .map((p, i) => p - grid.pressures[i]!);
          // the engine snaps a bubble point within 1e-6 of a pressure step onto a grid row
          const tol =
            1e-6 * Math.max(...steps, 1) +
            1e-9 * grid.pressures[grid.pressures.length - 1]!;
          ts.forEach((t, i) => {
            const r = interpolateGrid(
              grid,
              { pressure: grid.pressures[0]!, temperature: t },
              {
                method,
                degree: [degree, degree],
                extrapolate: true,
                maxExtrapolation: Infinity,
              },
            );
            expect(
              Math.abs(batch[i]! - r.bubblePointPressure!),
            ).toBeLessThanOrEqual(tol);
          });
        },
      ),
      { numRuns: 200 },
    );
  });

  test("no bubble points, or none known: null", () => {
    const grid: Grid = {
      pressures: [1, 2],
      temperatures: [10, 20],
      values: [
        [1, 1],
        [2, 2],
      ],
    };
    expect(bubblePointsAt(grid, Float64Array.of(15), "newton", 3)).toBeNull();
    expect(
      bubblePointsAt(
        { ...grid, bubblePoints: [null, null] },
        Float64Array.of(15),
        "newton",
        3,
      ),
    ).toBeNull();
  });
});
