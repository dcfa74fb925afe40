// Benchmark of the interpolation engine (not a test): `npm run bench:engine`.
// Points per second through interpolateGridMany for linear, newton [3,3] and pchip on a 40×12 grid and
// 10^6 random interior points; SciPy's RegularGridInterpolator (linear, cubic, pchip) on the same grid and
// points in the same run; the ratios against the targets of issue 3; the single-point cost against the
// batch cost. Each figure is the best of several runs, measured both by wall clock and by the CPU time of
// the process (the machines are shared, so wall-clock figures pick up other people's work); SciPy is run
// before and after our runs and its best is kept. The grid is invented (a smooth synthetic surface on
// uneven axes), not measured data.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import {
  interpolateGrid,
  interpolateGridMany,
} from "../app/core/interpolation/index";
import type {
  BatchResult,
  Grid,
  Options,
} from "../app/core/interpolation/index";
import { seededRandom } from "../app/core/interpolation/grids.test-helpers";

const POINTS = 1_000_000;
const PCHIP_SCIPY_POINTS = 10_000;
const SINGLE_POINTS = 200_000;

function unevenAxis(
  n: number,
  start: number,
  span: number,
  random: () => number,
): number[] {
  const gaps = Array.from({ length: n - 1 }, () => 0.5 + random());
  const total = gaps.reduce((a, b) => a + b, 0);
  const out = [start];
  for (const g of gaps) out.push(out[out.length - 1]! + (g / total) * span);
  return out;
}

const random = seededRandom(20250601);
const pressures = unevenAxis(40, 500, 5500, random);
const temperatures = unevenAxis(12, 60, 240, random);
const surface = (p: number, t: number): number =>
  1.02 +
  0.31 * (1 - Math.exp(-p / 2300)) * (1 + 0.0021 * (t - 150)) +
  0.012 * Math.sin(t / 37 + p / 1900);
const grid: Grid = {
  pressures,
  temperatures,
  values: pressures.map((p) => temperatures.map((t) => surface(p, t))),
};

const ps = new Float64Array(POINTS);
const ts = new Float64Array(POINTS);
for (let i = 0; i < POINTS; i++) {
  ps[i] = pressures[0]! + random() * (pressures[39]! - pressures[0]!);
  ts[i] = temperatures[0]! + random() * (temperatures[11]! - temperatures[0]!);
}
const points = { pressures: ps, temperatures: ts };

type Rate = { wall: number; cpu: number };

/** Best seconds over `runs` runs, by wall clock and by CPU time of this process. */
function best(runs: number, fn: () => void): Rate {
  let wall = Infinity;
  let cpu = Infinity;
  for (let r = 0; r < runs; r++) {
    const w0 = process.hrtime.bigint();
    const c0 = process.cpuUsage();
    fn();
    const c = process.cpuUsage(c0);
    wall = Math.min(wall, Number(process.hrtime.bigint() - w0) / 1e9);
    cpu = Math.min(cpu, (c.user + c.system) / 1e6);
  }
  return { wall, cpu: Math.max(cpu, 1e-6) };
}

const perSecond = (count: number, s: Rate): Rate => ({
  wall: count / s.wall,
  cpu: count / s.cpu,
});

const methods: { label: string; options: Options }[] = [
  { label: "linear", options: { method: "linear" } },
  { label: "newton [3,3]", options: { method: "newton", degree: [3, 3] } },
  { label: "pchip", options: { method: "pchip" } },
];

// ---------------------------------------------------------------- SciPy half (run before and after ours)

type SciPy = {
  scipy: string;
  linear: Rate;
  cubic: Rate;
  pchip: Rate;
  maxDiffLinear: number;
  maxDiffPchip: number;
};
const here = dirname(fileURLToPath(import.meta.url));
const helper = join(
  here,
  "..",
  "reference-data",
  "interpolation",
  "bench-scipy.py",
);
const probe = spawnSync("python3", ["-c", "import scipy, numpy"], {
  encoding: "utf8",
});
const haveSciPy = !probe.error && probe.status === 0;
const dir = mkdtempSync(join(tmpdir(), "isopleth-bench-"));
const bin = (name: string, data: ArrayLike<number>): void =>
  writeFileSync(join(dir, name), Buffer.from(Float64Array.from(data).buffer));
const sciPyRuns: SciPy[] = [];
function runSciPy(): void {
  const run = spawnSync("python3", [helper, dir, String(PCHIP_SCIPY_POINTS)], {
    encoding: "utf8",
    maxBuffer: 1 << 20,
  });
  if (run.status !== 0) throw new Error(`SciPy half failed:\n${run.stderr}`);
  sciPyRuns.push(JSON.parse(run.stdout) as SciPy);
}

// ---------------------------------------------------------------- our half

const ours = new Map<
  string,
  { reused: Rate; fresh: Rate; single: Rate; batch: BatchResult }
>();
const faster = (a: Rate, b: Rate | undefined): Rate =>
  b ? { wall: Math.max(a.wall, b.wall), cpu: Math.max(a.cpu, b.cpu) } : a;
function runOurs(): void {
  const warm = {
    pressures: ps.subarray(0, 100_000),
    temperatures: ts.subarray(0, 100_000),
  };
  // single points first, before the large batches leave garbage behind for the collector
  const singles = methods.map(({ options }) => {
    for (let i = 0; i < 20_000; i++)
      interpolateGrid(grid, { pressure: ps[i]!, temperature: ts[i]! }, options); // warm-up
    return perSecond(
      SINGLE_POINTS,
      best(5, () => {
        let sum = 0;
        for (let i = 0; i < SINGLE_POINTS; i++)
          sum += interpolateGrid(
            grid,
            { pressure: ps[i]!, temperature: ts[i]! },
            options,
          ).value;
        if (!Number.isFinite(sum)) throw new Error("non-finite result");
      }),
    );
  });
  // batches into the same output arrays (warm-up on a slice first)
  const batches = methods.map(({ options }) => {
    interpolateGridMany(grid, warm, options);
    let batch = interpolateGridMany(grid, points, options);
    const reused = perSecond(
      POINTS,
      best(
        5,
        () => void (batch = interpolateGridMany(grid, points, options, batch)),
      ),
    );
    return { reused, batch };
  });
  // batches into new arrays each time
  const fresh = methods.map(({ options }) =>
    perSecond(
      POINTS,
      best(2, () => void interpolateGridMany(grid, points, options)),
    ),
  );
  methods.forEach(({ label }, i) => {
    const prev = ours.get(label);
    ours.set(label, {
      reused: faster(batches[i]!.reused, prev?.reused),
      fresh: faster(fresh[i]!, prev?.fresh),
      single: faster(singles[i]!, prev?.single),
      batch: batches[i]!.batch,
    });
  });
}

try {
  if (haveSciPy) {
    bin("pressures.bin", pressures);
    bin("temperatures.bin", temperatures);
    bin("values.bin", grid.values.flat() as number[]);
    bin("points-p.bin", ps);
    bin("points-t.bin", ts);
  }
  runOurs();
  if (haveSciPy) {
    bin(
      "ours-linear.bin",
      ours.get("linear")!.batch.values.subarray(0, 100_000),
    );
    bin(
      "ours-pchip.bin",
      ours.get("pchip")!.batch.values.subarray(0, PCHIP_SCIPY_POINTS),
    );
    runSciPy();
  }
  runOurs();
  if (haveSciPy) runSciPy();
} finally {
  rmSync(dir, { recursive: true, force: true });
}

// For information only (no target): the general evaluator, used when a table has bubble points or
// missing cells, on the same grid with invented bubble points and on the same grid with 3% of cells empty.
const GENERAL_POINTS = 100_000;
const withBubbles: Grid = {
  ...grid,
  bubblePoints: temperatures.map((t) => 2000 + 8 * (t - 60)),
};
const withHoles: Grid = {
  ...grid,
  values: grid.values.map((row, i) =>
    row.map((v, j) =>
      (i * 7 + j * 13) % 33 === 5 && i > 0 && i < 39 ? null : v,
    ),
  ),
};
const general = [
  ["bubble points", withBubbles],
  ["3% cells empty", withHoles],
].map(([label, g]) => {
  const sub = {
    pressures: ps.subarray(0, GENERAL_POINTS),
    temperatures: ts.subarray(0, GENERAL_POINTS),
  };
  const options: Options = {
    method: "newton",
    degree: [3, 3],
    extrapolate: true,
  };
  let out = interpolateGridMany(g as Grid, sub, options);
  return {
    label: label as string,
    rate: perSecond(
      GENERAL_POINTS,
      best(
        3,
        () => void (out = interpolateGridMany(g as Grid, sub, options, out)),
      ),
    ),
  };
});

// ---------------------------------------------------------------- report

const fmt = (x: number): string =>
  x >= 1e6
    ? `${(x / 1e6).toFixed(2)} M`
    : x >= 1e3
      ? `${(x / 1e3).toFixed(1)} k`
      : x.toFixed(0);
const pair = (r: Rate): string =>
  `${fmt(r.wall).padStart(8)} ${fmt(r.cpu).padStart(8)}`;
const verdict = (ok: boolean): string => (ok ? "PASS" : "FAIL");
let allPass = true;

console.log(
  `Interpolation engine benchmark: ${pressures.length}×${temperatures.length} grid, ${POINTS.toLocaleString("en")} random interior points`,
);
console.log(
  `Node ${process.version}. Points per second, best of several runs: wall clock / CPU time.\n`,
);
console.log(
  "interpolateGridMany (typed arrays)     output reused        new output arrays",
);
for (const [label, o] of ours)
  console.log(`  ${label.padEnd(34)} ${pair(o.reused)}    ${pair(o.fresh)}`);

console.log("\nGeneral evaluator, newton [3,3] (information, no target):");
for (const g of general) console.log(`  ${g.label.padEnd(34)} ${pair(g.rate)}`);

console.log(
  "\nSingle-point interpolateGrid vs batch (output reused), cost per point (target: within 3×):",
);
for (const [label, o] of ours) {
  const wall = o.reused.wall / o.single.wall;
  const cpu = o.reused.cpu / o.single.cpu;
  const ok = cpu <= 3;
  allPass &&= ok;
  console.log(
    `  ${label.padEnd(13)} ${(1e9 / o.single.cpu).toFixed(0).padStart(5)} ns vs ${(1e9 / o.reused.cpu).toFixed(0).padStart(4)} ns (CPU) = ${cpu.toFixed(2)}×   wall clock ${wall.toFixed(2)}×   ${verdict(ok)}`,
  );
}

if (!haveSciPy) {
  console.log(
    "\nSciPy half skipped: python3 with scipy and numpy is not available on this machine.",
  );
} else {
  const bestOf = (key: "linear" | "cubic" | "pchip"): Rate => ({
    wall: Math.max(...sciPyRuns.map((s) => s[key].wall)),
    cpu: Math.max(...sciPyRuns.map((s) => s[key].cpu)),
  });
  const s = {
    linear: bestOf("linear"),
    cubic: bestOf("cubic"),
    pchip: bestOf("pchip"),
  };
  console.log(
    `\nSciPy ${sciPyRuns[0]!.scipy} RegularGridInterpolator, same grid and points, same run (best of two sessions):`,
  );
  console.log(`  linear        ${pair(s.linear)}`);
  console.log(`  cubic         ${pair(s.cubic)}`);
  console.log(
    `  pchip         ${pair(s.pchip)}   (${PCHIP_SCIPY_POINTS.toLocaleString("en")} points)`,
  );
  const rows: [string, Rate, Rate, Rate, number][] = [
    [
      "linear / SciPy linear",
      ours.get("linear")!.reused,
      ours.get("linear")!.fresh,
      s.linear,
      2,
    ],
    [
      "newton [3,3] / SciPy cubic",
      ours.get("newton [3,3]")!.reused,
      ours.get("newton [3,3]")!.fresh,
      s.cubic,
      2,
    ],
    [
      "pchip / SciPy pchip",
      ours.get("pchip")!.reused,
      ours.get("pchip")!.fresh,
      s.pchip,
      100,
    ],
  ];
  console.log(
    "\nRatios (targets from issue 3)          output reused: CPU  wall     new output arrays: CPU  wall",
  );
  for (const [label, reused, fresh, sci, target] of rows) {
    const r = (a: Rate): string =>
      `${(a.cpu / sci.cpu).toFixed(1).padStart(7)}× ${(a.wall / sci.wall).toFixed(1).padStart(6)}×`;
    const ok = reused.cpu / sci.cpu >= target;
    allPass &&= ok;
    console.log(
      `  ${label.padEnd(27)} ≥ ${String(target).padStart(3)}×   ${r(reused)}             ${r(fresh)}   ${verdict(ok)}`,
    );
  }
  const diffs = sciPyRuns[0]!;
  console.log(
    `\nSame numbers: largest difference from SciPy, linear ${diffs.maxDiffLinear.toExponential(1)} (100,000 points), pchip ${diffs.maxDiffPchip.toExponential(1)} (${PCHIP_SCIPY_POINTS.toLocaleString("en")} points).`,
  );
}
console.log(
  `\n${allPass ? "All targets met" : "Some targets were NOT met"} (judged on CPU time with output arrays reused; all figures shown above).`,
);
