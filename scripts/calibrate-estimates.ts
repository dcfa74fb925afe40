// Calibration of the engine's error estimate (not a test): `npm run calibrate:estimates`.
// Reference tables whose true function is known — invented fluids evaluated with published correlations
// (Standing 1947; Vasquez & Beggs 1980; Beggs & Robinson 1975; Sutton 1985 with Dranchuk & Abou-Kassem
// 1975; Lee, Gonzalez & Eakin 1966; see app/core/interpolation/calibration.test-helpers.ts), at several
// node spacings and temperature layouts, rounded as laboratories print them — are interpolated at random
// points off the nodes by every method. Printed per method and kind of table: coverage (share of points
// whose actual error is within the estimate, and within three times it), sharpness (median estimate over
// median actual error) and counts. The targets (README "Error estimate"): ≥ 90 % within the estimate,
// ≥ 99 % within 3×, sharpness ≤ 10, on smooth tables (bubble points given, or one branch, or gas).
import {
  CALIBRATION_METHODS,
  measureCoverage,
  referenceTables,
  type TableKind,
} from "../app/core/interpolation/calibration.test-helpers";

const seed = Number(process.argv[2] ?? 20261204);
const perTable = Number(process.argv[3] ?? 200);
const started = performance.now();
const tables = referenceTables(seed, perTable);
const kinds: { label: string; kinds: readonly TableKind[] }[] = [
  {
    label: "smooth (all three below)",
    kinds: ["with-bubble-points", "one-branch", "gas"],
  },
  {
    label: "oil across pb, bubble points given",
    kinds: ["with-bubble-points"],
  },
  { label: "oil on one branch, no bubble points", kinds: ["one-branch"] },
  { label: "gas", kinds: ["gas"] },
];

const pct = (x: number): string => `${(100 * x).toFixed(1)} %`;
const pad = (s: string, n: number): string => s.padEnd(n);
console.log(
  `Reference tables: ${tables.length}, ${perTable} random off-node points each, seed ${seed}.`,
);
for (const group of kinds) {
  const sel = tables.filter((t) => group.kinds.includes(t.kind));
  console.log(`\n${group.label} — ${sel.length} tables`);
  console.log(
    `  ${pad("method", 10)} ${pad("points", 8)} ${pad("≤ est", 8)} ${pad("≤ 3 est", 8)} ${pad("sharpness", 10)} flagged (left out)`,
  );
  for (const m of CALIBRATION_METHODS) {
    const r = measureCoverage(sel, m);
    console.log(
      `  ${pad(m.name, 10)} ${pad(String(r.points), 8)} ${pad(pct(r.within1), 8)} ${pad(pct(r.within3), 8)} ${pad(r.sharpness.toFixed(2), 10)} ${r.flagged}`,
    );
  }
}
const kink = tables.filter((t) => t.kind === "kink");
console.log(
  `\nOil across pb with no bubble points given (a kink; coverage not claimed) — ${kink.length} tables, every point`,
);
for (const m of CALIBRATION_METHODS) {
  const all = measureCoverage(kink, m, true);
  const clean = measureCoverage(kink, m, false);
  console.log(
    `  ${pad(m.name, 10)} ≤ est ${pct(all.within1)}, ≤ 3 est ${pct(all.within3)}; flagged estimate-unreliable ${pct(clean.flagged / all.points)}; unflagged ≤ est ${pct(clean.within1)}`,
  );
}
console.log(`\n(${((performance.now() - started) / 1000).toFixed(1)} s)`);
