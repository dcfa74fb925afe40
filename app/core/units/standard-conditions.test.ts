import { expect, test } from "vitest";
import { UnitError } from "./errors";
import {
  FIELD_STANDARD_CONDITIONS,
  METRIC_STANDARD_CONDITIONS,
  STANDARD_CONDITIONS_PRESETS,
  defineStandardConditions,
  gasVolumeRebaseFactor,
  rebaseStandardVolume,
  standardConditionsLabel,
} from "./standard-conditions";
import { convert } from "./catalogue";
import {
  CANONICAL_UNIT_SYSTEM,
  FIELD_UNIT_SYSTEM,
  METRIC_UNIT_SYSTEM,
  canonicalUnitSystemOn,
  convertBetweenSystems,
  propertyUnit,
} from "./unit-systems";

test("default standard conditions are data: 60 °F/14.696 psia (field) and 15 °C/101.325 kPa (metric, ISO 13443)", () => {
  expect(FIELD_STANDARD_CONDITIONS).toMatchObject({
    pressurePsia: 14.696,
    temperatureF: 60,
  });
  expect(METRIC_STANDARD_CONDITIONS.temperatureF).toBeCloseTo(59, 12);
  expect(
    convert(METRIC_STANDARD_CONDITIONS.pressurePsia, "pressure", "psia", "kPa"),
  ).toBeCloseTo(101.325, 10);
  expect(new Set(STANDARD_CONDITIONS_PRESETS.map((s) => s.id)).size).toBe(
    STANDARD_CONDITIONS_PRESETS.length,
  );
});

test("1 scf/STB (60 °F, 14.696 psia) = 0.177765 sm³/sm³ at 15 °C/101.325 kPa (domain §5 [C], ideal gas; 1e-6 relative)", () => {
  const m3 = convert(1, "gas_oil_ratio", "scf/STB", "sm3/sm3");
  const rebased = rebaseStandardVolume(
    m3,
    "gas_oil_ratio",
    FIELD_STANDARD_CONDITIONS,
    METRIC_STANDARD_CONDITIONS,
  );
  expect(Math.abs(rebased / 0.177765 - 1)).toBeLessThan(3e-6);
});

test("rebasing is the ideal-gas ratio and round-trips; Bg moves opposite to GOR (1e-14)", () => {
  const base1465 = defineStandardConditions({
    id: "lab",
    pressure: { value: 14.65, unit: "psia" },
    temperature: { value: 60, unit: "degF" },
  });
  const f = gasVolumeRebaseFactor(FIELD_STANDARD_CONDITIONS, base1465);
  expect(f).toBeCloseTo(14.696 / 14.65, 14);
  const gor = 768;
  const there = rebaseStandardVolume(
    gor,
    "gas_oil_ratio",
    FIELD_STANDARD_CONDITIONS,
    base1465,
  );
  expect(there).toBeGreaterThan(gor); // more scf at the lower base pressure
  expect(
    rebaseStandardVolume(
      there,
      "gas_oil_ratio",
      base1465,
      FIELD_STANDARD_CONDITIONS,
    ),
  ).toBeCloseTo(gor, 10);
  const bg = rebaseStandardVolume(
    0.00122,
    "gas_fvf",
    FIELD_STANDARD_CONDITIONS,
    base1465,
  );
  expect(bg).toBeLessThan(0.00122);
  expect(bg * there).toBeCloseTo(0.00122 * gor, 14); // reservoir volume of the dissolved gas is unchanged
});

test("bad standard conditions → UnitError", () => {
  expect(() =>
    defineStandardConditions({
      id: "x",
      pressure: { value: 0, unit: "psig" },
      temperature: { value: 60, unit: "degF" },
    }),
  ).toThrow(UnitError);
  expect(() =>
    defineStandardConditions({
      id: "x",
      pressure: { value: 0, unit: "psia" },
      temperature: { value: 60, unit: "degF" },
    }),
  ).toThrow(/> 0 psia/);
  expect(() =>
    defineStandardConditions({
      id: "x",
      pressure: { value: 1, unit: "atm" },
      temperature: { value: -300, unit: "degC" },
    }),
  ).toThrow(/absolute zero/);
});

test("unit systems: canonical, field and metric presets map every property; conversions between systems", () => {
  expect(propertyUnit(CANONICAL_UNIT_SYSTEM, "gas_fvf")).toBe("rb/scf");
  expect(propertyUnit(FIELD_UNIT_SYSTEM, "gas_fvf")).toBe("ft3/scf");
  expect(propertyUnit(METRIC_UNIT_SYSTEM, "solution_gor")).toBe("sm3/sm3");
  expect(propertyUnit(METRIC_UNIT_SYSTEM, "oil_viscosity")).toBe("mPa.s");
  // 2634.7 psia × 6894.757293168 Pa/psi = 181.65617 bara
  expect(
    convertBetweenSystems(
      2634.7,
      "pressure",
      CANONICAL_UNIT_SYSTEM,
      METRIC_UNIT_SYSTEM,
    ),
  ).toBeCloseTo(181.65617, 5);
  // GOR field → metric includes the change of standard conditions (0.177765 per scf/STB)
  expect(
    convertBetweenSystems(
      768,
      "gas_oil_ratio",
      FIELD_UNIT_SYSTEM,
      METRIC_UNIT_SYSTEM,
    ) / 768,
  ).toBeCloseTo(0.177765, 6);
  // Bg in rb/scf → rm³/sm³: ×5.614583 then ÷ the rebase factor
  const f = gasVolumeRebaseFactor(
    FIELD_STANDARD_CONDITIONS,
    METRIC_STANDARD_CONDITIONS,
  );
  expect(
    convertBetweenSystems(
      0.001,
      "gas_fvf",
      CANONICAL_UNIT_SYSTEM,
      METRIC_UNIT_SYSTEM,
    ),
  ).toBeCloseTo((0.001 * 5.614583333333333) / f, 14);
  expect(
    convertBetweenSystems(
      1.474,
      "oil_fvf",
      FIELD_UNIT_SYSTEM,
      METRIC_UNIT_SYSTEM,
    ),
  ).toBe(1.474);
});

test("a recorded base is named by its preset, else in °F and psia; the canonical units can sit on any base", () => {
  expect(
    standardConditionsLabel({ pressurePsia: 14.65, temperatureF: 60 }),
  ).toBe("60 °F, 14.65 psia");
  expect(
    standardConditionsLabel({
      pressurePsia: 101.325 / 6.894757293168,
      temperatureF: 59,
    }),
  ).toBe("15 °C, 101.325 kPa");
  expect(
    standardConditionsLabel({ pressurePsia: 14.5, temperatureF: 68 }),
  ).toBe("68 °F, 14.5 psia");
  expect(canonicalUnitSystemOn(FIELD_STANDARD_CONDITIONS)).toBe(
    CANONICAL_UNIT_SYSTEM,
  );
  const on1465 = canonicalUnitSystemOn({
    pressurePsia: 14.65,
    temperatureF: 60,
  });
  expect(on1465.units).toBe(CANONICAL_UNIT_SYSTEM.units);
  // 768 scf/STB at 14.65 psia = 768 × 14.65/14.696 at 14.696 psia (ideal gas, same temperature)
  expect(
    convertBetweenSystems(768, "gas_oil_ratio", on1465, FIELD_UNIT_SYSTEM),
  ).toBeCloseTo((768 * 14.65) / 14.696, 10);
});
