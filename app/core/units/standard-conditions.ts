/**
 * Standard (reference) conditions are data, not constants: every dataset states the pressure and temperature
 * its "standard" gas and oil volumes refer to. Values here are in canonical units (psia, °F).
 *
 * Presets:
 *  - field: 60 °F and 14.696 psia (oilfield customary; SPE/API practice);
 *  - metric: 15 °C and 101.325 kPa (ISO 13443);
 *  - two US gas-measurement bases at 60 °F (14.65 and 14.73 psia) and a 0 °C "normal" base.
 * Any other base can be made with defineStandardConditions().
 *
 * Changing the reference conditions of a gas volume uses the ideal-gas law (at standard conditions z ≈ 1):
 *   V₂ = V₁ · (p₁/p₂) · (T₂/T₁)   (absolute p and T).
 * The oil-volume reference shift (60 °F vs 15 °C stock-tank oil) is neglected, as is usual.
 */
import { formatPlain } from "../format";
import { RANKINE_OFFSET } from "./definitions";
import { UnitError } from "./errors";
import { toCanonical, type UnitId } from "./catalogue";

/** The two numbers of a base: absolute pressure (psia) and temperature (°F). A sample records these. */
export type ReferenceConditions = {
  readonly pressurePsia: number;
  readonly temperatureF: number;
};

export interface StandardConditions {
  readonly id: string;
  readonly label: string;
  /** Absolute pressure, psia. */
  readonly pressurePsia: number;
  /** Temperature, °F. */
  readonly temperatureF: number;
}

export const FIELD_STANDARD_CONDITIONS: StandardConditions = Object.freeze({
  id: "field_60f_14.696psia",
  label: "60 °F, 14.696 psia",
  pressurePsia: 14.696,
  temperatureF: 60,
});

export const METRIC_STANDARD_CONDITIONS: StandardConditions = Object.freeze({
  id: "metric_15c_101.325kpa",
  label: "15 °C, 101.325 kPa",
  pressurePsia: toCanonical(101.325, "pressure", "kPa"),
  temperatureF: toCanonical(15, "temperature", "degC"),
});

export const STANDARD_CONDITIONS_PRESETS: readonly StandardConditions[] =
  Object.freeze([
    FIELD_STANDARD_CONDITIONS,
    METRIC_STANDARD_CONDITIONS,
    Object.freeze({
      id: "us_gas_60f_14.65psia",
      label: "60 °F, 14.65 psia",
      pressurePsia: 14.65,
      temperatureF: 60,
    }),
    Object.freeze({
      id: "us_gas_60f_14.73psia",
      label: "60 °F, 14.73 psia",
      pressurePsia: 14.73,
      temperatureF: 60,
    }),
    Object.freeze({
      id: "normal_0c_101.325kpa",
      label: "0 °C, 101.325 kPa",
      pressurePsia: toCanonical(101.325, "pressure", "kPa"),
      temperatureF: 32,
    }),
  ]);

/** Build a dataset's standard conditions from values in any catalogue units (validated). */
export function defineStandardConditions(input: {
  id: string;
  label?: string;
  pressure: { value: number; unit: UnitId<"pressure"> };
  temperature: { value: number; unit: UnitId<"temperature"> };
}): StandardConditions {
  if (input.pressure.unit.endsWith("g")) {
    throw new UnitError(
      "INVALID_STANDARD_CONDITIONS",
      `Standard pressure must be given as an absolute pressure, got unit ${input.pressure.unit}.`,
      { unit: input.pressure.unit },
    );
  }
  const pressurePsia = toCanonical(
    input.pressure.value,
    "pressure",
    input.pressure.unit,
  );
  const temperatureF = toCanonical(
    input.temperature.value,
    "temperature",
    input.temperature.unit,
  );
  assertStandardConditions({
    id: input.id,
    label: "",
    pressurePsia,
    temperatureF,
  });
  return Object.freeze({
    id: input.id,
    label:
      input.label ??
      `${input.temperature.value} ${input.temperature.unit}, ${input.pressure.value} ${input.pressure.unit}`,
    pressurePsia,
    temperatureF,
  });
}

export function assertStandardConditions(
  sc: ReferenceConditions & { readonly id?: string; readonly label?: string },
): void {
  if (!Number.isFinite(sc.pressurePsia) || sc.pressurePsia <= 0) {
    throw new UnitError(
      "INVALID_STANDARD_CONDITIONS",
      `Standard pressure must be > 0 psia, got ${sc.pressurePsia}.`,
      {
        id: sc.id,
      },
    );
  }
  if (!Number.isFinite(sc.temperatureF) || sc.temperatureF <= -RANKINE_OFFSET) {
    throw new UnitError(
      "INVALID_STANDARD_CONDITIONS",
      `Standard temperature must be above absolute zero, got ${sc.temperatureF} °F.`,
      { id: sc.id },
    );
  }
}

/**
 * Factor converting a gas volume measured at `from` standard conditions into the same gas at `to`
 * conditions (ideal gas): V_to = V_from × factor.
 */
export function gasVolumeRebaseFactor(
  from: ReferenceConditions,
  to: ReferenceConditions,
): number {
  assertStandardConditions(from);
  assertStandardConditions(to);
  return (
    ((from.pressurePsia / to.pressurePsia) *
      (to.temperatureF + RANKINE_OFFSET)) /
    (from.temperatureF + RANKINE_OFFSET)
  );
}

/**
 * Re-express a value whose gas volume is at standard conditions `from` on the basis `to`, without changing
 * its unit: a gas–oil ratio (gas standard volume in the numerator) scales by the factor, a gas formation
 * volume factor (gas standard volume in the denominator) by its inverse.
 */
export function rebaseStandardVolume(
  value: number,
  quantity: "gas_oil_ratio" | "gas_fvf",
  from: ReferenceConditions,
  to: ReferenceConditions,
): number {
  if (!Number.isFinite(value)) {
    throw new UnitError(
      "NOT_FINITE",
      `Value must be a finite number, got ${String(value)}.`,
      { value },
    );
  }
  const f = gasVolumeRebaseFactor(from, to);
  return quantity === "gas_oil_ratio" ? value * f : value / f;
}

/** The preset a recorded base matches (within 0.001 psi and 0.001 °F), if any. */
export function standardConditionsPreset(
  sc: ReferenceConditions,
): StandardConditions | undefined {
  return STANDARD_CONDITIONS_PRESETS.find(
    (p) =>
      Math.abs(p.pressurePsia - sc.pressurePsia) < 1e-3 &&
      Math.abs(p.temperatureF - sc.temperatureF) < 1e-3,
  );
}

/** How a base is named to people: its preset's label ("15 °C, 101.325 kPa"), else "60 °F, 14.5 psia". */
export function standardConditionsLabel(sc: ReferenceConditions): string {
  return (
    standardConditionsPreset(sc)?.label ??
    `${formatPlain(sc.temperatureF)} °F, ${formatPlain(sc.pressurePsia)} psia`
  );
}
