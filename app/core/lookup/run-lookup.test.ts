// runLookup against the engine it wraps: same numbers in field units, correct conversions in metric units,
// the automatic method's pchip fallback, the typed-array form, and every error path. Grids come from the
// synthetic sample generator (invented data from published correlations, see app/core/properties).
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
  describeWarningCode,
  LookupError,
  MAX_LOOKUP_POINTS,
  runLookup,
  runLookupColumns,
  lookupWarningsFromFlags,
  METHOD_CODES,
  type LookupOptions,
  type LookupPoint,
} from "./index";

const PRESSURES = Array.from({ length: 23 }, (_, i) => 500 + 250 * i); // 500 … 6000 psia
const TEMPERATURES = [120, 150, 180, 210, 240];
const noisy = generateSample({
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  pressures: PRESSURES,
  temperatures: TEMPERATURES,
  noise: 0.01,
  seed: 3,
});
const clean = generateSample({
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  pressures: PRESSURES,
  temperatures: TEMPERATURES,
});

/** Deterministic points inside the grid (a small linear congruential generator). */
function points(count: number, seed = 11): LookupPoint[] {
  let s = seed;
  const next = (): number => {
    s = (s * 16807) % 2147483647;
    return s / 2147483647;
  };
  return Array.from({ length: count }, () => ({
    pressure: 520 + next() * 5460,
    temperature: 121 + next() * 118,
  }));
}

const options = (
  property: PropertyKey,
  extra: Partial<LookupOptions> = {},
): LookupOptions => ({
  method: "auto",
  property,
  units: "field",
  ...extra,
});

describe("field units: the engine's numbers, unchanged", () => {
  const pts = points(300);
  test.each(["newton", "pchip", "linear"] as const)(
    "%s: value, error estimate, warnings, branch and bubble point equal interpolateGrid's",
    (method) => {
      for (const property of ["oil_fvf", "solution_gor", "z_factor"] as const) {
        const grid = noisy.grids[property];
        const out = runLookup(
          grid,
          pts,
          options(property, { method, degree: [3, 3] }),
        );
        expect(out.results).toHaveLength(pts.length);
        out.results.forEach((r, i) => {
          const e = interpolateGrid(grid, pts[i]!, { method, degree: [3, 3] });
          expect(r.value).toBe(e.value);
          expect(r.errorEstimate).toBe(e.errorEstimate);
          // near-bubble-point is the lookup's own warning (tested in refusals.test.ts)
          expect(r.warnings.filter((w) => w !== "near-bubble-point")).toEqual(
            e.warnings,
          );
          expect(r.method).toBe(method);
          expect(r.branch).toBe(e.branch ?? null);
          if (e.bubblePointPressure === undefined)
            expect(r.bubblePointPressure).toBeNull();
          else
            expect(r.bubblePointPressure!).toBeCloseTo(
              e.bubblePointPressure,
              6,
            );
          // the stencil span covers every grid node the engine names
          for (const row of e.stencil.pressure)
            expect(r.stencil!.pressureIndices).toContain(row);
          for (const col of e.stencil.temperature)
            expect(r.stencil!.temperatureIndices).toContain(col);
          expect(r.stencil!.pressures).toEqual(
            r.stencil!.pressureIndices.map((k) => grid.pressures[k]),
          );
          expect(r.stencil!.temperatures).toEqual(
            r.stencil!.temperatureIndices.map((k) => grid.temperatures[k]),
          );
        });
      }
    },
  );

  test("units are labelled; 'auto' without a degree is newton [3,3]", () => {
    const out = runLookup(noisy.grids.gas_fvf, points(3), options("gas_fvf"));
    expect(out.degree).toEqual([3, 3]);
    expect(out.methodDescription).toBe(
      "automatic: newton [3,3], pchip where newton overshoots",
    );
    expect(out.units).toEqual({
      system: "field",
      pressure: { id: "psia", symbol: "psia" },
      temperature: { id: "degF", symbol: "°F" },
      value: { id: "ft3/scf", symbol: "ft³/scf" },
      standardConditions: "60 °F, 14.696 psia",
      reportStandardConditions: "60 °F, 14.696 psia",
      pressureBasis: "absolute",
      barometricPressurePsia: 14.696,
    });
  });

  test("field Bg is in ft³/scf: the canonical rb/scf value times 5.614583 ft³/bbl", () => {
    const pt = { pressure: 3250, temperature: 212 };
    const r = runLookup(
      clean.grids.gas_fvf,
      [pt],
      options("gas_fvf", { method: "newton" }),
    ).results[0]!;
    const e = interpolateGrid(clean.grids.gas_fvf, pt, { method: "newton" });
    expect(r.value! / e.value).toBeCloseTo(5.614583333, 8);
    expect(r.errorEstimate! / e.errorEstimate).toBeCloseTo(5.614583333, 8);
    expect(r.branch).toBeNull();
    expect(r.bubblePointPressure).toBeNull();
  });
});

describe("metric units: bara and °C in, metric units out", () => {
  const BAR = 14.503773773022; // psi per bar (exact definition: 10^5 Pa / 6894.757293168 Pa)
  test("a point in bara/°C gives the field point's value converted, with standard conditions of 15 °C and 101.325 kPa", () => {
    const field = { pressure: 3250, temperature: 212 };
    const metric = { pressure: 3250 / BAR, temperature: 100 };
    for (const property of [
      "oil_fvf",
      "solution_gor",
      "oil_viscosity",
      "oil_density",
      "gas_fvf",
      "gas_viscosity",
      "z_factor",
    ] as const) {
      const grid = clean.grids[property];
      const f = runLookup(
        grid,
        [field],
        options(property, { method: "newton" }),
      );
      const m = runLookup(
        grid,
        [metric],
        options(property, { method: "newton", units: "metric" }),
      );
      const quantity = {
        oil_fvf: "oil_fvf",
        solution_gor: "gas_oil_ratio",
        oil_viscosity: "viscosity",
        oil_density: "density",
        gas_fvf: "gas_fvf",
        gas_viscosity: "viscosity",
        z_factor: "dimensionless",
      } as const;
      const canonical = interpolateGrid(grid, field, { method: "newton" });
      const expected = convertBetweenSystems(
        canonical.value,
        quantity[property],
        CANONICAL_UNIT_SYSTEM,
        METRIC_UNIT_SYSTEM,
      );
      expect(m.results[0]!.value).toBeCloseTo(expected, 9);
      expect(m.units.value.id).toBe(
        METRIC_UNIT_SYSTEM.units[quantity[property]],
      );
      expect(m.units.pressure.id).toBe("bara");
      expect(m.units.temperature.id).toBe("degC");
      expect(m.units.standardConditions).toBe("15 °C, 101.325 kPa");
      // the error estimate scales with the unit, never shifts (to 0.1 %: the metric point is the field
      // point only to rounding, and an error estimate is itself sensitive to rounding)
      const unitFactor =
        convertBetweenSystems(
          1,
          quantity[property],
          CANONICAL_UNIT_SYSTEM,
          METRIC_UNIT_SYSTEM,
        ) -
        convertBetweenSystems(
          0,
          quantity[property],
          CANONICAL_UNIT_SYSTEM,
          METRIC_UNIT_SYSTEM,
        );
      expect(
        Math.abs(
          m.results[0]!.errorEstimate! /
            (canonical.errorEstimate * unitFactor) -
            1,
        ),
      ).toBeLessThan(1e-3);
      expect(f.results[0]!.value).toBeGreaterThan(0);
    }
  });

  test("bubble point and stencil coordinates come back in bara and °C", () => {
    const r = runLookup(
      clean.grids.oil_fvf,
      [{ pressure: 200, temperature: 100 }],
      options("oil_fvf", { units: "metric" }),
    ).results[0]!;
    const e = interpolateGrid(
      clean.grids.oil_fvf,
      { pressure: 200 * BAR, temperature: 212 },
      { method: "newton" },
    );
    expect(r.bubblePointPressure!).toBeCloseTo(e.bubblePointPressure! / BAR, 6);
    expect(r.stencil!.pressures[0]!).toBeCloseTo(
      clean.grids.oil_fvf.pressures[r.stencil!.pressureIndices[0]!]! / BAR,
      9,
    );
    expect(r.stencil!.temperatures[0]!).toBeCloseTo(
      (clean.grids.oil_fvf.temperatures[r.stencil!.temperatureIndices[0]!]! -
        32) /
        1.8,
      9,
    );
  });

  test("Rs in sm³/sm³ at 15 °C/101.325 kPa: 1 scf/STB = 0.177765 sm³/sm³ (domain brief §5, ideal-gas change of base)", () => {
    const field = runLookup(
      clean.grids.solution_gor,
      [{ pressure: 4000, temperature: 212 }],
      options("solution_gor"),
    );
    const metric = runLookup(
      clean.grids.solution_gor,
      [{ pressure: 4000 / BAR, temperature: 100 }],
      options("solution_gor", { units: "metric" }),
    );
    expect(field.results[0]!.value).toBeCloseTo(600, 9); // above pb: Rsb
    expect(metric.results[0]!.value! / field.results[0]!.value!).toBeCloseTo(
      0.177765,
      5,
    );
  });
});

describe("automatic method: pchip where Newton overshoots", () => {
  // a step in pressure (reference, as the engine's overshoot test: the cubic through (0,0),(1,0),(2,0),(3,1)
  // is x(x−1)(x−2)/6, −1/16 at x = 1.5, below every data value), raised by 1 so that every value is a
  // possible z factor (invented data)
  const step: Grid = {
    pressures: [1, 2, 3, 4, 5, 6],
    temperatures: [10, 20],
    values: [1, 1, 1, 2, 2, 2].map((v) => [v, v]),
  };
  test("the overshooting point gets the pchip value, method 'pchip', the codes and a plain sentence", () => {
    const pts = [
      { pressure: 2.5, temperature: 15 },
      { pressure: 5.5, temperature: 15 },
    ];
    const out = runLookup(step, pts, {
      method: "auto",
      degree: [3, 1],
      property: "z_factor",
      units: "field",
    });
    const engine = interpolateGrid(step, pts[0]!, {
      method: "newton",
      degree: [3, 1],
    });
    expect(engine.warnings).toContain("overshoot");
    const r = out.results[0]!;
    expect(r.method).toBe("pchip");
    expect(r.value).toBe(engine.alternative!.value);
    expect(r.errorEstimate).toBe(engine.alternative!.errorEstimate);
    expect(r.warnings).toEqual(["overshoot", "pchip-fallback"]);
    expect(r.messages).toEqual([describeWarningCode("pchip-fallback")]);
    expect(r.messages![0]).toMatch(/shape-preserving \(pchip\) value instead/);
    expect(out.results[1]!.method).toBe("newton");
    expect(out.summary.methodCounts).toEqual({
      newton: 1,
      pchip: 1,
      linear: 0,
    });
    expect(out.summary.warningCounts).toEqual({
      overshoot: 1,
      "pchip-fallback": 1,
    });
  });

  test("explicit newton keeps its value and offers the pchip one alongside", () => {
    const r = runLookup(step, [{ pressure: 2.5, temperature: 15 }], {
      method: "newton",
      degree: [3, 1],
      property: "z_factor",
      units: "field",
    }).results[0]!;
    const engine = interpolateGrid(
      step,
      { pressure: 2.5, temperature: 15 },
      { method: "newton", degree: [3, 1] },
    );
    expect(r.value).toBe(engine.value);
    expect(r.method).toBe("newton");
    expect(r.alternative).toEqual(engine.alternative);
    expect(r.messages).toEqual([describeWarningCode("overshoot")]);
  });

  test("on a noisy generated oil grid every fallback equals the engine's pchip value, and only overshoots fall back", () => {
    const pts = points(3000, 5);
    const out = runLookup(noisy.grids.oil_fvf, pts, options("oil_fvf"));
    let fallbacks = 0;
    out.results.forEach((r, i) => {
      const newton = interpolateGrid(noisy.grids.oil_fvf, pts[i]!, {
        method: "newton",
        degree: [3, 3],
      });
      if (newton.warnings.includes("overshoot")) {
        fallbacks++;
        const pchip = interpolateGrid(noisy.grids.oil_fvf, pts[i]!, {
          method: "pchip",
          extrapolate: true,
        });
        expect(r.method).toBe("pchip");
        expect(r.value).toBe(pchip.value);
        expect(r.branch).toBe(pchip.branch);
        expect(r.bubblePointPressure!).toBeCloseTo(
          pchip.bubblePointPressure!,
          6,
        );
        expect(r.warnings).toContain("pchip-fallback");
      } else {
        expect(r.method).toBe("newton");
        expect(r.value).toBe(newton.value);
        expect(r.warnings).not.toContain("pchip-fallback");
      }
    });
    expect(fallbacks).toBeGreaterThan(0); // the check has something to check
    expect(out.summary.methodCounts.pchip).toBe(fallbacks);
  });

  test("messages: false leaves them out; warnings are shared frozen arrays", () => {
    const out = runLookup(
      noisy.grids.oil_fvf,
      points(500, 5),
      options("oil_fvf", { messages: false }),
    );
    expect(out.results.every((r) => r.messages === undefined)).toBe(true);
    const withWarnings = out.results.filter((r) => r.warnings.length > 0);
    expect(withWarnings.length).toBeGreaterThan(0);
    expect(Object.isFrozen(withWarnings[0]!.warnings)).toBe(true);
  });
});

describe("extrapolation", () => {
  test("refused by default, in place, with the range in the caller's units; served and marked when allowed", () => {
    const pt = { pressure: 450, temperature: 100 }; // bara: above 6000 psia
    const out = runLookup(
      clean.grids.oil_fvf,
      [{ pressure: 200, temperature: 100 }, pt],
      options("oil_fvf", { units: "metric" }),
    );
    expect(out.results[0]!.value).not.toBeNull();
    const refused = out.results[1]!;
    expect(refused.value).toBeNull();
    expect(refused.errorEstimate).toBeNull();
    expect(refused.method).toBeNull();
    expect(refused.stencil).toBeNull();
    expect(refused.refused!.code).toBe("outside-measured-range");
    // the second point sent is "Point 2"
    expect(refused.refused!.message).toMatch(
      /^Point 2 has pressure 450 bara, outside the measured range: the measured pressures of oil formation volume factor \(Bo\) run from 34\.4738 to 413\.685 bara\./,
    );
    expect(out.summary).toMatchObject({
      count: 2,
      refusedCount: 1,
      refusalCounts: { "outside-measured-range": 1 },
    });
    const r = runLookup(
      clean.grids.oil_fvf,
      [pt],
      options("oil_fvf", { units: "metric", extrapolate: true }),
    ).results[0]!;
    expect(r.warnings).toContain("extrapolated");
    expect(r.messages![0]).toMatch(/extrapolation/);
  });

  test("a temperature outside the range names the temperature axis in °F for field units", () => {
    const r = runLookup(
      clean.grids.gas_fvf,
      [{ pressure: 3000, temperature: 300 }],
      options("gas_fvf"),
    ).results[0]!;
    expect(r.refused!.message).toMatch(
      /^Point 1 has temperature 300 °F, outside the measured range: the measured temperatures of gas formation volume factor \(Bg\) run from 120 to 240 °F/,
    );
  });
});

describe("columns and the typed-array form", () => {
  const pts = points(400, 9);
  const columns = {
    pressures: Float64Array.from(pts, (p) => p.pressure),
    temperatures: Float64Array.from(pts, (p) => p.temperature),
  };
  test("Float64Array columns, number[] columns and point objects give the same results", () => {
    const a = runLookup(
      noisy.grids.oil_viscosity,
      pts,
      options("oil_viscosity"),
    );
    const b = runLookup(
      noisy.grids.oil_viscosity,
      columns,
      options("oil_viscosity"),
    );
    const c = runLookup(
      noisy.grids.oil_viscosity,
      {
        pressures: [...columns.pressures],
        temperatures: [...columns.temperatures],
      },
      options("oil_viscosity"),
    );
    expect(b).toEqual(a);
    expect(c).toEqual(a);
  });

  test("runLookupColumns carries the same numbers as runLookup", () => {
    for (const units of ["field", "metric"] as const) {
      const input =
        units === "field"
          ? columns
          : {
              pressures: columns.pressures.map((p) => p / 14.503773773022),
              temperatures: columns.temperatures.map((t) => (t - 32) / 1.8),
            };
      const objects = runLookup(
        noisy.grids.oil_fvf,
        input,
        options("oil_fvf", { units }),
      );
      const cols = runLookupColumns(
        noisy.grids.oil_fvf,
        input,
        options("oil_fvf", { units }),
      );
      expect(cols.count).toBe(pts.length);
      expect(cols.units).toEqual(objects.units);
      objects.results.forEach((r, i) => {
        expect(cols.values[i]).toBe(r.value);
        expect(cols.errorEstimates[i]).toBe(r.errorEstimate);
        expect(lookupWarningsFromFlags(cols.warnings[i]!)).toEqual(r.warnings);
        expect(METHOD_CODES[cols.methods[i]!]).toBe(r.method);
        expect(cols.bubblePointPressures![i]).toBe(r.bubblePointPressure);
        expect(cols.branches![i] === 1 ? "saturated" : "undersaturated").toBe(
          r.branch,
        );
      });
    }
  });

  test("explicit newton: alternatives are NaN except where Newton overshoots", () => {
    const cols = runLookupColumns(
      noisy.grids.oil_fvf,
      columns,
      options("oil_fvf", { method: "newton" }),
    );
    const objects = runLookup(
      noisy.grids.oil_fvf,
      columns,
      options("oil_fvf", { method: "newton" }),
    );
    objects.results.forEach((r, i) => {
      if (r.alternative)
        expect(cols.alternatives![i]).toBe(r.alternative.value);
      else if (cols.alternatives) expect(cols.alternatives[i]).toBeNaN();
    });
  });

  test("an empty batch is fine", () => {
    const out = runLookup(clean.grids.oil_fvf, [], options("oil_fvf"));
    expect(out.results).toEqual([]);
    expect(out.summary.count).toBe(0);
  });
});

describe("errors: typed, with codes and plain messages", () => {
  const grid = clean.grids.oil_fvf;
  const code = (f: () => unknown): string => {
    try {
      f();
    } catch (e) {
      if (e instanceof LookupError) return `${e.code}: ${e.message}`;
      throw e;
    }
    return "no error";
  };
  test.each([
    [
      { method: "spline" },
      /^INVALID_OPTIONS: method must be one of auto, newton, pchip, linear; got "spline"\./,
    ],
    [{ property: "water_fvf" }, /^INVALID_OPTIONS: property must be one of/],
    [{ units: "si" }, /^INVALID_OPTIONS: units must be 'field' or 'metric'/],
    [
      { degree: 0 },
      /^INVALID_OPTIONS: degree must be a whole number from 1 to 8; got 0\./,
    ],
    [
      { degree: [3, 2.5] },
      /^INVALID_OPTIONS: The temperature degree must be a whole number/,
    ],
    [
      { degree: [3] },
      /^INVALID_OPTIONS: degree as a list must be \[pressure degree, temperature degree\]/,
    ],
    [
      { extrapolate: "yes" },
      /^INVALID_OPTIONS: extrapolate must be true or false/,
    ],
  ])("options %j", (extra, message) => {
    expect(
      code(() =>
        runLookup(grid, [{ pressure: 3000, temperature: 200 }], {
          ...options("oil_fvf"),
          ...(extra as object),
        } as LookupOptions),
      ),
    ).toMatch(message);
  });

  test("bad points name their place (counted from 1) and unit", () => {
    expect(
      code(() =>
        runLookup(
          grid,
          [
            { pressure: 3000, temperature: 200 },
            { pressure: Number.NaN, temperature: 200 },
          ],
          options("oil_fvf"),
        ),
      ),
    ).toBe(
      "INVALID_POINT: Point 2 has pressure NaN psia: a finite number is needed.",
    );
    expect(
      code(() =>
        runLookup(
          grid,
          [{ pressure: -5, temperature: 90 }],
          options("oil_fvf", { units: "metric" }),
        ),
      ),
    ).toBe(
      "INVALID_POINT: Point 1 has pressure -5 bara: pressures are absolute and must be above zero.",
    );
    expect(
      code(() =>
        runLookup(
          grid,
          [{ pressure: 100, temperature: -300 }],
          options("oil_fvf", { units: "metric" }),
        ),
      ),
    ).toMatch(
      /^INVALID_POINT: Point 1 has temperature -300 °C: that is at or below absolute zero\./,
    );
    expect(
      code(() =>
        runLookup(grid, [null as unknown as LookupPoint], options("oil_fvf")),
      ),
    ).toMatch(/^INVALID_POINTS: Point 1 must be an object/);
    expect(
      code(() =>
        runLookup(
          grid,
          { pressures: [1, 2], temperatures: [3] },
          options("oil_fvf"),
        ),
      ),
    ).toBe(
      "INVALID_POINTS: pressures has 2 entries but temperatures has 1; they must pair up.",
    );
    expect(
      code(() =>
        runLookup(
          grid,
          "3000,200" as unknown as LookupPoint[],
          options("oil_fvf"),
        ),
      ),
    ).toMatch(/^INVALID_POINTS:/);
  });

  test("more than MAX_LOOKUP_POINTS points", () => {
    const many = {
      pressures: new Float64Array(MAX_LOOKUP_POINTS + 1),
      temperatures: new Float64Array(MAX_LOOKUP_POINTS + 1),
    };
    expect(code(() => runLookup(grid, many, options("oil_fvf")))).toBe(
      "TOO_MANY_POINTS: 100001 points were sent; one lookup takes at most 100000.",
    );
  });

  test("a malformed grid is a data problem, reported as such", () => {
    const bad: Grid = {
      pressures: [1000, 900],
      temperatures: [100],
      values: [[1], [2]],
    };
    expect(
      code(() =>
        runLookup(
          bad,
          [{ pressure: 950, temperature: 100 }],
          options("oil_fvf"),
        ),
      ),
    ).toMatch(
      /^INVALID_GRID: The stored table of oil formation volume factor \(Bo\) cannot be used: pressures must be strictly increasing/,
    );
  });

  test("missing cells around a point: refused no-measured-values, in the caller's units", () => {
    const holes: Grid = {
      pressures: [1000, 2000, 3000],
      temperatures: [100, 200],
      values: [
        [1, null],
        [null, null],
        [null, 2],
      ],
    };
    const r = runLookup(
      holes,
      [{ pressure: 2000, temperature: 150 }],
      options("oil_fvf"),
    ).results[0]!;
    expect(r.refused!.code).toBe("no-measured-values");
    expect(r.refused!.message).toMatch(
      /^Point 1 \(2000 psia, 150 °F\): no measured values/,
    );
  });
});
