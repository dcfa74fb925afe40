// The record form's barometric pressure field: a plain number in a plausible range of the form's units
// (sea level to high altitude), or empty for the default. Values are invented.
import { expect, test } from "vitest";
import { sampleFormSchema } from "./sample-form";

const FORM = {
  fieldName: "Invented Field",
  wellName: "W-1",
  label: "S-1",
  sampleType: "bottomhole",
  standardConditions: "field_60f_14.696psia",
};

test("out of the plausible range, or not a number, the form says so", () => {
  const parse = (v: string, system: "field" | "metric" = "field") =>
    sampleFormSchema(system).safeParse({ ...FORM, barometricPressure: v });
  expect(parse("101.325").success).toBe(false);
  expect(parse("abc").success).toBe(false);
  expect(parse("12.2").success).toBe(true);
  expect(parse("1.01325", "metric").success).toBe(true);
  expect(parse("14.696", "metric").success).toBe(false);
  expect(parse("").data?.barometricPressure ?? null).toBeNull();
});
