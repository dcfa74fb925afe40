import {
  convertBetweenSystems,
  FIELD_UNIT_SYSTEM,
  METRIC_UNIT_SYSTEM,
  CANONICAL_UNIT_SYSTEM,
  getUnit,
  PROPERTY_QUANTITIES,
  type PropertyKey,
} from "~/core/units";

export type OutputSystem = "field" | "metric";
export const SYSTEMS = {
  field: FIELD_UNIT_SYSTEM,
  metric: METRIC_UNIT_SYSTEM,
} as const;

export function unitLabel(
  system: OutputSystem,
  quantity: "pressure" | "temperature" | PropertyKey,
): string {
  const q =
    quantity === "pressure" || quantity === "temperature"
      ? quantity
      : PROPERTY_QUANTITIES[quantity];
  const id = SYSTEMS[system].units[q];
  return getUnit(q, id as never).symbol;
}

export const toOutputPressure = (psia: number, system: OutputSystem) =>
  convertBetweenSystems(
    psia,
    "pressure",
    CANONICAL_UNIT_SYSTEM,
    SYSTEMS[system],
  );
export const toOutputTemperature = (degF: number, system: OutputSystem) =>
  convertBetweenSystems(
    degF,
    "temperature",
    CANONICAL_UNIT_SYSTEM,
    SYSTEMS[system],
  );
export const toOutputValue = (
  value: number,
  property: PropertyKey,
  system: OutputSystem,
) =>
  convertBetweenSystems(
    value,
    PROPERTY_QUANTITIES[property],
    CANONICAL_UNIT_SYSTEM,
    SYSTEMS[system],
  );
export const fromInputPressure = (value: number, system: OutputSystem) =>
  convertBetweenSystems(
    value,
    "pressure",
    SYSTEMS[system],
    CANONICAL_UNIT_SYSTEM,
  );
export const fromInputTemperature = (value: number, system: OutputSystem) =>
  convertBetweenSystems(
    value,
    "temperature",
    SYSTEMS[system],
    CANONICAL_UNIT_SYSTEM,
  );
