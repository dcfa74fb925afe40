import fc from "fast-check";
import { expect, test } from "vitest";
import { PropertyInputError } from "./errors";
import { dranchukAbouKassemZ, gasZFactor, hallYarboroughZ } from "./z-factor";

// Standing & Katz (1942) chart readings at Tpr = 1.3, as tabulated in a public notebook (domain brief §4 C12 [S]);
// reference-data/properties/standing-katz-tpr-1.3.csv. Tolerance ±0.012 = chart-reading precision.
const CHART: ReadonlyArray<readonly [number, number]> = [
  [0.5, 0.92],
  [1.5, 0.76],
  [2.5, 0.64],
  [3.5, 0.63],
  [4.5, 0.68],
  [5.5, 0.76],
  [6.5, 0.84],
];

test.each(CHART)(
  "C12 Tpr 1.3, ppr %f: HY and DAK within ±0.012 of the Standing–Katz chart reading %f",
  (ppr, z) => {
    expect(
      Math.abs(hallYarboroughZ({ tpr: 1.3, ppr }).value - z),
    ).toBeLessThanOrEqual(0.012);
    expect(
      Math.abs(dranchukAbouKassemZ({ tpr: 1.3, ppr }).value - z),
    ).toBeLessThanOrEqual(0.012);
  },
);

test("C14 HY at Tpr 1.618967, ppr 2.891013 → 0.838419 ±0.005 (Guo, Lyons & Ghalambor 2007 spreadsheet [S]; the sheet stopped unconverged, our converged 0.8362 [C])", () => {
  const z = hallYarboroughZ({ tpr: 1.618967, ppr: 2.891013 });
  expect(Math.abs(z.value - 0.838419)).toBeLessThanOrEqual(0.005);
  expect(Math.abs(z.value - 0.8362)).toBeLessThanOrEqual(0.0001);
  expect(
    Math.abs(
      dranchukAbouKassemZ({ tpr: 1.618967, ppr: 2.891013 }).value - 0.837,
    ),
  ).toBeLessThanOrEqual(0.0001);
});

// Cross-check of two independent fits of the same chart [C]: they agree within 0.0125 (about the chart-reading
// precision) for Tpr ≥ 1.2 (largest gap 0.0123 at Tpr 3, ppr 15) and within 0.05 below (largest gap 0.047 at Tpr 1.05, ppr 1.4, where the
// chart is steepest).
test("both solvers converge over Tpr 1.05–3, ppr 0.2–15: tiny residual, z in (0.25, 2), HY and DAK agree (0.05 / 0.0125)", () => {
  for (let i = 0; i <= 39; i++) {
    for (let j = 1; j <= 75; j++) {
      const tpr = 1.05 + 0.05 * i;
      const ppr = 0.2 * j;
      const hy = hallYarboroughZ({ tpr, ppr });
      const dak = dranchukAbouKassemZ({ tpr, ppr });
      for (const z of [hy, dak]) {
        expect(Number.isFinite(z.value)).toBe(true);
        expect(z.value).toBeGreaterThan(0.25);
        expect(z.value).toBeLessThan(2);
        expect(Math.abs(z.residual)).toBeLessThan(1e-9);
        expect(z.iterations).toBeLessThan(100);
      }
      expect(Math.abs(hy.value - dak.value)).toBeLessThan(
        tpr < 1.2 ? 0.05 : 0.0125,
      );
    }
  }
});

test("the solved z satisfies each published equation (fast-check over Tpr 1.05–3, ppr 0–20; 1e-9)", () => {
  fc.assert(
    fc.property(
      fc.double({ min: 1.05, max: 3, noNaN: true }),
      fc.double({ min: 0, max: 20, noNaN: true }),
      (tpr, ppr) => {
        const hy = hallYarboroughZ({ tpr, ppr });
        const t = 1 / tpr;
        const a = 0.06125 * t * Math.exp(-1.2 * (1 - t) ** 2);
        expect(Math.abs(hy.value - 1)).toBeLessThan(ppr < 1e-9 ? 1e-8 : 2);
        if (ppr > 0)
          expect(
            Math.abs((a * ppr) / hy.value - hy.reducedDensity),
          ).toBeLessThan(1e-9);
        const dak = dranchukAbouKassemZ({ tpr, ppr });
        if (ppr > 0)
          expect(
            Math.abs((0.27 * ppr) / (dak.value * tpr) - dak.reducedDensity),
          ).toBeLessThan(1e-9);
      },
    ),
  );
});

test("always converging near and below Tpr = 1 (0.5–1.05) with a warning outside the fitted range", () => {
  for (const tpr of [0.5, 0.7, 0.9, 1.0, 1.02]) {
    for (const ppr of [0.1, 0.5, 2, 5, 10, 25]) {
      const hy = hallYarboroughZ({ tpr, ppr });
      const dak = dranchukAbouKassemZ({ tpr, ppr });
      expect(Number.isFinite(hy.value) && hy.value > 0).toBe(true);
      expect(Number.isFinite(dak.value) && dak.value > 0).toBe(true);
    }
  }
  expect(hallYarboroughZ({ tpr: 0.9, ppr: 2 }).warnings[0]?.input).toBe(
    "reduced temperature",
  );
  expect(dranchukAbouKassemZ({ tpr: 0.9, ppr: 2 }).warnings).toHaveLength(1);
  expect(dranchukAbouKassemZ({ tpr: 0.9, ppr: 0.5 }).warnings).toHaveLength(0);
  expect(dranchukAbouKassemZ({ tpr: 1.5, ppr: 35 }).warnings).toHaveLength(1);
});

test("z = 1 at zero pressure; z trend at Tpr 1.3 dips then rises (Standing–Katz chart shape)", () => {
  expect(hallYarboroughZ({ tpr: 1.5, ppr: 0 }).value).toBe(1);
  expect(dranchukAbouKassemZ({ tpr: 1.5, ppr: 0 }).value).toBe(1);
  const zs = [0.5, 2, 3, 6, 10].map(
    (ppr) => dranchukAbouKassemZ({ tpr: 1.3, ppr }).value,
  );
  expect(zs[1]).toBeLessThan(zs[0] ?? 0);
  expect(zs[4]).toBeGreaterThan(zs[2] ?? 0);
});

test("gasZFactor: pressure and temperature in canonical units, Sutton + DAK by default", () => {
  const z = gasZFactor({ pressure: 2000, temperature: 200, gasGravity: 0.65 });
  expect(z.pseudoCritical.temperatureR).toBeCloseTo(365.11, 2);
  expect(z.tpr).toBeCloseTo(659.67 / 365.11, 4);
  expect(z.value).toBeCloseTo(
    dranchukAbouKassemZ({ tpr: z.tpr, ppr: z.ppr }).value,
    14,
  );
  const hy = gasZFactor({
    pressure: 2000,
    temperature: 200,
    gasGravity: 0.65,
    method: "hall_yarborough",
    pseudoCritical: "standing_natural_gas",
  });
  expect(Math.abs(hy.value - z.value)).toBeLessThan(0.02);
});

test("bad input: Tpr below 0.5, negative ppr, NaN, negative absolute pressure → PropertyInputError", () => {
  expect(() => hallYarboroughZ({ tpr: 0.4, ppr: 1 })).toThrow(
    PropertyInputError,
  );
  expect(() => dranchukAbouKassemZ({ tpr: 1.2, ppr: -1 })).toThrow(/≥ 0/);
  expect(() => dranchukAbouKassemZ({ tpr: Number.NaN, ppr: 1 })).toThrow(
    /finite/,
  );
  expect(() =>
    gasZFactor({ pressure: -5, temperature: 200, gasGravity: 0.7 }),
  ).toThrow(/absolute pressure/);
});
