import { expect, test } from "vitest";
import {
  beggsRobinsonDeadOilViscosity,
  beggsRobinsonLiveOilViscosity,
  beggsRobinsonOilViscosity,
} from "./beggs-robinson";
import { PropertyInputError } from "./errors";

// C9: Beggs, "Oil System Correlations", Petroleum Engineering Handbook (SPE 1987) ch. 22 worked example,
// reproduced on a public engineering wiki page (domain brief §4 [S]).
test("C9 Beggs–Robinson at 137 °F, 22 °API, Rs = 90: μod = 17.44 cP ±0.02, A = 0.719 ±0.001, B = 0.853 ±0.001, μo = 8.24 cP ±0.01 (PE Handbook 1987 ch. 22)", () => {
  const dead = beggsRobinsonDeadOilViscosity({
    apiGravity: 22,
    temperature: 137,
  });
  expect(Math.abs(dead.value - 17.44)).toBeLessThanOrEqual(0.02);
  const live = beggsRobinsonLiveOilViscosity({
    deadOilViscosity: dead.value,
    solutionGor: 90,
  });
  expect(Math.abs(live.a - 0.719)).toBeLessThanOrEqual(0.001);
  expect(Math.abs(live.b - 0.853)).toBeLessThanOrEqual(0.001);
  expect(Math.abs(live.value - 8.24)).toBeLessThanOrEqual(0.01);
  const chained = beggsRobinsonOilViscosity({
    apiGravity: 22,
    temperature: 137,
    solutionGor: 90,
  });
  expect(chained.value).toBe(live.value);
  expect(chained.deadOilViscosity).toBe(dead.value);
});

test("physics trends: viscosity falls with temperature, with dissolved gas and with API gravity", () => {
  const mu = (api: number, t: number, rs: number) =>
    beggsRobinsonOilViscosity({
      apiGravity: api,
      temperature: t,
      solutionGor: rs,
    }).value;
  expect(mu(30, 200, 300)).toBeLessThan(mu(30, 150, 300));
  expect(mu(30, 200, 600)).toBeLessThan(mu(30, 200, 300));
  expect(mu(40, 200, 300)).toBeLessThan(mu(30, 200, 300));
  // at Rs = 0 the live-oil form returns the dead-oil viscosity to within its rounded coefficients (0.1 %)
  expect(
    Math.abs(
      beggsRobinsonLiveOilViscosity({ deadOilViscosity: 5, solutionGor: 0 })
        .value /
        5 -
        1,
    ),
  ).toBeLessThan(1e-3);
});

test("Beggs–Robinson: out-of-range warning and a clear error at T ≤ 0 °F", () => {
  expect(
    beggsRobinsonDeadOilViscosity({
      apiGravity: 12,
      temperature: 60,
    }).warnings.map((w) => w.input),
  ).toEqual(["temperature", "API gravity"]);
  expect(() =>
    beggsRobinsonDeadOilViscosity({ apiGravity: 30, temperature: 0 }),
  ).toThrow(PropertyInputError);
  expect(() =>
    beggsRobinsonLiveOilViscosity({ deadOilViscosity: -1, solutionGor: 10 }),
  ).toThrow(/> 0/);
});
