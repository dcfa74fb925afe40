import { expect, test } from "vitest";
import { findOutliers, IDENTITY, LOG, quadraticAt } from "./local-fit";

test("the local quadratic reproduces a parabola exactly (least squares through four points)", () => {
  const f = (x: number) => 3 - 2 * x + 0.5 * x * x;
  const points = [0, 1, 3, 4].map((x) => ({ x: x * 1000, y: f(x) }));
  expect(quadraticAt(points, 2000)).toBeCloseTo(f(2), 12);
  expect(quadraticAt(points.slice(0, 2), 2000)).toBeNull();
});

test("a single spike is flagged; a smooth curve, even a steep one, is not (common practice smoothness check)", () => {
  const xs = [15, 300, 600, 1000, 1400, 1800, 2200, 2600];
  const smooth = xs.map((x) => 1.05 + 0.3 * (x / 2600) ** 1.2);
  expect(findOutliers(xs, smooth, IDENTITY, (e) => 0.01 * e)).toEqual([]);
  const spiked = smooth.map((v, i) => (i === 4 ? v * 1.05 : v));
  const found = findOutliers(xs, spiked, IDENTITY, (e) => 0.01 * e);
  expect(found.map((o) => o.index)).toEqual([4]);
  expect(found[0]?.deviation).toBeGreaterThan(0.04);
  // Steep, coarse end like the last step of a differential liberation (Bod 1.075 at 0 psig): not a spike.
  const dl = [1.075, 1.244, 1.283, 1.32, 1.351, 1.382, 1.412];
  expect(
    findOutliers(
      [14.7, 173.7, 364.7, 614.7, 864.7, 1114.7, 1364.7],
      dl,
      IDENTITY,
      (e) => 0.01 * e,
    ),
  ).toEqual([]);
});

test("outliers are found in the transformed coordinate (ln μ) and at most a third of the points are flagged", () => {
  const xs = [500, 1000, 1500, 2000, 2500, 3000];
  const mu = xs.map((x) => 2 * Math.exp(-x / 1500));
  const bad = mu.map((v, i) => (i === 2 ? v * 1.3 : v));
  expect(
    findOutliers(xs, bad, LOG, (e) => 0.05 * e).map((o) => o.index),
  ).toEqual([2]);
  const zigzag = xs.map((_, i) => (i % 2 === 0 ? 1 : 2));
  expect(
    findOutliers(xs, zigzag, IDENTITY, () => 0.01).length,
  ).toBeLessThanOrEqual(2);
});
