/**
 * Downloadable templates for both layouts. They hold a small INVENTED example — generated from published
 * correlations (app/core/properties, generateSample) and rounded to laboratory precision — so that the
 * layout is clear; a lab replaces the numbers with its measurements. Every template reads back through
 * parseUpload to the same grids (tested).
 */
import {
  createSampleModel,
  generateSample,
} from "../properties/generate-sample";
import { PROPERTY_KEYS, type PropertyKey } from "../units";
import { datasetFromCanonicalGrids, type CanonicalGridInput } from "./dataset";
import { LabDataError } from "./errors";
import type { Layout, ParsedDataset } from "./types";
import { layoutSheets, toCsv, toXlsx } from "./write-tables";
import { roundSignificant } from "../format";

/** Significant digits kept per property in the template, as a laboratory would report them. */
const DIGITS: Readonly<Record<PropertyKey, number>> = {
  oil_fvf: 4,
  solution_gor: 3,
  oil_viscosity: 3,
  oil_density: 4,
  gas_fvf: 4,
  gas_viscosity: 3,
  z_factor: 3,
};

const TEMPLATE_FLUID = {
  apiGravity: 35,
  gasGravity: 0.75,
  bubblePoint: 2500,
  bubblePointTemperature: 200,
} as const;

let cached: ParsedDataset | undefined;

/** The invented example the templates carry (canonical units; field units for display). */
export function templateDataset(): ParsedDataset {
  if (cached) return cached;
  const temperatures = [160, 200];
  const model = createSampleModel(TEMPLATE_FLUID);
  const pbs = temperatures.map((t) => Math.round(model.bubblePoint(t)));
  const pressures = [
    ...new Set([500, 1000, 1500, 2000, ...pbs, 3000, 4000, 5000]),
  ].sort((a, b) => a - b);
  const sample = generateSample({ ...TEMPLATE_FLUID, temperatures, pressures });
  const properties: { [K in PropertyKey]?: CanonicalGridInput } = {};
  for (const key of PROPERTY_KEYS) {
    const grid = sample.grids[key];
    properties[key] = {
      pressures,
      temperatures,
      values: grid.values.map((row) =>
        row.map((v) => (v === null ? null : roundSignificant(v, DIGITS[key]))),
      ),
      ...(key === "gas_fvf" ? { displayUnit: "ft3/scf" } : {}),
    };
  }
  // Gas FVF is shown in ft³/scf, as many reports do; round in that unit.
  const gas = properties.gas_fvf;
  if (gas) {
    const perBarrel = 5.614583333333333;
    properties.gas_fvf = {
      ...gas,
      values: sample.grids.gas_fvf.values.map((row) =>
        row.map((v) =>
          v === null
            ? null
            : roundSignificant(v * perBarrel, DIGITS.gas_fvf) / perBarrel,
        ),
      ),
    };
  }
  cached = datasetFromCanonicalGrids({
    properties,
    bubblePoints: temperatures.map((t, j) => ({
      temperature: t,
      pressure: pbs[j] ?? 0,
    })),
  });
  return cached;
}

// Written as bare comment lines: a note holding a comma or a quote would be quoted as one cell (app/core/csv) and
// no longer read as a comment, so the notes use neither (tested).
const NOTES: Readonly<Record<Layout, readonly string[]>> = {
  long: [
    "Isopleth upload template (long layout): one row per measurement. Lines starting with # are comments.",
    "The numbers below are INVENTED (from published correlations) and are not measurements: replace them with yours.",
    "Units go in brackets in each header. Leave a cell empty where nothing was measured.",
  ],
  grid: [
    "Isopleth upload template (grid layout): one block per property; a blank row between blocks.",
    "The numbers below are INVENTED (from published correlations) and are not measurements: replace them with yours.",
    "Block title row: property (unit); pressure (unit); temperature (unit). Next row: the temperatures. Then pressure and values.",
  ],
};

function checkLayout(layout: Layout): void {
  if (layout !== "long" && layout !== "grid") {
    throw new LabDataError(
      "UNKNOWN_LAYOUT",
      `Unknown layout "${String(layout)}": use "long" or "grid".`,
    );
  }
}

/** CSV template text (comma-separated, ASCII unit labels so that any spreadsheet program opens it cleanly). */
export function buildTemplateCsv(layout: Layout): string {
  checkLayout(layout);
  const sheets = layoutSheets(
    templateDataset(),
    layout,
    { comments: NOTES[layout] },
    true,
  );
  return toCsv(sheets[0]?.rows ?? []);
}

/** XLSX template bytes: the long layout on one sheet, the grid layout with one sheet per property. */
export async function buildTemplateXlsx(layout: Layout): Promise<Uint8Array> {
  checkLayout(layout);
  return toXlsx(
    layoutSheets(templateDataset(), layout, {
      comments: NOTES[layout],
      unitLabels: "symbols",
    }),
  );
}

/** Suggested download names. */
export function templateFileName(
  layout: Layout,
  format: "csv" | "xlsx",
): string {
  return `isopleth-template-${layout}.${format}`;
}
