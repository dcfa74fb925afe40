/**
 * Merge what the layout readers found into a ParsedDataset: one grid per property (canonical units,
 * sorted axes), bubble points per temperature; reports properties given twice, conflicting bubble points,
 * and columns without values.
 */
import {
  CANONICAL_UNITS,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  type PropertyKey,
} from "../units";
import { quote, type FindingList, type Place } from "./findings";
import { HEADER_LABELS } from "./header-names";
import { describeShort } from "./parse-grid";
import type {
  BubbleRecord,
  PointRecord,
  PropertyRecord,
  SheetResult,
} from "./sheet-context";
import type { BubblePoint, CellSource, PropertyGrid } from "./types";

function placeOf(source: CellSource): Place {
  return {
    ...(source.sheet !== undefined ? { sheet: source.sheet } : {}),
    row: source.row,
    column: source.column,
  };
}

function buildGrid(
  record: PropertyRecord,
  points: readonly PointRecord[],
): PropertyGrid {
  const pressures = [...new Set(points.map((p) => p.pressure))].sort(
    (a, b) => a - b,
  );
  const temperatures = [...new Set(points.map((p) => p.temperature))].sort(
    (a, b) => a - b,
  );
  const pIndex = new Map(pressures.map((p, i) => [p, i]));
  const tIndex = new Map(temperatures.map((t, j) => [t, j]));
  const values: (number | null)[][] = pressures.map(() =>
    temperatures.map(() => null),
  );
  const sources: (CellSource | null)[][] = pressures.map(() =>
    temperatures.map(() => null),
  );
  for (const point of points) {
    const i = pIndex.get(point.pressure);
    const j = tIndex.get(point.temperature);
    if (i === undefined || j === undefined) continue;
    const row = values[i];
    const sourceRow = sources[i];
    if (row && sourceRow) {
      row[j] = point.value;
      sourceRow[j] = point.source;
    }
  }
  return {
    property: record.property,
    unit: record.unit,
    canonicalUnit: CANONICAL_UNITS[PROPERTY_QUANTITIES[record.property]],
    pressureUnit: record.pressureUnit,
    temperatureUnit: record.temperatureUnit,
    pressures,
    temperatures,
    values,
    sources,
  };
}

/** Most distinct pressures, temperatures and cells one property grid may have (far above any laboratory table). */
const MAX_GRID_PRESSURES = 5_000;
const MAX_GRID_TEMPERATURES = 500;
const MAX_GRID_CELLS = 200_000;

interface Assembled {
  readonly properties: { [K in PropertyKey]?: PropertyGrid };
  readonly bubblePoints: BubblePoint[];
}

export function assemble(
  results: readonly SheetResult[],
  findings: FindingList,
): Assembled {
  const records = new Map<PropertyKey, PropertyRecord>();
  for (const result of results) {
    for (const record of result.properties) {
      const previous = records.get(record.property);
      if (previous) {
        findings.error(
          "DUPLICATE_PROPERTY",
          record.place,
          `the ${HEADER_LABELS[record.property]} ${quote(record.headerText)} is given a second time (first at ${describeShort(previous.place)}); give each property once.`,
          record.headerText,
        );
        continue;
      }
      records.set(record.property, record);
    }
  }

  const points = new Map<PropertyKey, PointRecord[]>();
  for (const result of results) {
    for (const point of result.points) {
      const list = points.get(point.property) ?? [];
      list.push(point);
      points.set(point.property, list);
    }
  }

  const properties: { [K in PropertyKey]?: PropertyGrid } = {};
  for (const key of PROPERTY_KEYS) {
    const record = records.get(key);
    if (!record) continue;
    const list = points.get(key) ?? [];
    if (list.length === 0) {
      findings.warn(
        "EMPTY_COLUMN",
        record.place,
        `the ${HEADER_LABELS[key]} ${quote(record.headerText)} has no values and was left out.`,
        record.headerText,
      );
      continue;
    }
    const np = new Set(list.map((p) => p.pressure)).size;
    const nt = new Set(list.map((p) => p.temperature)).size;
    if (
      np > MAX_GRID_PRESSURES ||
      nt > MAX_GRID_TEMPERATURES ||
      np * nt > MAX_GRID_CELLS
    ) {
      findings.error(
        "GRID_TOO_LARGE",
        record.place,
        `the ${HEADER_LABELS[key]} ${quote(record.headerText)} has ${np} distinct pressures and ${nt} distinct temperatures, more than one sample's table can hold (at most ${MAX_GRID_PRESSURES} pressures, ${MAX_GRID_TEMPERATURES} temperatures and ${MAX_GRID_CELLS} cells); check that pressure and temperature are in the right columns.`,
        record.headerText,
      );
      continue;
    }
    properties[key] = buildGrid(record, list);
  }

  // Bubble points: one per temperature; repeated statements must agree.
  const byTemperature = new Map<number, BubbleRecord>();
  for (const result of results) {
    for (const bubble of result.bubblePoints) {
      const previous = byTemperature.get(bubble.temperature);
      if (!previous) {
        byTemperature.set(bubble.temperature, bubble);
        continue;
      }
      if (
        Math.abs(previous.pressure - bubble.pressure) >
        1e-9 * previous.pressure
      ) {
        findings.error(
          "CONFLICTING_BUBBLE_POINT",
          placeOf(bubble.source),
          `the bubble point ${quote(bubble.text)} disagrees with ${quote(previous.text)} given for the same temperature at ${describeShort(placeOf(previous.source))}; state one bubble point per temperature.`,
          bubble.text,
        );
      }
    }
  }
  const allTemperatures = new Set<number>();
  for (const grid of Object.values(properties))
    for (const t of grid.temperatures) allTemperatures.add(t);
  const bubblePoints: BubblePoint[] = [...byTemperature.values()]
    .sort((a, b) => a.temperature - b.temperature)
    .map((b) => ({
      temperature: b.temperature,
      pressure: b.pressure,
      source: b.source,
    }));
  for (const b of byTemperature.values()) {
    if (
      !allTemperatures.has(b.temperature) &&
      Object.keys(properties).length > 0
    ) {
      findings.info(
        "BUBBLE_POINT_WITHOUT_DATA",
        placeOf(b.source),
        `the bubble point ${quote(b.text)} is stated for a temperature at which no property was measured; it is kept with the sample.`,
        b.text,
      );
    }
  }
  return { properties, bubblePoints };
}
