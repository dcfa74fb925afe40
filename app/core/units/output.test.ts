import { expect, test } from "vitest";
import {
  OUTPUT_SYSTEMS,
  depthUnitLabel,
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
