import fc from "fast-check";
import { expect, test } from "vitest";
import { UnitError } from "./errors";
import {
  apiToSpecificGravity,
  gasGravityToMolarMass,
  molarMassToGasGravity,
  specificGravityToApi,
} from "./gravity";

// Definition of API gravity: API = 141.5/SG − 131.5 at 60/60 °F (API/ASTM D287 — from memory, domain §5 [M]).

test("SG of a 40.7 °API oil is 0.8217 (domain §4 C24; tolerance 5e-5 = half the last printed digit)", () => {
  expect(Math.abs(apiToSpecificGravity(40.7) - 0.8217)).toBeLessThan(5e-5);
});

test("water is 10 °API by definition (exact)", () => {
  expect(apiToSpecificGravity(10)).toBe(1);
  expect(specificGravityToApi(1)).toBe(10);
});

test("API ↔ SG round trip over 0–100 °API (fast-check; 1e-12 absolute)", () => {
  fc.assert(
    fc.property(fc.double({ min: 0, max: 100, noNaN: true }), (api) => {
      expect(
        Math.abs(specificGravityToApi(apiToSpecificGravity(api)) - api),
      ).toBeLessThan(1e-12);
    }),
  );
});

test("gas gravity ↔ molar mass with Ma(air) = 28.9647 (domain §5 convention; 1e-12 relative)", () => {
  expect(gasGravityToMolarMass(1)).toBe(28.9647);
  // domain C16: Ma = 20.85 ↔ γg = 0.7198
  expect(molarMassToGasGravity(20.85)).toBeCloseTo(0.71984, 5);
  expect(molarMassToGasGravity(gasGravityToMolarMass(0.65))).toBeCloseTo(
    0.65,
    12,
  );
});

test("bad gravity input → UnitError", () => {
  expect(() => specificGravityToApi(0)).toThrow(UnitError);
  expect(() => apiToSpecificGravity(-200)).toThrow(UnitError);
  expect(() => apiToSpecificGravity(Number.NaN)).toThrow(/finite/);
  expect(() => gasGravityToMolarMass(-0.6)).toThrow(UnitError);
});
