/**
 * Inputs of heavy-work tests and of `npm run bench:heavy`. All numbers are INVENTED: fluids generated from
 * published correlations (app/core/properties, generateSample), never measurements.
 */
import {
  datasetFromCanonicalGrids,
  longLayoutRows,
  toCsv,
  type CanonicalGridInput,
} from "~/core/lab-data";
import { generateSample } from "~/core/properties";
import { PROPERTY_KEYS, type PropertyKey } from "~/core/units";

const FLUID = {
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  noise: 0.01,
  seed: 3,
} as const;

/** An invented sample on a grid of `pressureCount` pressures (500 psia upward, 25 psi apart) × 5 temperatures. */
export function inventedSample(pressureCount = 23) {
  const pressures = Array.from(
    { length: pressureCount },
    (_, i) => 500 + (pressureCount > 23 ? 25 : 250) * i,
  );
  return generateSample({
    ...FLUID,
    pressures,
    temperatures: [120, 150, 180, 210, 240],
  });
}

/** `n` conditions inside the invented sample's measured range (600–5400 psia, 150–240 °F), repeatable. */
export function inventedPoints(
  n: number,
  seed = 12345,
): { pressure: number; temperature: number }[] {
  let s = seed;
  const random = () => (s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  return Array.from({ length: n }, () => ({
    pressure: 600 + random() * 4800,
    temperature: 150 + random() * 90,
  }));
}

/** A long-layout CSV upload of the invented sample with `pressureCount` pressures (about 1 kB per 2 pressures). */
export function inventedUploadCsv(pressureCount: number): string {
  const sample = inventedSample(pressureCount);
  const properties: { [K in PropertyKey]?: CanonicalGridInput } = {};
  for (const key of PROPERTY_KEYS) {
    const grid = sample.grids[key];
    properties[key] = {
      pressures: grid.pressures,
      temperatures: grid.temperatures,
      values: grid.values.map((row) =>
        row.map((v) => (v === null ? null : Number(v.toPrecision(6)))),
      ),
    };
  }
  const dataset = datasetFromCanonicalGrids({
    properties,
    bubblePoints: sample.temperatures.map((t, j) => ({
      temperature: t,
      pressure: Number(sample.bubblePoints[j]!.toPrecision(5)),
    })),
  });
  return toCsv([
    [
      `# INVENTED example (generated from published correlations), ${pressureCount} pressures; not measurements.`,
    ],
    ...longLayoutRows(dataset),
  ]);
}
