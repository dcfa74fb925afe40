// Reference tables whose true function is known, for calibrating and checking the engine's error estimate
// (used by scripts/calibrate-estimates.ts and calibration.test.ts; not part of the library).
//
// The tables are INVENTED: three made-up fluids evaluated with the published correlations of
// app/core/properties through its noise-free sample model (createSampleModel):
//   Rs, Bo below pb      Standing (1947), Bo in the 0.9759 + 0.00012 F^1.2 form
//   Bo above pb          Vasquez & Beggs (1980) undersaturated compressibility, Bob (pb/p)^A
//   µo                   Beggs & Robinson (1975) dead and live oil; above pb Vasquez & Beggs (1980)
//   ρo                   mass balance of stock-tank oil and dissolved gas
//   z                    Sutton (1985) pseudo-criticals with Dranchuk & Abou-Kassem (1975)
//   Bg                   (psc/Tsc) zT/p at 60 °F and 14.696 psia
//   µg                   Lee, Gonzalez & Eakin (1966)
// Node values are rounded as laboratories print them (Bo 4 decimals, Rs whole scf/STB, viscosity 3
// significant digits, …); the truth at the test points is the unrounded correlation.
import { createRandom } from "../properties/prng";
import { createSampleModel, type SamplePoint } from "../properties";
import type { PropertyKey } from "../units";
import { interpolateGridMany } from "./index";
import type { Grid, Options } from "./types";
import { WARNING_FLAGS } from "./warnings";

/** How a laboratory prints each property (canonical units: rb/STB, scf/STB, cP, lb/ft³, rb/scf). */
const LAB_ROUNDING: Readonly<
  Record<PropertyKey, { decimals?: number; significant?: number }>
> = {
  oil_fvf: { decimals: 4 },
  solution_gor: { decimals: 0 },
  oil_viscosity: { significant: 3 },
  oil_density: { decimals: 2 },
  z_factor: { decimals: 4 },
  gas_fvf: { significant: 4 },
  gas_viscosity: { decimals: 4 },
};

function roundAsLab(key: PropertyKey, v: number): number {
  const r = LAB_ROUNDING[key];
  if (r.decimals !== undefined) return Number(v.toFixed(r.decimals));
  return Number(v.toPrecision(r.significant));
}

/** Invented fluids (not measured data). */
const FLUIDS = [
  { name: "A 35 °API", apiGravity: 35, gasGravity: 0.75, rsb: 600 },
  { name: "B 28 °API", apiGravity: 28, gasGravity: 0.85, rsb: 350 },
  { name: "C 42 °API", apiGravity: 42, gasGravity: 0.7, rsb: 1000 },
] as const;

const PRESSURE_STEPS = [250, 500, 1000] as const;
const TEMPERATURE_LAYOUTS: readonly (readonly number[])[] = [
  [180],
  [150, 200, 250],
  [140, 180, 220, 260],
  [120, 150, 180, 210, 240],
];

export type TableKind = "with-bubble-points" | "one-branch" | "gas" | "kink";

type ReferenceTable = {
  label: string;
  kind: TableKind;
  key: PropertyKey;
  grid: Grid;
  /** Off-node test points inside the table and the true (unrounded) value at each. */
  pressures: Float64Array;
  temperatures: Float64Array;
  truth: Float64Array;
};

const OIL: readonly PropertyKey[] = [
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
  "oil_density",
];
const GAS: readonly PropertyKey[] = ["z_factor", "gas_fvf", "gas_viscosity"];

function axis(lo: number, hi: number, step: number): number[] {
  const out: number[] = [];
  for (let p = lo; p <= hi + 1e-9; p += step) out.push(p);
  return out;
}

/** Inserts the bubble point as a node (1-D lab tables list it), dropping a node closer than 10 % of a step. */
function withNode(ps: number[], pb: number, step: number): number[] {
  const kept = ps.filter((p) => Math.abs(p - pb) > 0.1 * step);
  kept.push(pb);
  return kept.sort((a, b) => a - b);
}

function gridOf(
  key: PropertyKey,
  ps: readonly number[],
  ts: readonly number[],
  at: (p: number, t: number) => SamplePoint,
  bubblePoints?: number[],
): Grid {
  const values = ps.map((p) => ts.map((t) => roundAsLab(key, at(p, t)[key])));
  const g: Grid = { pressures: [...ps], temperatures: [...ts], values };
  if (bubblePoints) g.bubblePoints = bubblePoints;
  return g;
}

/**
 * Every reference table, with `pointsPerTable` random off-node points each (seeded: the same seed gives
 * the same tables and points). Kinds: oil tables across pb with the bubble points given; oil tables on one
 * branch only (no bubble points); gas tables; and oil tables across pb without bubble points ("kink", where
 * the estimate is not claimed to hold).
 */
export function referenceTables(
  seed: number,
  pointsPerTable: number,
  options: { fluids?: number; layouts?: number } = {},
): ReferenceTable[] {
  const rnd = createRandom(seed);
  const out: ReferenceTable[] = [];
  const fluids = FLUIDS.slice(0, options.fluids ?? FLUIDS.length);
  const layouts = TEMPERATURE_LAYOUTS.slice(
    0,
    options.layouts ?? TEMPERATURE_LAYOUTS.length,
  );
  for (const fluid of fluids) {
    const model = createSampleModel(fluid);
    const cache = new Map<string, SamplePoint>();
    const at = (p: number, t: number): SamplePoint => {
      const k = `${p}|${t}`;
      let v = cache.get(k);
      if (!v) {
        v = model.evaluate(p, t);
        cache.set(k, v);
      }
      return v;
    };
    for (const ts of layouts) {
      const pbs = ts.map((t) => model.bubblePoint(t));
      const pbLo = Math.min(...pbs);
      const pbHi = Math.max(...pbs);
      for (const step of PRESSURE_STEPS) {
        const full = axis(400, 6000, step);
        const tag = `${fluid.name}, T ${ts.join("/")} °F, Δp ${step}`;
        const tables: {
          kind: TableKind;
          keys: readonly PropertyKey[];
          ps: number[];
          bubble: boolean;
          name: string;
        }[] = [];
        const across = ts.length === 1 ? withNode(full, pbs[0]!, step) : full;
        tables.push({
          kind: "with-bubble-points",
          keys: OIL,
          ps: across,
          bubble: true,
          name: "across pb",
        });
        tables.push({
          kind: "kink",
          keys: ["oil_fvf", "oil_viscosity"],
          ps: across,
          bubble: false,
          name: "across pb, no pb given",
        });
        const below = full.filter((p) => p < pbLo - 1);
        if (below.length >= 3)
          tables.push({
            kind: "one-branch",
            keys: OIL,
            ps: below,
            bubble: false,
            name: "saturated only",
          });
        const above = full.filter((p) => p > pbHi + 1);
        if (above.length >= 3)
          tables.push({
            kind: "one-branch",
            keys: ["oil_fvf", "oil_viscosity", "oil_density"],
            ps: above,
            bubble: false,
            name: "undersaturated only",
          });
        tables.push({
          kind: "gas",
          keys: GAS,
          ps: full,
          bubble: false,
          name: "gas",
        });
        for (const tb of tables) {
          const pLo = tb.ps[0]!;
          const pHi = tb.ps[tb.ps.length - 1]!;
          const tLo = ts[0]!;
          const tHi = ts[ts.length - 1]!;
          const n = pointsPerTable;
          const pressures = new Float64Array(n);
          const temperatures = new Float64Array(n);
          const truths: SamplePoint[] = [];
          for (let i = 0; i < n; i++) {
            pressures[i] = pLo + (pHi - pLo) * (0.001 + 0.998 * rnd.uniform());
            temperatures[i] =
              ts.length === 1
                ? tLo
                : tLo + (tHi - tLo) * (0.001 + 0.998 * rnd.uniform());
            truths.push(model.evaluate(pressures[i]!, temperatures[i]!));
          }
          for (const key of tb.keys) {
            out.push({
              label: `${key}: ${tb.name}; ${tag}`,
              kind: tb.kind,
              key,
              grid: gridOf(key, tb.ps, ts, at, tb.bubble ? pbs : undefined),
              pressures,
              temperatures,
              truth: Float64Array.from(truths, (s) => s[key]),
            });
          }
        }
      }
    }
  }
  return out;
}

export const CALIBRATION_METHODS: readonly {
  name: string;
  options: Options;
}[] = [
  { name: "linear", options: { method: "linear" } },
  { name: "newton 2", options: { method: "newton", degree: 2 } },
  { name: "newton 3", options: { method: "newton", degree: 3 } },
  { name: "newton 4", options: { method: "newton", degree: 4 } },
  { name: "pchip", options: { method: "pchip" } },
];

type CoverageRow = {
  method: string;
  points: number;
  /** Share of points with actual error ≤ estimate, and ≤ 3 × estimate. */
  within1: number;
  within3: number;
  /** median(estimate) / median(actual error). */
  sharpness: number;
  medianEstimate: number;
  medianActual: number;
  /** Points left out because they carry estimate-unavailable or estimate-unreliable. */
  flagged: number;
};

function median(xs: number[]): number {
  if (xs.length === 0) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  const h = s.length >> 1;
  return s.length % 2 ? s[h]! : (s[h - 1]! + s[h]!) / 2;
}

/**
 * Coverage and sharpness of the error estimate of one method over tables. Errors are relative to the
 * table's scale (a table's values differ by orders of magnitude between properties), so the medians mix
 * properties fairly: actual/estimate ratios do not depend on it, the medians of each are taken of
 * error / (largest |value| of the table). Points carrying estimate-unavailable or estimate-unreliable are
 * left out unless `includeFlagged`.
 */
export function measureCoverage(
  tables: readonly ReferenceTable[],
  method: { name: string; options: Options },
  includeFlagged = false,
): CoverageRow {
  const unflag =
    WARNING_FLAGS["estimate-unavailable"] |
    WARNING_FLAGS["estimate-unreliable"];
  let n = 0;
  let in1 = 0;
  let in3 = 0;
  let flagged = 0;
  const est: number[] = [];
  const act: number[] = [];
  for (const tb of tables) {
    const r = interpolateGridMany(
      tb.grid,
      { pressures: tb.pressures, temperatures: tb.temperatures },
      method.options,
    );
    let scale = 0;
    for (const row of tb.grid.values)
      for (const v of row) if (v !== null) scale = Math.max(scale, Math.abs(v));
    for (let i = 0; i < r.count; i++) {
      if (!includeFlagged && r.warnings[i]! & unflag) {
        flagged++;
        continue;
      }
      const e = r.errorEstimates[i]!;
      const a = Math.abs(r.values[i]! - tb.truth[i]!);
      n++;
      if (a <= e) in1++;
      if (a <= 3 * e) in3++;
      est.push(e / scale);
      act.push(a / scale);
    }
  }
  const me = median(est);
  const ma = median(act);
  return {
    method: method.name,
    points: n,
    within1: in1 / n,
    within3: in3 / n,
    sharpness: me / ma,
    medianEstimate: me,
    medianActual: ma,
    flagged,
  };
}
