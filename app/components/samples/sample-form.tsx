import { useId } from "react";
import { z } from "zod";
import { FieldError, TextField, type FieldErrors } from "~/components/form";
import { SAMPLE_TYPES } from "~/utils/sample-vocabulary";
import {
  depthUnitLabel,
  STANDARD_CONDITIONS_PRESETS,
  unitLabel,
  type OutputSystem,
} from "~/core/units";
import { labelSchema, multilineTextSchema } from "~/utils/labels";
import { SAMPLE_TYPE_LABELS } from "./labels";

/*
 * The sample record form (new and edit). One zod schema, built for the reader's unit system, checks the form in
 * the browser before it is sent and again in the action; the action converts to canonical units.
 */

export type FormSystem = OutputSystem;

/** Units the form uses in a system, from the one output-units module. */
function formUnits(system: FormSystem) {
  return {
    pressure: unitLabel(system, "pressure"),
    temperature: unitLabel(system, "temperature"),
    depth: depthUnitLabel(system),
  };
}

/** Plausible limits, in the form's units (checked again in canonical units on the server). */
const LIMITS: Record<
  FormSystem,
  {
    pressure: [number, number];
    temperature: [number, number];
    depth: [number, number];
  }
> = {
  field: {
    pressure: [14.7, 30000],
    temperature: [-40, 700],
    depth: [0, 40000],
  },
  metric: { pressure: [1, 2000], temperature: [-40, 370], depth: [0, 12000] },
};

/** Barometric pressures a laboratory can state, in the form's absolute unit (sea level to high altitude). */
const BAROMETRIC_LIMITS: Record<FormSystem, [number, number]> = {
  field: [7, 16],
  metric: [0.5, 1.1],
};

/** Multi-line notes: line breaks allowed, other control characters refused (app/utils/labels.ts). */
function notesText(label: string, max: number) {
  return multilineTextSchema(label)
    .trim()
    .max(max, `Use at most ${max} characters.`)
    .optional()
    .default("");
}

function optionalNumber(label: string, range: [number, number], unit = "") {
  const suffix = unit ? ` ${unit}` : "";
  return z
    .string()
    .trim()
    .optional()
    .default("")
    .superRefine((value, ctx) => {
      if (value === "") return;
      const n = Number(value);
      if (
        !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(value) ||
        !Number.isFinite(n)
      ) {
        ctx.addIssue({
          code: "custom",
          message: `Enter the ${label} as a plain number (for example 1234.5), or leave it empty.`,
        });
      } else if (n < range[0] || n > range[1]) {
        ctx.addIssue({
          code: "custom",
          message: `The ${label} should lie between ${range[0]} and ${range[1]}${suffix}.`,
        });
      }
    })
    .transform((value) => (value === "" ? null : Number(value)));
}

export function sampleFormSchema(system: FormSystem) {
  const units = formUnits(system);
  const limits = LIMITS[system];
  return z.object({
    fieldName: labelSchema("field name", 120, true),
    fieldRegion: labelSchema("region", 120, false),
    wellName: labelSchema("well name", 120, true),
    label: labelSchema("sample label", 120, true),
    sampleType: z.enum(SAMPLE_TYPES, { error: "Choose the sample type." }),
    samplingDate: z
      .string()
      .trim()
      .optional()
      .default("")
      .refine(
        (v) =>
          v === "" ||
          (/^\d{4}-\d{2}-\d{2}$/.test(v) &&
            !Number.isNaN(Date.parse(`${v}T00:00:00Z`))),
        {
          message: "Enter the sampling date as YYYY-MM-DD.",
        },
      ),
    samplingDepth: optionalNumber("sampling depth", limits.depth, units.depth),
    reservoirPressure: optionalNumber(
      "reservoir pressure",
      limits.pressure,
      units.pressure,
    ),
    reservoirTemperature: optionalNumber(
      "reservoir temperature",
      limits.temperature,
      units.temperature,
    ),
    stockTankApi: optionalNumber("stock-tank oil gravity", [5, 80], "°API"),
    gasSpecificGravity: optionalNumber(
      "gas specific gravity",
      [0.55, 2.5],
      "(air = 1)",
    ),
    standardConditions: z
      .string()
      .min(1, "Choose the standard conditions of the report."),
    barometricPressure: optionalNumber(
      "barometric pressure",
      BAROMETRIC_LIMITS[system],
      units.pressure,
    ),
    laboratory: labelSchema("laboratory", 160, false),
    reportReference: labelSchema("report reference", 160, false),
    notes: notesText("notes", 4000),
  });
}

export type SampleFormValues = z.output<ReturnType<typeof sampleFormSchema>>;

/** Values to show in the form (already in the form's units). */
export type SampleFormDefaults = Partial<
  Record<keyof SampleFormValues, string>
>;

const inputClass =
  "mt-1 block w-full rounded border border-line bg-panel px-3 py-2 text-sm focus:border-accent focus:outline-2 focus:outline-accent/30 aria-invalid:border-danger";

function SelectField({
  label,
  name,
  errors,
  defaultValue,
  children,
  hint,
}: {
  label: string;
  name: string;
  errors?: string[];
  defaultValue?: string;
  children: React.ReactNode;
  hint?: string;
}) {
  const id = useId();
  const describedBy =
    [hint ? `${id}-hint` : null, errors?.length ? `${id}-error` : null]
      .filter(Boolean)
      .join(" ") || undefined;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold">
        {label}
      </label>
      <select
        id={id}
        name={name}
        defaultValue={defaultValue}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={describedBy}
        className={inputClass}
      >
        {children}
      </select>
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-muted">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${id}-error`} errors={errors} />
    </div>
  );
}

export function SampleFormFields({
  system,
  errors,
  defaults,
  fieldNames,
  wellNames,
  currentStandard,
}: {
  system: FormSystem;
  errors: FieldErrors;
  defaults: SampleFormDefaults;
  fieldNames: string[];
  wellNames: string[];
  /** On edit: the recorded standard conditions when they match no preset. */
  currentStandard?: { label: string } | null;
}) {
  const units = formUnits(system);
  const notesId = useId();
  return (
    <div className="space-y-6">
      <fieldset className="rounded-lg border border-line bg-panel p-5">
        <legend className="px-1 font-semibold">
          Where the sample comes from
        </legend>
        <p className="text-sm text-ink-muted">
          Type an existing field or well, or a new name to create it.
        </p>
        <div className="mt-3 grid gap-4 sm:grid-cols-3">
          <TextField
            label="Field"
            name="fieldName"
            list="field-names"
            required
            defaultValue={defaults.fieldName}
            errors={errors.fieldName}
            autoComplete="off"
          />
          <TextField
            label="Region (for a new field)"
            name="fieldRegion"
            defaultValue={defaults.fieldRegion}
            errors={errors.fieldRegion}
            hint="Optional; kept only when the field is created."
          />
          <TextField
            label="Well"
            name="wellName"
            list="well-names"
            required
            defaultValue={defaults.wellName}
            errors={errors.wellName}
            autoComplete="off"
          />
        </div>
        <datalist id="field-names">
          {fieldNames.map((n) => (
            <option key={n} value={n} />
          ))}
        </datalist>
        <datalist id="well-names">
          {wellNames.map((n) => (
            <option key={n} value={n} />
          ))}
        </datalist>
      </fieldset>

      <fieldset className="rounded-lg border border-line bg-panel p-5">
        <legend className="px-1 font-semibold">Sample</legend>
        <div className="grid gap-4 sm:grid-cols-3">
          <TextField
            label="Sample label"
            name="label"
            required
            defaultValue={defaults.label}
            errors={errors.label}
          />
          <SelectField
            label="Sample type"
            name="sampleType"
            defaultValue={defaults.sampleType ?? "bottomhole"}
            errors={errors.sampleType}
          >
            {SAMPLE_TYPES.map((t) => (
              <option key={t} value={t}>
                {SAMPLE_TYPE_LABELS[t]}
              </option>
            ))}
          </SelectField>
          <TextField
            label="Sampling date"
            name="samplingDate"
            type="date"
            defaultValue={defaults.samplingDate}
            errors={errors.samplingDate}
          />
          <TextField
            label={`Sampling depth (${units.depth})`}
            name="samplingDepth"
            inputMode="decimal"
            defaultValue={defaults.samplingDepth}
            errors={errors.samplingDepth}
          />
          <TextField
            label={`Reservoir pressure at sampling (${units.pressure})`}
            name="reservoirPressure"
            inputMode="decimal"
            defaultValue={defaults.reservoirPressure}
            errors={errors.reservoirPressure}
          />
          <TextField
            label={`Reservoir temperature at sampling (${units.temperature})`}
            name="reservoirTemperature"
            inputMode="decimal"
            defaultValue={defaults.reservoirTemperature}
            errors={errors.reservoirTemperature}
          />
          <TextField
            label="Stock-tank oil gravity (°API)"
            name="stockTankApi"
            inputMode="decimal"
            defaultValue={defaults.stockTankApi}
            errors={errors.stockTankApi}
            hint="Used by the correlation and density checks."
          />
          <TextField
            label="Gas specific gravity (air = 1)"
            name="gasSpecificGravity"
            inputMode="decimal"
            defaultValue={defaults.gasSpecificGravity}
            errors={errors.gasSpecificGravity}
            hint="Used by the correlation and density checks."
          />
          <SelectField
            label="Standard conditions of the report"
            name="standardConditions"
            defaultValue={
              defaults.standardConditions ?? STANDARD_CONDITIONS_PRESETS[0]!.id
            }
            errors={errors.standardConditions}
            hint="The base of the gas volumes (Rs, Bg) in the report."
          >
            {currentStandard ? (
              <option value="current">
                {currentStandard.label} (as recorded)
              </option>
            ) : null}
            {STANDARD_CONDITIONS_PRESETS.map((p) => (
              <option key={p.id} value={p.id}>
                {p.label}
              </option>
            ))}
          </SelectField>
          <TextField
            label={`Barometric pressure of the report (${units.pressure})`}
            name="barometricPressure"
            inputMode="decimal"
            defaultValue={defaults.barometricPressure}
            errors={errors.barometricPressure}
            hint={`Makes the report's gauge pressures (psig, barg) absolute. Empty: one atmosphere, ${units.pressure === "psia" ? "14.696 psia" : "1.01325 bara"}.`}
          />
        </div>
        <p className="mt-3 text-sm text-ink-muted">
          Bubble-point pressures are part of each uploaded revision (one per
          measured temperature), so they travel with the measured grids.
        </p>
      </fieldset>

      <fieldset className="rounded-lg border border-line bg-panel p-5">
        <legend className="px-1 font-semibold">Report</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            label="Laboratory"
            name="laboratory"
            defaultValue={defaults.laboratory}
            errors={errors.laboratory}
          />
          <TextField
            label="Report reference"
            name="reportReference"
            defaultValue={defaults.reportReference}
            errors={errors.reportReference}
          />
        </div>
        <div className="mt-4">
          <label htmlFor={notesId} className="block text-sm font-semibold">
            Notes
          </label>
          <textarea
            id={notesId}
            name="notes"
            rows={3}
            defaultValue={defaults.notes}
            aria-invalid={errors.notes?.length ? true : undefined}
            aria-describedby={
              errors.notes?.length ? `${notesId}-error` : undefined
            }
            className={inputClass}
          />
          <FieldError id={`${notesId}-error`} errors={errors.notes} />
        </div>
      </fieldset>
    </div>
  );
}
