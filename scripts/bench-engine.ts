// Benchmark of the interpolation engine (not a test): `npm run bench:engine`.
// Points per second through interpolateGridMany for linear, newton [3,3] and pchip on a 40×12 grid and
// 10^6 random interior points, SciPy's RegularGridInterpolator on the same grid and points in the same
// run, the ratios against the targets of issue 3, and the single-point cost against the batch cost.
// The grid is invented (a smooth synthetic surface on uneven axes), not measured data.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { interpolateGrid, interpolateGridMany } from "../app/core/interpolation/index";
import type { BatchResult, Grid, Options } from "../app/core/interpolation/index";

const POINTS = 1_000_000;
const PCHIP_SCIPY_POINTS = 10_000;
const SINGLE_POINTS = 200_000;

/** Small seeded generator (mulberry32) so every run uses the same grid and points. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function unevenAxis(n: number, start: number, span: number, random: () => number): number[] {
  const gaps = Array.from({ length: n - 1 }, () => 0.5 + random());
  const total = gaps.reduce((a, b) => a + b, 0);
  const out = [start];
  for (const g of gaps) out.push(out[out.length - 1]! + (g / total) * span);
  return out;
}

const random = rng(20250601);
const pressures = unevenAxis(40, 500, 5500, random);
const temperatures = unevenAxis(12, 60, 240, random);
const surface = (p: number, t: number): number =>
  1.02 + 0.31 * (1 - Math.exp(-p / 2300)) * (1 + 0.0021 * (t - 150)) + 0.012 * Math.sin(t / 37 + p / 1900);
const grid: Grid = { pressures, temperatures, values: pressures.map((p) => temperatures.map((t) => surface(p, t))) };

const ps = new Float64Array(POINTS);
const ts = new Float64Array(POINTS);
for (let i = 0; i < POINTS; i++) {
  ps[i] = pressures[0]! + random() * (pressures[39]! - pressures[0]!);
  ts[i] = temperatures[0]! + random() * (temperatures[11]! - temperatures[0]!);
}
const points = { pressures: ps, temperatures: ts };

function bestOf<T>(runs: number, fn: () => T): { seconds: number; result: T } {
  let seconds = Infinity;
  let result: T | undefined;
  for (let r = 0; r < runs; r++) {
    const start = process.hrtime.bigint();
    result = fn();
    seconds = Math.min(seconds, Number(process.hrtime.bigint() - start) / 1e9);
  }
  return { seconds, result: result! };
}

const methods: { label: string; options: Options }[] = [
  { label: "linear", options: { method: "linear" } },
  { label: "newton [3,3]", options: { method: "newton", degree: [3, 3] } },
  { label: "pchip", options: { method: "pchip" } },
];

const ours = new Map<string, { rate: number; rateFresh: number; nsBatch: number; nsSingle: number; batch: BatchResult }>();
for (const { label, options } of methods) {
  interpolateGridMany(grid, { pressures: ps.subarray(0, 50_000), temperatures: ts.subarray(0, 50_000) }, options); // warm-up
  const fresh = bestOf(3, () => interpolateGridMany(grid, points, options));
  const { seconds, result } = bestOf(5, () => interpolateGridMany(grid, points, options, fresh.result));
  const single = bestOf(3, () => {
    let sum = 0;
    for (let i = 0; i < SINGLE_POINTS; i++) sum += interpolateGrid(grid, { pressure: ps[i]!, temperature: ts[i]! }, options).value;
    return sum;
  });
  ours.set(label, {
    rate: POINTS / seconds,
    rateFresh: POINTS / fresh.seconds,
    nsBatch: (seconds / POINTS) * 1e9,
    nsSingle: (single.seconds / SINGLE_POINTS) * 1e9,
    batch: result,
  });
}

const fmt = (x: number): string => (x >= 1e6 ? `${(x / 1e6).toFixed(2)} M` : x >= 1e3 ? `${(x / 1e3).toFixed(1)} k` : x.toFixed(0));
const verdict = (ok: boolean): string => (ok ? "PASS" : "FAIL");

console.log(`Interpolation engine benchmark: ${pressures.length}×${temperatures.length} grid, ${POINTS.toLocaleString("en")} random interior points`);
console.log(`Node ${process.version}\n`);
console.log("interpolateGridMany (typed arrays):");
console.log("                 output reused (best of 5)        new output arrays (best of 3)");
for (const [label, o] of ours) {
  console.log(
    `  ${label.padEnd(13)} ${fmt(o.rate).padStart(9)} points/s (${o.nsBatch.toFixed(1).padStart(5)} ns/point)   ${fmt(o.rateFresh).padStart(9)} points/s`,
  );
}

console.log("\nSingle-point interpolateGrid vs batch, per point (target: within 3×):");
let allPass = true;
for (const [label, o] of ours) {
  const ratio = o.nsSingle / o.nsBatch;
  allPass &&= ratio <= 3;
  console.log(`  ${label.padEnd(13)} ${o.nsSingle.toFixed(1).padStart(7)} ns vs ${o.nsBatch.toFixed(1).padStart(6)} ns  = ${ratio.toFixed(2)}×  ${verdict(ratio <= 3)}`);
}

// SciPy half
const here = dirname(fileURLToPath(import.meta.url));
const helper = join(here, "..", "reference-data", "interpolation", "bench-scipy.py");
const probe = spawnSync("python3", ["-c", "import scipy, numpy"], { encoding: "utf8" });
if (probe.error || probe.status !== 0) {
  console.log("\nSciPy half skipped: python3 with scipy and numpy is not available on this machine.");
} else {
  const dir = mkdtempSync(join(tmpdir(), "isopleth-bench-"));
  try {
    const bin = (name: string, data: ArrayLike<number>): void =>
      writeFileSync(join(dir, name), Buffer.from(Float64Array.from(data).buffer));
    bin("pressures.bin", pressures);
    bin("temperatures.bin", temperatures);
    bin("values.bin", grid.values.flat() as number[]);
    bin("points-p.bin", ps);
    bin("points-t.bin", ts);
    bin("ours-linear.bin", ours.get("linear")!.batch.values.subarray(0, 100_000));
    bin("ours-pchip.bin", ours.get("pchip")!.batch.values.subarray(0, PCHIP_SCIPY_POINTS));
    const run = spawnSync("python3", [helper, dir, String(PCHIP_SCIPY_POINTS)], { encoding: "utf8", maxBuffer: 1 << 20 });
    if (run.status !== 0) {
      console.log(`\nSciPy half failed:\n${run.stderr}`);
      allPass = false;
    } else {
      const s = JSON.parse(run.stdout) as {
        scipy: string;
        linear: number;
        cubic: number;
        pchip: number;
        maxDiffLinear: number;
        maxDiffPchip: number;
      };
      console.log(`\nSciPy ${s.scipy} RegularGridInterpolator, same grid and points, same run:`);
      console.log(`  linear        ${fmt(s.linear).padStart(9)} points/s`);
      console.log(`  cubic         ${fmt(s.cubic).padStart(9)} points/s`);
      console.log(`  pchip         ${fmt(s.pchip).padStart(9)} points/s  (${PCHIP_SCIPY_POINTS.toLocaleString("en")} points)`);
      const rows: [string, number, number, number][] = [
        ["linear / SciPy linear", ours.get("linear")!.rate, s.linear, 2],
        ["newton [3,3] / SciPy cubic", ours.get("newton [3,3]")!.rate, s.cubic, 2],
        ["pchip / SciPy pchip", ours.get("pchip")!.rate, s.pchip, 100],
      ];
      console.log("\nRatios (targets from issue 3):");
      for (const [label, a, b, target] of rows) {
        const ratio = a / b;
        allPass &&= ratio >= target;
        console.log(`  ${label.padEnd(27)} ${ratio.toFixed(1).padStart(7)}×  (target ≥ ${target}×)  ${verdict(ratio >= target)}`);
      }
      console.log(
        `\nSame numbers: largest difference from SciPy, linear ${s.maxDiffLinear.toExponential(1)} (100,000 points), pchip ${s.maxDiffPchip.toExponential(1)} (${PCHIP_SCIPY_POINTS.toLocaleString("en")} points).`,
      );
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
console.log(`\n${allPass ? "All targets met." : "Some targets were NOT met."}`);
