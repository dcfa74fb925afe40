// Per-point refusal in runLookup / runLookupColumns, the extrapolation limit, physically impossible values,
// snapping of metric corners, messages that never contradict themselves, and the server-side
// near-bubble-point warning. Reference for the behaviour: issue 13 (items 1–3, 8) and README. Grids are
// invented (the synthetic sample generator, published correlations; see app/core/properties). Unit
// factors: NIST SP 811 (2008) appendix B.8 — 1 bar = 1e5 Pa, 1 psi = 1 lbf/in² = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)²; °F = °C × 1.8 + 32.
import { describe, expect, test } from "vitest";
import { interpolateGrid, type Grid } from "../interpolation";
import { generateSample } from "../properties";
import {
  CANONICAL_UNIT_SYSTEM,
  METRIC_UNIT_SYSTEM,
  convertBetweenSystems,
  type PropertyKey,
} from "../units";
import {
  affineToCanonical,
  describeWarningCode,
  isLookupError,
  LOOKUP_REFUSAL_CODES,
  LOOKUP_WARNING_CODES,
  LOOKUP_WARNING_FLAGS,
  lookupWarningsFromFlags,
  runLookup,
  runLookupColumns,
  W_NEAR_BUBBLE_POINT,
  W_PCHIP_FALLBACK,
  type LookupOptions,
} from "./index";

const PRESSURES = Array.from({ length: 23 }, (_, i) => 500 + 250 * i); // 500 … 6000 psia
const TEMPERATURES = [120, 150, 180, 210, 240];
const clean = generateSample({
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  pressures: PRESSURES,
  temperatures: TEMPERATURES,
});
const options = (
  property: PropertyKey,
  extra: Partial<LookupOptions> = {},
): LookupOptions => ({ method: "auto", property, units: "field", ...extra });

describe("every point answered or refused on its own", () => {
  test("a mixed batch: served points keep their values; each refusal has its code and a message counting points from 1", () => {
    const grid = clean.grids.oil_fvf;
    const pts = [
      { pressure: 3000, temperature: 180 }, // served
      { pressure: 9000, temperature: 180 }, // outside, no extrapolation
      { pressure: 2000, temperature: 200 }, // served
    ];
    const out = runLookup(grid, pts, options("oil_fvf"));
    expect(out.results).toHaveLength(3);
    for (const i of [0, 2]) {
      const e = interpolateGrid(grid, pts[i]!, { method: "newton" });
      expect(out.results[i]!.value).toBe(e.value);
      expect(out.results[i]!.refused).toBeUndefined();
    }
    const r = out.results[1]!;
    expect(r).toMatchObject({
      value: null,
      errorEstimate: null,
      method: null,
      stencil: null,
      warnings: [],
    });
    expect(r.refused!.code).toBe("outside-measured-range");
    expect(r.refused!.message).toMatch(/^Point 2 has pressure 9000 psia/);
    expect(out.summary).toMatchObject({
      count: 3,
      refusedCount: 1,
      refusalCounts: { "outside-measured-range": 1 },
      methodCounts: { newton: 2, pchip: 0, linear: 0 },
    });
  });

  test("extrapolation beyond maxExtrapolation (default 25 % of the span) is refused extrapolation-too-far", () => {
    const grid = clean.grids.oil_fvf;
    // pressure span 5500 psia: 25 % = 1375 psia beyond 6000
    const pts = [
      { pressure: 7300, temperature: 180 },
      { pressure: 7400, temperature: 180 },
      { pressure: 100_000, temperature: 180 },
    ];
    const out = runLookup(grid, pts, options("oil_fvf", { extrapolate: true }));
    expect(out.results[0]!.value).not.toBeNull();
    expect(out.results[0]!.warnings).toContain("extrapolated");
    for (const i of [1, 2]) {
      expect(out.results[i]!.refused!.code).toBe("extrapolation-too-far");
      expect(out.results[i]!.refused!.message).toMatch(
        new RegExp(
          `^Point ${i + 1} has pressure [0-9]+ psia, [0-9.]+ psia outside the measured range .*farther than the extrapolation limit of 1375 psia \\(25 % of the measured span\\)`,
        ),
      );
    }
    // the limit is an option
    const wide = runLookup(
      grid,
      [pts[1]!],
      options("oil_fvf", { extrapolate: true, maxExtrapolation: 0.5 }),
    );
    expect(wide.results[0]!.refused).toBeUndefined();
    for (const bad of [0, -0.1, 10.5, Number.NaN, "0.3", Infinity]) {
      let error: unknown;
      try {
        runLookup(
          grid,
          [pts[0]!],
          options("oil_fvf", {
            extrapolate: true,
            maxExtrapolation: bad as number,
          }),
        );
      } catch (e) {
        error = e;
      }
      expect(isLookupError(error) && error.code).toBe("INVALID_OPTIONS");
    }
  });

  test("a physically impossible value (here Rs < 0, extrapolated below the data) is refused impossible-value", () => {
    // the straight line through the two lowest measured pressures crosses zero above 20 psia (the same
    // case as the table's rs-non-negative rule); a negative gas–oil ratio cannot exist
    const grid = clean.grids.solution_gor;
    const pts = [
      { pressure: 20, temperature: 212 },
      { pressure: 600, temperature: 212 },
    ];
    const engine = interpolateGrid(grid, pts[0]!, {
      method: "linear",
      extrapolate: true,
    });
    expect(engine.value).toBeLessThan(0);
    const out = runLookup(
      grid,
      pts,
      options("solution_gor", { method: "linear", extrapolate: true }),
    );
    const r = out.results[0]!;
    expect(r.value).toBeNull();
    expect(r.refused!.code).toBe("impossible-value");
    expect(r.refused!.message).toMatch(
      /^Point 1 \(20 psia, 212 °F\): the interpolated solution gas-oil ratio \(Rs\) comes out at -[0-9.]+ scf\/STB, which is physically impossible \(a gas-oil ratio is zero or more\)/,
    );
    expect(out.results[1]!.value).toBeGreaterThan(0);
    const cols = runLookupColumns(
      grid,
      pts,
      options("solution_gor", { method: "linear", extrapolate: true }),
    );
    expect(Array.from(cols.refusals!)).toEqual([
      LOOKUP_REFUSAL_CODES.indexOf("impossible-value") + 1,
      0,
    ]);
    expect(cols.refusalMessages![0]).toBe(r.refused!.message);
    expect(cols.refusalMessages![1]).toBeUndefined();
    expect(Number.isNaN(cols.values[0]!)).toBe(true);
    expect(cols.values[1]).toBe(out.results[1]!.value);
  });

  test("missing cells: refused no-measured-values; the columns form gives codes, messages and the summary", () => {
    const holes: Grid = {
      pressures: [1000, 2000, 3000],
      temperatures: [100, 200],
      values: [
        [1.1, null],
        [null, null],
        [null, 1.3],
      ],
    };
    const cols = runLookupColumns(
      holes,
      {
        pressures: [1000, 2000, 1000],
        temperatures: [100, 150, 300],
      },
      options("oil_fvf"),
    );
    expect(Array.from(cols.refusals!)).toEqual([0, 2, 1]);
    expect(cols.values[0]).toBe(1.1);
    expect(cols.refusalMessages![1]).toMatch(
      /^Point 2 \(2000 psia, 150 °F\): no measured values/,
    );
    expect(cols.refusalMessages![2]).toMatch(/^Point 3 has temperature 300 °F/);
    expect(cols.summary).toMatchObject({
      count: 3,
      refusedCount: 2,
      refusalCounts: { "no-measured-values": 1, "outside-measured-range": 1 },
    });
  });

  test("no refusal: refusals and messages are null, counts zero", () => {
    const cols = runLookupColumns(
      clean.grids.z_factor,
      { pressures: [3000], temperatures: [180] },
      options("z_factor"),
    );
    expect(cols.refusals).toBeNull();
    expect(cols.refusalMessages).toBeNull();
    expect(cols.summary.refusedCount).toBe(0);
  });

  test("the automatic method's pchip pass never throws (overshooting and refused points in one batch)", () => {
    // a step (invented): the cubic through it overshoots, so the automatic method falls back to pchip
    const step: Grid = {
      pressures: [1, 2, 3, 4, 5, 6],
      temperatures: [10, 20],
      values: [1, 1, 1, 2, 2, 2].map((v) => [v, v]),
    };
    const out = runLookup(
      step,
      [
        { pressure: 2.5, temperature: 15 },
        { pressure: 60, temperature: 15 },
        { pressure: 5.5, temperature: 15 },
      ],
      options("z_factor", { degree: [3, 1], extrapolate: true }),
    );
    expect(out.results[0]!.warnings).toContain("pchip-fallback");
    expect(out.results[1]!.refused!.code).toBe("extrapolation-too-far");
    expect(out.results[2]!.value).not.toBeNull();
  });
});

describe("snapping: measured corners given in bara and °C are never refused", () => {
  // the table was measured at 100–400 bara and 60–100 °C and stored in psia/°F by the upload's conversion;
  // the lookup converts the caller's bara/°C with its own affine coefficients
  const bars = [100, 200, 300, 400];
  const celsius = [60, 75, 100];
  const toPsia = (b: number) =>
    convertBetweenSystems(
      b,
      "pressure",
      METRIC_UNIT_SYSTEM,
      CANONICAL_UNIT_SYSTEM,
    );
  const toF = (c: number) =>
    convertBetweenSystems(
      c,
      "temperature",
      METRIC_UNIT_SYSTEM,
      CANONICAL_UNIT_SYSTEM,
    );
  const grid: Grid = {
    pressures: bars.map(toPsia),
    temperatures: celsius.map(toF),
    values: bars.map((b) => celsius.map((c) => 1.1 + b / 2000 + c / 1000)),
  };

  test("the two conversions differ by round-off at some corners (else this test would prove nothing)", () => {
    const pa = affineToCanonical("pressure", METRIC_UNIT_SYSTEM);
    const ta = affineToCanonical("temperature", METRIC_UNIT_SYSTEM);
    const differ =
      bars.filter((b) => b * pa.scale + pa.offset !== toPsia(b)).length +
      celsius.filter((c) => c * ta.scale + ta.offset !== toF(c)).length;
    // 1 bar = 1e5 Pa / (0.45359237 × 9.80665 / 0.0254²) Pa/psi = 14.503773773… psi (SP 811)
    expect(toPsia(1)).toBeCloseTo(
      1e5 / ((0.45359237 * 9.80665) / 0.0254 ** 2),
      12,
    );
    expect(differ).toBeGreaterThan(0);
  });

  test("every corner and node: served, not extrapolated, the measured value", () => {
    const pts = bars.flatMap((b) =>
      celsius.map((c) => ({ pressure: b, temperature: c })),
    );
    for (const method of ["auto", "linear", "pchip"] as const) {
      const out = runLookup(
        grid,
        pts,
        options("oil_fvf", { units: "metric", method }),
      );
      out.results.forEach((r, k) => {
        expect(r.refused).toBeUndefined();
        expect(r.warnings).not.toContain("extrapolated");
        const b = pts[k]!.pressure;
        const c = pts[k]!.temperature;
        expect(Math.abs(r.value! - (1.1 + b / 2000 + c / 1000))).toBeLessThan(
          1e-12,
        );
      });
    }
  });

  test("a real difference is refused, and the message never reads '75 °C, outside 60 to 100 °C'-style nonsense", () => {
    const r = runLookup(
      grid,
      [{ pressure: 200, temperature: 59.9999999 }],
      options("oil_fvf", { units: "metric" }),
    ).results[0]!;
    expect(r.refused!.code).toBe("outside-measured-range");
    const m = /has temperature (\S+) °C, .* run from (\S+) to (\S+) °C/.exec(
      r.refused!.message,
    )!;
    expect(m[1]).toBe("59.9999999");
    expect(m[2]).toBe("60");
    expect(m[1]).not.toBe(m[2]);
  });
});

describe("warnings: one typed list, near-bubble-point computed on the server", () => {
  test("every code has a bit, a plain sentence, and the lookup bits lie above the engine's", () => {
    const bits = LOOKUP_WARNING_CODES.map((c) => LOOKUP_WARNING_FLAGS[c]);
    expect(new Set(bits).size).toBe(bits.length);
    for (const code of LOOKUP_WARNING_CODES) {
      expect(describeWarningCode(code)).toMatch(/^[A-Z].{40,}\.$/);
      expect(lookupWarningsFromFlags(LOOKUP_WARNING_FLAGS[code])).toEqual([
        code,
      ]);
    }
    expect(W_PCHIP_FALLBACK).toBe(1 << 12);
    expect(W_NEAR_BUBBLE_POINT).toBe(1 << 13);
  });

  test("near-bubble-point: within 2 % of pb and within one grid step of it", () => {
    const grid = clean.grids.oil_fvf;
    const pb = interpolateGrid(
      grid,
      { pressure: 3000, temperature: 180 },
      { method: "newton" },
    ).bubblePointPressure!;
    // 2 % of pb (~50 psi here) is below the 250 psi grid step: the 2 % decides
    const near = (p: number) =>
      runLookup(
        grid,
        [{ pressure: p, temperature: 180 }],
        options("oil_fvf"),
      ).results[0]!.warnings.includes("near-bubble-point");
    expect(near(pb)).toBe(true);
    expect(near(pb * 1.019)).toBe(true);
    expect(near(pb * 0.981)).toBe(true);
    expect(near(pb * 1.021)).toBe(false);
    expect(near(pb * 0.979)).toBe(false);
    // on a fine grid (step 20 psi) the step decides: 30 psi away is not flagged although within 2 %
    const fine = generateSample({
      apiGravity: 35,
      gasGravity: 0.75,
      rsb: 600,
      pressures: Array.from({ length: 201 }, (_, i) => 1000 + 20 * i),
      temperatures: [180],
    }).grids.oil_fvf;
    const pbF = interpolateGrid(
      fine,
      { pressure: 3000, temperature: 180 },
      { method: "newton" },
    ).bubblePointPressure!;
    const at = (p: number) =>
      runLookup(fine, [{ pressure: p, temperature: 180 }], options("oil_fvf"))
        .results[0]!.warnings;
    expect(at(pbF + 15)).toContain("near-bubble-point");
    expect(at(pbF + 30)).not.toContain("near-bubble-point");
    expect(30).toBeLessThan(0.02 * pbF);
    // gas grids have no bubble point, so never the warning
    expect(
      runLookup(
        clean.grids.gas_fvf,
        [{ pressure: 2000, temperature: 180 }],
        options("gas_fvf"),
      ).results[0]!.warnings,
    ).not.toContain("near-bubble-point");
  });
});

describe("stencil: the exact measured cells, per column, in the output units", () => {
  test("missing cells and bubble points: every listed cell was measured; the engine's columns, converted", () => {
    // the generated oil grid with a few cells removed (invented data)
    const grid: Grid = {
      ...clean.grids.oil_fvf,
      values: clean.grids.oil_fvf.values.map((row, i) =>
        row.map((v, j) => ((i * 7 + j * 3) % 11 === 0 ? null : v)),
      ),
    };
    // bara and °C inside the measured 34.5–413.7 bara, 48.9–115.6 °C
    const pts = Array.from({ length: 60 }, (_, k) => ({
      pressure: 40 + k * 6,
      temperature: 52 + ((k * 37) % 60),
    }));
    const out = runLookup(grid, pts, options("oil_fvf", { units: "metric" }));
    const pa = affineToCanonical("pressure", METRIC_UNIT_SYSTEM);
    const ta = affineToCanonical("temperature", METRIC_UNIT_SYSTEM);
    let differ = 0;
    out.results.forEach((r, k) => {
      if (r.refused) return;
      const method = r.warnings.includes("pchip-fallback") ? "pchip" : "newton";
      const e = interpolateGrid(
        grid,
        {
          pressure: pts[k]!.pressure * pa.scale + pa.offset,
          temperature: pts[k]!.temperature * ta.scale + ta.offset,
        },
        method === "pchip"
          ? { method, extrapolate: true, maxExtrapolation: Infinity }
          : { method, degree: [3, 3] },
      );
      expect(r.stencil!.columns.map((c) => c.temperatureIndex)).toEqual(
        e.stencil.columns.map((c) => c.temperature),
      );
      r.stencil!.columns.forEach((c, n) => {
        expect(c.pressureIndices).toEqual(e.stencil.columns[n]!.pressure);
        expect(c.bubblePointNode).toBe(e.stencil.columns[n]!.bubblePointNode);
        for (const i of c.pressureIndices)
          expect(grid.values[i]![c.temperatureIndex]).not.toBeNull();
        c.pressureIndices.forEach((i, m) =>
          expect(c.pressures[m]).toBeCloseTo(
            (grid.pressures[i]! - pa.offset) / pa.scale,
            9,
          ),
        );
        expect(c.temperature).toBeCloseTo(
          (grid.temperatures[c.temperatureIndex]! - ta.offset) / ta.scale,
          9,
        );
      });
      if (
        new Set(r.stencil!.columns.map((c) => c.pressureIndices.join())).size >
        1
      )
        differ++;
    });
    expect(out.summary.refusedCount).toBeLessThan(6);
    // some points really have columns on different rows (else the per-column list would prove nothing)
    expect(differ).toBeGreaterThan(0);
  });
});
