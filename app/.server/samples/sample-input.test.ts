// The record form's barometric pressure: empty is one atmosphere as the oilfield writes it (14.696 psia), a
// typed value is converted from the form's units (NIST SP 811: 1 bar = 14.503773773 psi), and a value shown
// back unchanged keeps the stored number exactly. Field values are invented.
import { expect, test } from "vitest";
import { sampleFormSchema } from "~/components/samples/sample-form";
import { formDefaultsFromRecord, recordInputFromForm } from "./sample-input";

const FORM = {
  fieldName: "Invented Field",
  wellName: "W-1",
  label: "S-1",
  sampleType: "bottomhole",
  standardConditions: "field_60f_14.696psia",
};

function barometric(
  system: "field" | "metric",
  typed: string,
  current?: number,
) {
  const values = sampleFormSchema(system).parse({
    ...FORM,
    barometricPressure: typed,
  });
  const out = recordInputFromForm(
    values,
    system,
    current === undefined
      ? undefined
      : {
          standardPressurePsia: 14.696,
          standardTemperatureF: 60,
          barometricPressurePsia: current,
        },
  );
  if (!out.ok) throw new Error("refused");
  return out.input.barometricPressurePsia;
}

test("empty → 14.696 psia; typed psia kept; bara converted; shown back unchanged → the stored value", () => {
  expect(barometric("field", "")).toBe(14.696);
  expect(barometric("field", "14.7")).toBe(14.7);
  expect(barometric("metric", "1")).toBeCloseTo(14.503773773, 6);
  // 14.696 psia is shown as 1.01325 bara; sending that back keeps 14.696
  expect(barometric("metric", "1.01325", 14.696)).toBe(14.696);
  expect(barometric("metric", "1.01325")).toBeCloseTo(14.6959488, 6);
});

test("out of the plausible range, or not a number, the form says so", () => {
  const parse = (v: string) =>
    sampleFormSchema("field").safeParse({ ...FORM, barometricPressure: v });
  expect(parse("101.325").success).toBe(false);
  expect(parse("abc").success).toBe(false);
  expect(parse("12.2").success).toBe(true);
});

test("the form shows the recorded barometric pressure in its units", () => {
  const record = {
    fieldName: "F",
    fieldRegion: null,
    wellName: "W",
    label: "L",
    sampleType: "bottomhole" as const,
    samplingDate: null,
    samplingDepthFt: null,
    reservoirPressurePsia: null,
    reservoirTemperatureF: null,
    stockTankApi: null,
    gasSpecificGravity: null,
    standardPressurePsia: 14.696,
    standardTemperatureF: 60,
    barometricPressurePsia: 14.696,
    laboratory: null,
    reportReference: null,
    notes: null,
  };
  expect(formDefaultsFromRecord(record, "field").barometricPressure).toBe(
    "14.696",
  );
  expect(formDefaultsFromRecord(record, "metric").barometricPressure).toBe(
    "1.01325",
  );
});
