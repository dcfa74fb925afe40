/**
 * Writes the example upload files in this folder. Run from the repository root:
 *
 *   npx tsx reference-data/examples/make-examples.ts
 *
 * Every number is INVENTED: generated from published correlations (app/core/properties, generateSample)
 * for invented fluids, rounded to laboratory precision. The script checks that each file reads back through
 * parseUpload and gives the QC outcome its name promises, and stops with an error otherwise.
 */
import { writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import {
  datasetFromCanonicalGrids,
  layoutSheets,
  parseUpload,
  qcStatus,
  runQc,
  toCsv,
  toXlsx,
  type CanonicalGridInput,
  type ParsedDataset,
  type QcMeta,
} from "../../app/core/lab-data";
import { createSampleModel, generateSample, type FluidDescription } from "../../app/core/properties/generate-sample";
import {
  fromCanonical,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  toCanonical,
  type PropertyKey,
  type Quantity,
  type UnitId,
} from "../../app/core/units";

const here = dirname(fileURLToPath(import.meta.url));

/** Significant digits a laboratory would report. */
const DIGITS: Readonly<Record<PropertyKey, number>> = {
  oil_fvf: 4,
  solution_gor: 3,
  oil_viscosity: 3,
  oil_density: 4,
  gas_fvf: 4,
  gas_viscosity: 3,
  z_factor: 3,
};

type Units = { readonly pressure: string; readonly temperature: string } & { readonly [K in PropertyKey]: string };

interface Example {
  readonly fluid: FluidDescription;
  readonly units: Units;
  /** Axes in display units. */
  readonly temperatures: readonly number[];
  readonly pressures: readonly number[];
  /** Digits of the bubble point in display units (0 = whole numbers). */
  readonly bubbleDecimals: number;
}

function round(value: number, digits: number): number {
  return Number(value.toPrecision(digits));
}

function display(value: number, quantity: Quantity, unit: string): number {
  return fromCanonical(value, quantity, unit as UnitId<Quantity>);
}

function canonical(value: number, quantity: Quantity, unit: string): number {
  return toCanonical(value, quantity, unit as UnitId<Quantity>);
}

/** Build an invented dataset: axes and values rounded in the display units, stored canonical. */
function makeDataset(example: Example): { dataset: ParsedDataset; meta: QcMeta } {
  const { fluid, units } = example;
  const model = createSampleModel(fluid);
  const temperatures = example.temperatures.map((t) => canonical(t, "temperature", units.temperature));
  const pbShown = temperatures.map((t) => {
    const shown = display(model.bubblePoint(t), "pressure", units.pressure);
    return Number(shown.toFixed(example.bubbleDecimals));
  });
  const pressuresShown = [...new Set([...example.pressures, ...pbShown])].sort((a, b) => a - b);
  const pressures = pressuresShown.map((p) => canonical(p, "pressure", units.pressure));
  const sample = generateSample({ ...fluid, temperatures, pressures });
  const properties: { [K in PropertyKey]?: CanonicalGridInput } = {};
  for (const key of PROPERTY_KEYS) {
    const quantity = PROPERTY_QUANTITIES[key];
    const unit = units[key];
    properties[key] = {
      pressures,
      temperatures,
      values: sample.grids[key].values.map((row) =>
        row.map((v) => (v === null ? null : canonical(round(display(v, quantity, unit), DIGITS[key]), quantity, unit))),
      ),
      displayUnit: unit,
      pressureUnit: units.pressure,
      temperatureUnit: units.temperature,
    };
  }
  const dataset = datasetFromCanonicalGrids({
    properties,
    bubblePoints: temperatures.map((t, j) => ({ temperature: t, pressure: canonical(pbShown[j] ?? 0, "pressure", units.pressure) })),
  });
  return { dataset, meta: { apiGravity: fluid.apiGravity, gasGravity: fluid.gasGravity } };
}

const FIELD: Units = {
  pressure: "psia",
  temperature: "degF",
  oil_fvf: "rb/STB",
  solution_gor: "scf/STB",
  oil_viscosity: "cP",
  oil_density: "lb/ft3",
  gas_fvf: "rb/Mscf",
  gas_viscosity: "cP",
  z_factor: "-",
};

const METRIC: Units = {
  pressure: "bara",
  temperature: "degC",
  oil_fvf: "rm3/sm3",
  solution_gor: "sm3/sm3",
  oil_viscosity: "mPa.s",
  oil_density: "kg/m3",
  gas_fvf: "rm3/sm3",
  gas_viscosity: "mPa.s",
  z_factor: "-",
};

// Invented fluids.
const FIELD_EXAMPLE: Example = {
  fluid: { apiGravity: 38, gasGravity: 0.8, bubblePoint: 2850, bubblePointTemperature: 210 },
  units: FIELD,
  temperatures: [170, 210],
  pressures: [15, 300, 600, 1000, 1500, 2000, 2500, 3500, 4500, 5500],
  bubbleDecimals: 0,
};

const METRIC_EXAMPLE: Example = {
  fluid: { apiGravity: 32, gasGravity: 0.72, bubblePoint: toCanonical(180, "pressure", "bara"), bubblePointTemperature: toCanonical(95, "temperature", "degC") },
  units: METRIC,
  temperatures: [75, 95],
  pressures: [1.01325, 20, 40, 70, 100, 130, 160, 220, 280, 350],
  bubbleDecimals: 1,
};

function comments(extra: readonly string[]): string[] {
  return [
    "Isopleth example upload. The numbers are INVENTED (from published correlations for an invented fluid), not measurements.",
    ...extra,
  ];
}

async function check(name: string, bytes: Uint8Array, meta: QcMeta, expected: "pass" | "warn" | "fail" | "refused"): Promise<void> {
  const outcome = await parseUpload({ filename: name, bytes });
  if (expected === "refused") {
    if (outcome.ok) throw new Error(`${name}: expected the upload to be refused`);
    return;
  }
  if (!outcome.ok) throw new Error(`${name}: ${outcome.errors.map((e) => e.message).join("\n")}`);
  const status = qcStatus(runQc(outcome.dataset, meta));
  if (status !== expected) throw new Error(`${name}: QC status ${status}, expected ${expected}`);
}

/**
 * Set every entry's modification time in a ZIP archive to 1980-01-01 00:00 so that running the script twice
 * writes identical workbooks (the archive library stamps the current time). CRCs do not cover these fields.
 */
function fixZipTimes(bytes: Uint8Array): Uint8Array {
  const out = Uint8Array.from(bytes);
  const view = new DataView(out.buffer);
  const DOS_DATE_1980_01_01 = (0 << 9) | (1 << 5) | 1;
  let eocd = out.length - 22;
  while (eocd >= 0 && view.getUint32(eocd, true) !== 0x06054b50) eocd--;
  if (eocd < 0) throw new Error("not a ZIP archive");
  const entries = view.getUint16(eocd + 10, true);
  let at = view.getUint32(eocd + 16, true);
  for (let n = 0; n < entries; n++) {
    if (view.getUint32(at, true) !== 0x02014b50) throw new Error("damaged ZIP directory");
    view.setUint16(at + 12, 0, true);
    view.setUint16(at + 14, DOS_DATE_1980_01_01, true);
    const local = view.getUint32(at + 42, true);
    if (view.getUint32(local, true) !== 0x04034b50) throw new Error("damaged ZIP entry");
    view.setUint16(local + 10, 0, true);
    view.setUint16(local + 12, DOS_DATE_1980_01_01, true);
    at += 46 + view.getUint16(at + 28, true) + view.getUint16(at + 30, true) + view.getUint16(at + 32, true);
  }
  return out;
}

async function write(name: string, bytes: Uint8Array | string, meta: QcMeta, expected: "pass" | "warn" | "fail" | "refused"): Promise<void> {
  const data = typeof bytes === "string" ? new TextEncoder().encode(bytes) : fixZipTimes(bytes);
  await check(name, data, meta, expected);
  writeFileSync(join(here, name), data);
  console.log(`wrote ${name} (${expected})`);
}

async function main(): Promise<void> {
  const field = makeDataset(FIELD_EXAMPLE);
  const metric = makeDataset(METRIC_EXAMPLE);

  // 1. Long layout, field units, comma-separated.
  const longRows = layoutSheets(field.dataset, "long", {
    comments: comments(["Fluid: 38 API stock-tank oil, gas gravity 0.80, bubble point 2850 psia at 210 degF."]),
  }, true)[0]?.rows ?? [];
  await write("lab-results-long.csv", toCsv(longRows), field.meta, "pass");
  await write("lab-results-long.xlsx", await toXlsx(layoutSheets(field.dataset, "long", { unitLabels: "symbols", comments: comments([]) })), field.meta, "pass");

  // 2. Grid layout, metric units, semicolon-separated with decimal commas (as many European exports are).
  const gridRows = layoutSheets(metric.dataset, "grid", {
    unitLabels: "symbols",
    comments: comments(["Fluid: 32 °API stock-tank oil, gas gravity 0.72, bubble point 180 bara at 95 °C."]),
  }, true)[0]?.rows ?? [];
  await write("lab-results-grid.csv", `\uFEFF${toCsv(gridRows, { delimiter: ";", decimalMark: "," })}`, metric.meta, "pass");
  await write("lab-results-grid.xlsx", await toXlsx(layoutSheets(metric.dataset, "grid", { unitLabels: "symbols", comments: comments([]) })), metric.meta, "pass");

  // 3. The field example with two deliberate faults, to show QC findings in the preview: Bo at 2000 psia
  //    (210 °F) with two digits transposed (an error: Bo falls below the bubble point), and the oil viscosity
  //    at 1500 psia (170 °F) misread by +15 % (a warning: it stands off the smooth curve).
  const faulty = structuredClone(field.dataset) as ParsedDataset;
  const bo = faulty.properties.oil_fvf;
  const mu = faulty.properties.oil_viscosity;
  if (!bo || !mu) throw new Error("missing grids");
  const i2000 = bo.pressures.indexOf(canonical(2000, "pressure", "psia"));
  const i1500 = mu.pressures.indexOf(canonical(1500, "pressure", "psia"));
  const boRow = (bo.values as (number | null)[][])[i2000] as (number | null)[];
  const digits = String(boRow[1]); // e.g. "1.322" → "1.232"
  boRow[1] = Number(`${digits.slice(0, 2)}${digits[3]}${digits[2]}${digits.slice(4)}`);
  const muRow = (mu.values as (number | null)[][])[i1500] as (number | null)[];
  muRow[0] = round((muRow[0] ?? 0) * 1.15, 3);
  const faultyRows = layoutSheets(faulty, "long", {
    comments: comments(["Two deliberate faults for the QC demonstration: Bo at 2000 psia and 210 degF has two digits transposed; the oil viscosity at 1500 psia and 170 degF is misread."]),
  }, true)[0]?.rows ?? [];
  await write("lab-results-with-qc-findings.csv", toCsv(faultyRows), field.meta, "fail");

  // 4. A file the upload refuses: pressure unit "psi" (absolute or gauge?) and a placeholder instead of a number.
  const refused = toCsv(longRows)
    .replace("pressure (psia),", "pressure (psi),")
    .replace(/(\r\n1000,170,,)[^,]*,/, "$1n/a,");
  await write("refused-ambiguous-unit.csv", refused, field.meta, "refused");
}

await main();
