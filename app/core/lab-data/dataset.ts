/**
 * Build a ParsedDataset from plain grids already in canonical units — for datasets read back from the
 * database, generated in code, or written in tests — so that runQc and the writers can use them.
 */
import {
  CANONICAL_UNITS,
  getUnit,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  type PropertyKey,
  type Quantity,
} from "../units";
import { LabDataError } from "./errors";
import type {
  BubblePoint,
  ParsedDataset,
  PropertyGrid,
  UnitRef,
} from "./types";

export interface CanonicalGridInput {
  readonly pressures: readonly number[];
  readonly temperatures: readonly number[];
  readonly values: ReadonlyArray<ReadonlyArray<number | null>>;
  /** Catalogue unit id the values are shown in (default: canonical). The values stay canonical. */
  readonly displayUnit?: string;
  readonly pressureUnit?: string;
  readonly temperatureUnit?: string;
}

/** A UnitRef for a catalogue unit id; throws LabDataError UNKNOWN_UNIT for an id not in the catalogue. */
export function unitRef(quantity: Quantity, id: string): UnitRef {
  try {
    const def = getUnit(quantity, id);
    return { quantity, id: def.id, symbol: def.symbol, label: def.id };
  } catch {
    throw new LabDataError(
      "UNKNOWN_UNIT",
      `"${id}" is not a ${quantity} unit in the catalogue.`,
    );
  }
}

export function datasetFromCanonicalGrids(input: {
  readonly properties: { readonly [K in PropertyKey]?: CanonicalGridInput };
  readonly bubblePoints?: readonly BubblePoint[];
}): ParsedDataset {
  const properties: { [K in PropertyKey]?: PropertyGrid } = {};
  for (const key of PROPERTY_KEYS) {
    const g = input.properties[key];
    if (!g) continue;
    const quantity = PROPERTY_QUANTITIES[key];
    properties[key] = {
      property: key,
      unit: unitRef(quantity, g.displayUnit ?? CANONICAL_UNITS[quantity]),
      canonicalUnit: CANONICAL_UNITS[quantity],
      pressureUnit: unitRef("pressure", g.pressureUnit ?? "psia"),
      temperatureUnit: unitRef("temperature", g.temperatureUnit ?? "degF"),
      pressures: [...g.pressures],
      temperatures: [...g.temperatures],
      values: g.values.map((row) => [...row]),
    };
  }
  const bubblePoints = [...(input.bubblePoints ?? [])]
    .map((b) => ({ temperature: b.temperature, pressure: b.pressure }))
    .sort((a, b) => a.temperature - b.temperature);
  return { properties, bubblePoints };
}
