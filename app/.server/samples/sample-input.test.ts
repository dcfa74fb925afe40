// The record form's barometric pressure: empty is one atmosphere as the oilfield writes it (14.696 psia), a
// typed value is converted from the form's units (NIST SP 811: 1 bar = 14.503773773 psi), and a value shown
// back unchanged keeps the stored number exactly. Field values are invented.
import { expect, test } from "vitest";
import type { SampleFormValues } from "~/components/samples/sample-form";
import { formDefaultsFromRecord, recordInputFromForm } from "./sample-input";

const FORM: Omit<SampleFormValues, "barometricPressure"> = {
  fieldName: "Invented Field",
  fieldRegion: "",
  wellName: "W-1",
  label: "S-1",
  sampleType: "bottomhole",
  samplingDate: "",
  samplingDepth: null,
  reservoirPressure: null,
  reservoirTemperature: null,
  stockTankApi: null,
  gasSpecificGravity: null,
  standardConditions: "field_60f_14.696psia",
  laboratory: "",
  reportReference: "",
  notes: "",
};

function barometric(
  system: "field" | "metric",
  typed: number | null,
  current?: number,
) {
  const values: SampleFormValues = { ...FORM, barometricPressure: typed };
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
  expect(barometric("field", null)).toBe(14.696);
  expect(barometric("field", 14.7)).toBe(14.7);
  expect(barometric("metric", 1)).toBeCloseTo(14.503773773, 6);
  // 14.696 psia is shown as 1.01325 bara; sending that back keeps 14.696
  expect(barometric("metric", 1.01325, 14.696)).toBe(14.696);
  expect(barometric("metric", 1.01325)).toBeCloseTo(14.6959488, 6);
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
