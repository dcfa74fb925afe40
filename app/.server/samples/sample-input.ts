import {
  DEFAULT_SAMPLE_BAROMETRIC_PSIA,
  fromInputDepth,
  fromInputPressure,
  fromInputTemperature,
  STANDARD_CONDITIONS_PRESETS,
  standardConditionsLabel,
  standardConditionsPreset,
  toOutputDepth,
  toOutputPressure,
  toOutputTemperature,
} from "~/core/units";
import type { SampleRecordInput } from "~/.server/db/queries/samples";
import type { FieldErrors } from "~/components/form";
import type {
  FormSystem,
  SampleFormDefaults,
  SampleFormValues,
} from "~/components/samples/sample-form";
import { formatPlain, roundSignificant } from "~/core/format";

/*
 * The sample form in the reader's units ↔ the sample record in canonical units (psia, °F, ft). What the form
 * types is stored with 8 significant digits; what it shows back is written with formatPlain.
 */

const round = (v: number, digits = 8) => roundSignificant(v, digits);

type StoredStandard = {
  standardPressurePsia: number;
  standardTemperatureF: number;
};

const baseOf = (stored: StoredStandard) => ({
  pressurePsia: stored.standardPressurePsia,
  temperatureF: stored.standardTemperatureF,
});

/** The preset matching recorded standard conditions, if any. */
export function standardPresetOf(stored: StoredStandard) {
  return standardConditionsPreset(baseOf(stored));
}

export function standardLabel(stored: StoredStandard): string {
  return standardConditionsLabel(baseOf(stored));
}

/**
 * The barometric pressure to store: the default (one atmosphere, 14.696 psia) when the field is left empty;
 * the recorded value when the form shows it back unchanged (so an edit in bara keeps 14.696 psia exactly).
 */
function barometricFromForm(
  value: number | null,
  system: FormSystem,
  current: number | undefined,
): number {
  if (value === null) return DEFAULT_SAMPLE_BAROMETRIC_PSIA;
  if (
    current !== undefined &&
    formatPlain(value) === formatPlain(toOutputPressure(current, system))
  )
    return current;
  return round(fromInputPressure(value, system));
}

export function recordInputFromForm(
  values: SampleFormValues,
  system: FormSystem,
  current?: StoredStandard & { barometricPressurePsia?: number },
): { ok: true; input: SampleRecordInput } | { ok: false; errors: FieldErrors } {
  let standard: StoredStandard | undefined;
  if (values.standardConditions === "current" && current) standard = current;
  else {
    const preset = STANDARD_CONDITIONS_PRESETS.find(
      (p) => p.id === values.standardConditions,
    );
    if (preset)
      standard = {
        standardPressurePsia: preset.pressurePsia,
        standardTemperatureF: preset.temperatureF,
      };
  }
  if (!standard)
    return {
      ok: false,
      errors: {
        standardConditions: [
          "Choose the standard conditions of the report from the list.",
        ],
      },
    };
  const depthFt =
    values.samplingDepth === null
      ? null
      : fromInputDepth(values.samplingDepth, system);
  return {
    ok: true,
    input: {
      fieldName: values.fieldName,
      fieldRegion: values.fieldRegion || null,
      wellName: values.wellName,
      label: values.label,
      sampleType: values.sampleType,
      samplingDate: values.samplingDate || null,
      samplingDepthFt: depthFt === null ? null : round(depthFt),
      reservoirPressurePsia:
        values.reservoirPressure === null
          ? null
          : round(fromInputPressure(values.reservoirPressure, system)),
      reservoirTemperatureF:
        values.reservoirTemperature === null
          ? null
          : round(fromInputTemperature(values.reservoirTemperature, system)),
      stockTankApi: values.stockTankApi,
      gasSpecificGravity: values.gasSpecificGravity,
      ...standard,
      barometricPressurePsia: barometricFromForm(
        values.barometricPressure,
        system,
        current?.barometricPressurePsia,
      ),
      laboratory: values.laboratory || null,
      reportReference: values.reportReference || null,
      notes: values.notes || null,
    },
  };
}

const show = (v: number | null, convert: (x: number) => number = (x) => x) =>
  v === null ? "" : formatPlain(convert(v));

export function formDefaultsFromRecord(
  record: Omit<SampleRecordInput, "fieldRegion"> & {
    fieldRegion: string | null;
  },
  system: FormSystem,
): SampleFormDefaults {
  const preset = standardPresetOf(record);
  return {
    fieldName: record.fieldName,
    fieldRegion: record.fieldRegion ?? "",
    wellName: record.wellName,
    label: record.label,
    sampleType: record.sampleType,
    samplingDate: record.samplingDate ?? "",
    samplingDepth: show(record.samplingDepthFt, (ft) =>
      toOutputDepth(ft, system),
    ),
    reservoirPressure: show(record.reservoirPressurePsia, (p) =>
      toOutputPressure(p, system),
    ),
    reservoirTemperature: show(record.reservoirTemperatureF, (t) =>
      toOutputTemperature(t, system),
    ),
    stockTankApi: show(record.stockTankApi),
    gasSpecificGravity: show(record.gasSpecificGravity),
    standardConditions: preset?.id ?? "current",
    barometricPressure: show(record.barometricPressurePsia ?? null, (p) =>
      toOutputPressure(p, system),
    ),
    laboratory: record.laboratory ?? "",
    reportReference: record.reportReference ?? "",
    notes: record.notes ?? "",
  };
}
