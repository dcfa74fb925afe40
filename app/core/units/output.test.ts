import { expect, test } from "vitest";
import {
  OUTPUT_SYSTEMS,
  depthUnitLabel,
  fromInputPressureOn,
  outputPressureUnit,
  toOutputPressureOn,
  fromInputDepth,
  fromInputPressure,
  isOutputSystem,
  outputUnit,
  toOutputDepth,
  toOutputPressure,
  toOutputTemperature,
  toOutputValue,
  unitLabel,
} from "./output";

test("the unit label of a quantity or a property, system first", () => {
  expect(unitLabel("field", "pressure")).toBe("psia");
  expect(unitLabel("metric", "temperature")).toBe("°C");
  expect(unitLabel("field", "gas_fvf")).toBe("ft³/scf");
  expect(unitLabel("metric", "solution_gor")).toBe("sm³/sm³");
  expect(unitLabel("metric", "oil_viscosity")).toBe("mPa·s");
  expect(unitLabel("field", "gas_oil_ratio")).toBe("scf/STB");
  expect(outputUnit("field", "gas_fvf")).toEqual({
    id: "ft3/scf",
    symbol: "ft³/scf",
  });
});

test("conversions to the output system and back", () => {
  expect([...OUTPUT_SYSTEMS]).toEqual(["field", "metric"]);
  expect(isOutputSystem("metric")).toBe(true);
  expect(isOutputSystem("canonical")).toBe(false);
  expect(toOutputTemperature(212, "metric")).toBeCloseTo(100, 12);
  expect(toOutputPressure(14.503773773, "metric")).toBeCloseTo(1, 9);
  expect(
    fromInputPressure(toOutputPressure(2500, "metric"), "metric"),
  ).toBeCloseTo(2500, 9);
  expect(toOutputValue(1.2, "oil_fvf", "metric")).toBeCloseTo(1.2, 12);
});

test("depth: recorded in ft, shown in ft or m", () => {
  expect(depthUnitLabel("field")).toBe("ft");
  expect(depthUnitLabel("metric")).toBe("m");
  expect(toOutputDepth(8200, "field")).toBe(8200);
  expect(toOutputDepth(1000, "metric")).toBeCloseTo(304.8, 12);
  expect(fromInputDepth(304.8, "metric")).toBeCloseTo(1000, 9);
  expect(fromInputDepth(toOutputDepth(8123.4, "metric"), "metric")).toBeCloseTo(
    8123.4,
    9,
  );
});

/*
 * Hand calculations for the change of base on output (ideal gas at standard conditions, V₂ = V₁·(p₁/p₂)·(T₂/T₁),
 * absolute p and T; NIST SP 811: 1 atm = 101.325 kPa, 1 psi = 6.894757293168 kPa, °R = °F + 459.67;
 * 1 bbl = 5.614583 ft³ (42 US gal of 231 in³)):
 *  - a report on 15 °C/101.325 kPa, Rs 100 sm³/sm³, is stored as 100 × 5.614583 = 561.4583 scf/STB on its own
 *    base; out in metric it is 100 again. Read as if on 60 °F/14.696 psia it came back as
 *    100 × (14.696/14.695949)(518.67/519.67) = 99.80792 (0.19 % off): what lookups did before.
 *  - a report on 60 °F/14.65 psia, Rs 768 scf/STB, out in field (60 °F/14.696 psia): 768 × 14.65/14.696 =
 *    765.59608 scf/STB; Bg 0.00122 rb/scf → 0.00122 × 5.614583 × 14.696/14.65 = 0.0068712995 ft³/scf;
 *    out in metric: 768/5.614583 × (14.65/14.695949)(518.67/519.67) = 136.096566 sm³/sm³.
 */
const METRIC_REPORT = {
  pressurePsia: 101.325 / 6.894757293168,
  temperatureF: 59,
};
const US_GAS_REPORT = { pressurePsia: 14.65, temperatureF: 60 };

test("stored Rs and Bg are rebased from the report's standard conditions to the output's (hand calculation above)", () => {
  const stored = 100 * 5.614583333333333;
  expect(
    toOutputValue(stored, "solution_gor", "metric", METRIC_REPORT),
  ).toBeCloseTo(100, 10);
  expect(toOutputValue(stored, "solution_gor", "metric")).toBeCloseTo(
    99.80792,
    5,
  );
  expect(
    toOutputValue(768, "solution_gor", "field", US_GAS_REPORT),
  ).toBeCloseTo(765.59608, 5);
  expect(toOutputValue(0.00122, "gas_fvf", "field", US_GAS_REPORT)).toBeCloseTo(
    0.0068712995,
    10,
  );
  expect(
    toOutputValue(768, "solution_gor", "metric", US_GAS_REPORT),
  ).toBeCloseTo(136.096566, 6);
  // the field base itself: nothing changes; properties without a gas volume are never rebased
  expect(
    toOutputValue(768, "solution_gor", "field", {
      pressurePsia: 14.696,
      temperatureF: 60,
    }),
  ).toBe(768);
  expect(toOutputValue(1.474, "oil_fvf", "metric", US_GAS_REPORT)).toBe(1.474);
});

test("gauge pressures: psig/barg with the barometric pressure given (default 14.696 psia); NIST SP 811 1 bar = 14.5037738 psi", () => {
  expect(outputPressureUnit("field", "gauge")).toEqual({
    id: "psig",
    symbol: "psig",
  });
  expect(outputPressureUnit("metric", "gauge").id).toBe("barg");
  expect(outputPressureUnit("metric").id).toBe("bara");
  const gauge = { pressureBasis: "gauge" } as const;
  expect(toOutputPressureOn(1014.696, "field", gauge)).toBeCloseTo(1000, 10);
  expect(fromInputPressureOn(100, "metric", gauge)).toBeCloseTo(
    1465.0733773,
    6,
  );
  expect(
    fromInputPressureOn(2620, "field", {
      pressureBasis: "gauge",
      barometricPressurePsia: 14.7,
    }),
  ).toBeCloseTo(2634.7, 10);
  expect(
    toOutputPressureOn(2500, "metric", { pressureBasis: "absolute" }),
  ).toBe(toOutputPressure(2500, "metric"));
});
