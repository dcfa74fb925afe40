import fc from "fast-check";
import { expect, test } from "vitest";
import { PropertyInputError } from "./errors";
import {
  standingBubblePoint,
  standingOilFvf,
  standingSaturationPressure,
  standingSolutionGor,
} from "./standing";

// Oils 1 and 6 of the six-oil set (Ahmed, Reservoir Engineering Handbook, ch. 2, Table 2-1 — inputs and
// expected values from memory, domain brief §4 [M]); reference-data/properties/six-oil-examples.csv.
const OIL1 = { temperature: 250, apiGravity: 47.1, gasGravity: 0.851 };
const OIL6 = { temperature: 180, apiGravity: 27.3, gasGravity: 0.848 };

test("C1 Standing Bo, oil 1, Rs = 751 → 1.506 rb/STB ±0.002 (Ahmed ch. 2 example, from memory)", () => {
  const bo = standingOilFvf({ ...OIL1, solutionGor: 751 });
  expect(Math.abs(bo.value - 1.506)).toBeLessThanOrEqual(0.002);
  expect(bo.warnings).toEqual([]);
});

test("C3 Standing Bo, oil 6, Rs = 807 → 1.461 rb/STB ±0.002 (Ahmed ch. 2 example, from memory)", () => {
  expect(
    Math.abs(standingOilFvf({ ...OIL6, solutionGor: 807 }).value - 1.461),
  ).toBeLessThanOrEqual(0.002);
});

test("Standing Bo form pinned: oil 2 gives 1.4873 (0.9759 form), not 1.4984 (0.972 form) (domain §3.1 [C]; ±0.0005)", () => {
  const bo = standingOilFvf({
    temperature: 220,
    apiGravity: 40.7,
    gasGravity: 0.855,
    solutionGor: 768,
  }).value;
  expect(Math.abs(bo - 1.4873)).toBeLessThanOrEqual(0.0005);
});

test("C4 Standing Rs, oil 1 at p = 2377 psig + 14.7 = 2391.7 psia → 838 scf/STB ±2 (Ahmed ch. 2 example, from memory)", () => {
  expect(
    Math.abs(standingSolutionGor({ ...OIL1, pressure: 2391.7 }).value - 838),
  ).toBeLessThanOrEqual(2);
});

test("C5 Standing pb ↔ Rs round trip at 2000 psia, 200 °F, 35 °API, γg 0.75 closes to ±0.5 psi (self-consistency; 1.2048 ≈ 1/0.83)", () => {
  const fluid = { temperature: 200, apiGravity: 35, gasGravity: 0.75 };
  const rs = standingSolutionGor({ ...fluid, pressure: 2000 }).value;
  const pb = standingBubblePoint({ ...fluid, solutionGor: rs }).value;
  expect(Math.abs(pb - 2000)).toBeLessThanOrEqual(0.5);
  expect(Math.abs(pb - 2000)).toBeGreaterThan(0.01); // the rounded exponent really is in the published pair
});

test("exact inverse of the Rs form round-trips to 1e-9 relative over the data range (fast-check)", () => {
  fc.assert(
    fc.property(
      fc.double({ min: 200, max: 6000, noNaN: true }),
      fc.double({ min: 100, max: 258, noNaN: true }),
      fc.double({ min: 16.5, max: 63.8, noNaN: true }),
      fc.double({ min: 0.59, max: 0.95, noNaN: true }),
      (pressure, temperature, apiGravity, gasGravity) => {
        const fluid = { temperature, apiGravity, gasGravity };
        const rs = standingSolutionGor({ ...fluid, pressure }).value;
        const back = standingSaturationPressure({
          ...fluid,
          solutionGor: rs,
        }).value;
        expect(Math.abs(back - pressure) / pressure).toBeLessThan(1e-9);
      },
    ),
  );
});

test("physics trends: Bo rises with Rs and with T; Rs rises with p; pb rises with T (fast-check)", () => {
  fc.assert(
    fc.property(
      fc.double({ min: 20, max: 1400, noNaN: true }),
      fc.double({ min: 100, max: 250, noNaN: true }),
      fc.double({ min: 17, max: 60, noNaN: true }),
      fc.double({ min: 0.6, max: 0.95, noNaN: true }),
      (rs, t, api, gg) => {
        const f = { apiGravity: api, gasGravity: gg };
        const bo = standingOilFvf({
          ...f,
          temperature: t,
          solutionGor: rs,
        }).value;
        expect(
          standingOilFvf({ ...f, temperature: t, solutionGor: rs + 10 }).value,
        ).toBeGreaterThan(bo);
        expect(
          standingOilFvf({ ...f, temperature: t + 5, solutionGor: rs }).value,
        ).toBeGreaterThan(bo);
        const pb = standingBubblePoint({
          ...f,
          temperature: t,
          solutionGor: rs,
        }).value;
        expect(
          standingBubblePoint({ ...f, temperature: t + 5, solutionGor: rs })
            .value,
        ).toBeGreaterThan(pb);
        const p = 500 + rs;
        expect(
          standingSolutionGor({ ...f, temperature: t, pressure: p + 10 }).value,
        ).toBeGreaterThan(
          standingSolutionGor({ ...f, temperature: t, pressure: p }).value,
        );
      },
    ),
  );
});

test("inputs outside Standing's data range return warnings naming the input and the range", () => {
  const bo = standingOilFvf({
    temperature: 300,
    apiGravity: 12,
    gasGravity: 1.1,
    solutionGor: 2000,
  });
  const inputs = bo.warnings.map((w) => w.input);
  expect(inputs).toEqual([
    "solution GOR",
    "gas gravity",
    "API gravity",
    "temperature",
  ]);
  expect(bo.warnings.every((w) => w.code === "OUTSIDE_CORRELATION_RANGE")).toBe(
    true,
  );
  expect(bo.warnings[3]?.message).toMatch(
    /temperature = 300 °F is outside .* 100–258 °F/,
  );
  const pb = standingBubblePoint({
    temperature: 200,
    apiGravity: 35,
    gasGravity: 0.75,
    solutionGor: 1,
  });
  expect(pb.warnings.some((w) => w.code === "NONPHYSICAL_RESULT")).toBe(true);
});

test("bad input: negative absolute pressure, below absolute zero, NaN → PropertyInputError", () => {
  const fluid = { temperature: 200, apiGravity: 35, gasGravity: 0.75 };
  expect(() => standingSolutionGor({ ...fluid, pressure: -14.7 })).toThrow(
    PropertyInputError,
  );
  expect(() => standingSolutionGor({ ...fluid, pressure: -14.7 })).toThrow(
    /absolute pressure/,
  );
  expect(() =>
    standingOilFvf({ ...fluid, temperature: -500, solutionGor: 100 }),
  ).toThrow(/absolute zero/);
  expect(() => standingOilFvf({ ...fluid, solutionGor: Number.NaN })).toThrow(
    /finite/,
  );
  expect(() =>
    standingBubblePoint({ ...fluid, gasGravity: 0, solutionGor: 100 }),
  ).toThrow(PropertyInputError);
  try {
    standingSolutionGor({ ...fluid, pressure: 0 });
  } catch (error) {
    expect((error as PropertyInputError).code).toBe(
      "NEGATIVE_ABSOLUTE_PRESSURE",
    );
    expect((error as PropertyInputError).input).toBe("pressure");
  }
});
