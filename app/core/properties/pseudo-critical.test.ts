import { expect, test } from "vitest";
import {
  reducedConditions,
  standingPseudoCritical,
  suttonPseudoCritical,
} from "./pseudo-critical";

test("C10 Sutton, γg = 0.65: Tpc = 365.11 °R ±0.01 (online formula page citing Sutton 1985 [S]); ppc = 670.13 psia ±0.01 (domain [C])", () => {
  const pc = suttonPseudoCritical({ gasGravity: 0.65 });
  expect(Math.abs(pc.value.temperatureR - 365.11)).toBeLessThanOrEqual(0.01);
  expect(Math.abs(pc.value.pressurePsia - 670.13)).toBeLessThanOrEqual(0.01);
  expect(pc.warnings).toEqual([]);
});

test("C11 Standing (natural gas), γg = 0.72: Tpc = 395.5 °R, ppc = 668.4 psia ±0.05 (Ahmed ch. 2 z-factor example, from memory)", () => {
  const pc = standingPseudoCritical({ gasGravity: 0.72 });
  expect(Math.abs(pc.value.temperatureR - 395.5)).toBeLessThanOrEqual(0.05);
  expect(Math.abs(pc.value.pressurePsia - 668.4)).toBeLessThanOrEqual(0.05);
  const condensate = standingPseudoCritical({
    gasGravity: 0.72,
    system: "condensate",
  });
  expect(condensate.value.temperatureR).toBeCloseTo(
    187 + 330 * 0.72 - 71.5 * 0.72 ** 2,
    10,
  );
});

test("Sutton outside 0.57–1.68 warns; reduced conditions use absolute temperature", () => {
  expect(suttonPseudoCritical({ gasGravity: 0.55 }).warnings[0]?.input).toBe(
    "gas gravity",
  );
  const r = reducedConditions(2000, 200, {
    temperatureR: 400,
    pressurePsia: 666,
  });
  expect(r.tpr).toBeCloseTo(659.67 / 400, 12);
  expect(r.ppr).toBeCloseTo(2000 / 666, 12);
});
