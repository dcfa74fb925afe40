import { expect, test } from "vitest";
import { PropertyInputError } from "./errors";
import { undersaturatedOilFvf } from "./undersaturated-oil";
import {
  vasquezBeggsBubblePoint,
  vasquezBeggsGasGravity,
  vasquezBeggsOilFvf,
  vasquezBeggsSolutionGor,
  vasquezBeggsUndersaturatedCompressibility,
  vasquezBeggsUndersaturatedOilFvf,
  vasquezBeggsUndersaturatedViscosity,
} from "./vasquez-beggs";

// Six-oil set, Ahmed ch. 2 Table 2-1 (from memory, domain brief §4 [M]); psia = psig + 14.7 (book convention).
const OIL1 = {
  temperature: 250,
  apiGravity: 47.1,
  gasGravity: 0.851,
  separator: { pressure: 164.7, temperature: 60 },
};
const OIL6 = {
  temperature: 180,
  apiGravity: 27.3,
  gasGravity: 0.848,
  separator: { pressure: 99.7, temperature: 173 },
};
const OIL2 = { temperature: 220, apiGravity: 40.7, gasGravity: 0.855 };

test("C6 V–B oil 1: γgs = 0.8733 (150 psig/60 °F) and Rs(2391.7 psia) = 779 ±2 (Ahmed ch. 2 V–B example, from memory)", () => {
  const ggs = vasquezBeggsGasGravity(OIL1);
  expect(Math.abs(ggs.value - 0.8733)).toBeLessThanOrEqual(0.00005);
  expect(
    Math.abs(
      vasquezBeggsSolutionGor({ ...OIL1, pressure: 2391.7 }).value - 779,
    ),
  ).toBeLessThanOrEqual(2);
});

test("C8 V–B oil 6 (API ≤ 30 coefficients): γgs = 0.8336 and Rs(4253.7 psia) = 841 ±2 (Ahmed ch. 2, from memory)", () => {
  expect(
    Math.abs(vasquezBeggsGasGravity(OIL6).value - 0.8336),
  ).toBeLessThanOrEqual(0.00005);
  expect(
    Math.abs(
      vasquezBeggsSolutionGor({ ...OIL6, pressure: 4253.7 }).value - 841,
    ),
  ).toBeLessThanOrEqual(2);
});

test("separator correction uses log10, not ln: the ln form would miss C6 by more than 2 scf/STB (domain §3.2 [S/C])", () => {
  const lnGravity =
    0.851 * (1 + 5.912e-5 * 47.1 * 60 * Math.log(164.7 / 114.7));
  const lnRs = vasquezBeggsSolutionGor({
    ...OIL1,
    separator: undefined,
    gasGravity: lnGravity,
    pressure: 2391.7,
  }).value;
  expect(Math.abs(lnRs - 779)).toBeGreaterThan(2);
  // uncorrected gravity differs by up to 2.6 % (domain §4 observation 3)
  const raw = vasquezBeggsSolutionGor({
    ...OIL1,
    separator: undefined,
    pressure: 2391.7,
  }).value;
  expect(Math.abs(raw / 779 - 1)).toBeGreaterThan(0.02);
});

test("V–B Rs ↔ pb is an exact inverse (1e-10 relative), on both API classes", () => {
  for (const oil of [OIL1, OIL6]) {
    for (const p of [300, 1500, 4000]) {
      const rs = vasquezBeggsSolutionGor({ ...oil, pressure: p }).value;
      expect(
        Math.abs(
          vasquezBeggsBubblePoint({ ...oil, solutionGor: rs }).value / p - 1,
        ),
      ).toBeLessThan(1e-10);
    }
  }
});

test("V–B saturated Bo rises with Rs and with T (physics trend)", () => {
  const bo = (rs: number, t: number) =>
    vasquezBeggsOilFvf({ ...OIL2, temperature: t, solutionGor: rs }).value;
  expect(bo(500, 200)).toBeGreaterThan(bo(400, 200));
  expect(bo(500, 220)).toBeGreaterThan(bo(500, 200));
  expect(bo(768, 220)).toBeGreaterThan(1.3);
  expect(bo(768, 220)).toBeLessThan(1.6);
});

// Regression values computed with python3 (domain brief §4 "computed-only references" [C]; no published
// counterpart): oil 2, Bob = 1.474, pb = 2634.7 psia, γg taken as the 100 psig value.
test("V–B co and undersaturated Bo, oil 2 at 3000/4000/5000 psia (domain §4 computed-only [C]; 0.001e-5 / 0.0001)", () => {
  const cases = [
    [3000, 1.898e-5, 1.4631],
    [4000, 1.424e-5, 1.4394],
    [5000, 1.139e-5, 1.4212],
  ] as const;
  for (const [p, co, bo] of cases) {
    const c = vasquezBeggsUndersaturatedCompressibility({
      ...OIL2,
      pressure: p,
      solutionGorAtBubblePoint: 768,
    });
    expect(Math.abs(c.value - co)).toBeLessThanOrEqual(0.001e-5);
    const b = vasquezBeggsUndersaturatedOilFvf({
      ...OIL2,
      pressure: p,
      bubblePoint: 2634.7,
      oilFvfAtBubblePoint: 1.474,
      solutionGorAtBubblePoint: 768,
    });
    expect(Math.abs(b.value - bo)).toBeLessThanOrEqual(0.0001);
    // the closed form is the V–B co integrated from pb: check against numerical integration (1e-12 relative)
    const numeric = undersaturatedOilFvf({
      pressure: p,
      bubblePoint: 2634.7,
      oilFvfAtBubblePoint: 1.474,
      compressibility: (x) =>
        vasquezBeggsUndersaturatedCompressibility({
          ...OIL2,
          pressure: x,
          solutionGorAtBubblePoint: 768,
        }).value,
    });
    expect(Math.abs(numeric.value / b.value - 1)).toBeLessThan(1e-12);
  }
});

test("V–B undersaturated viscosity, μob = 0.40 cP, pb = 2634.7 psia: 0.4141 cP (m = 0.2662) at 3000, 0.5195 cP (m = 0.4080) at 5000 psia (domain §4 [C]; ±0.0001)", () => {
  const a = vasquezBeggsUndersaturatedViscosity({
    pressure: 3000,
    bubblePoint: 2634.7,
    viscosityAtBubblePoint: 0.4,
  });
  expect(Math.abs(a.value - 0.4141)).toBeLessThanOrEqual(0.0001);
  expect(Math.abs(a.exponent - 0.2662)).toBeLessThanOrEqual(0.0001);
  const b = vasquezBeggsUndersaturatedViscosity({
    pressure: 5000,
    bubblePoint: 2634.7,
    viscosityAtBubblePoint: 0.4,
  });
  expect(Math.abs(b.value - 0.5195)).toBeLessThanOrEqual(0.0001);
  expect(Math.abs(b.exponent - 0.408)).toBeLessThanOrEqual(0.0001);
  // at pb the branches meet
  expect(
    vasquezBeggsUndersaturatedViscosity({
      pressure: 2634.7,
      bubblePoint: 2634.7,
      viscosityAtBubblePoint: 0.4,
    }).value,
  ).toBe(0.4);
});

test("undersaturated methods reject pressures below pb; a negative co is flagged, not hidden", () => {
  expect(() =>
    vasquezBeggsUndersaturatedViscosity({
      pressure: 2000,
      bubblePoint: 2634.7,
      viscosityAtBubblePoint: 0.4,
    }),
  ).toThrow(PropertyInputError);
  const co = vasquezBeggsUndersaturatedCompressibility({
    temperature: 80,
    apiGravity: 30,
    gasGravity: 0.8,
    pressure: 1000,
    solutionGorAtBubblePoint: 50,
  });
  expect(co.value).toBeLessThan(0);
  expect(co.warnings.some((w) => w.code === "NONPHYSICAL_RESULT")).toBe(true);
  expect(() =>
    vasquezBeggsSolutionGor({ ...OIL1, pressure: Number.NaN }),
  ).toThrow(/finite/);
  expect(() =>
    vasquezBeggsSolutionGor({ ...OIL1, temperature: -460, pressure: 1000 }),
  ).toThrow(/absolute zero/);
});

test("outside the V–B range (T = 320 °F, API 62) → warnings", () => {
  const r = vasquezBeggsSolutionGor({
    ...OIL1,
    temperature: 320,
    apiGravity: 62,
    pressure: 2000,
  });
  expect(r.warnings.map((w) => w.input)).toEqual(
    expect.arrayContaining(["temperature", "API gravity"]),
  );
});
