// Golden tests against SciPy. Each fixture file names the SciPy function and version that produced its
// expected values (reference-data/interpolation/make-fixtures.py); the checks below quote them.
import { describe, expect, test } from "vitest";
import linearJson from "../../../reference-data/interpolation/linear.json";
import newtonJson from "../../../reference-data/interpolation/newton.json";
import pchipJson from "../../../reference-data/interpolation/pchip.json";
import { explainInterpolation, interpolateGrid } from "./index";
import type { Grid, Options, Point } from "./index";

type Check = { degree: number; zone: number[]; value: number };
type Case = {
  grid: string;
  label: string;
  point: Point;
  options: Options;
  value: number;
  stencil?: { pressure: number[]; temperature: number[] };
  degreeReduced?: boolean;
  checkPressure?: Check;
  checkTemperature?: Check;
};
type Fixture = {
  library: string;
  version: string;
  function: string;
  grids: Record<string, Grid>;
  cases: Case[];
};

const linear = linearJson as unknown as Fixture;
const newton = newtonJson as unknown as Fixture;
const pchip = pchipJson as unknown as Fixture;

function relErr(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.max(Math.abs(expected), 1e-300);
}

function name(c: Case): string {
  return `${c.grid} · ${JSON.stringify(c.options.degree ?? "")} · ${c.label} (${c.point.pressure}, ${c.point.temperature})`;
}

test("fixtures name their library, version and function", () => {
  for (const f of [linear, newton, pchip]) {
    expect(f.library).toBe("SciPy");
    expect(f.version).toMatch(/^\d+\.\d+/);
    expect(f.cases.length).toBeGreaterThan(50);
  }
  expect(linear.function).toContain("RegularGridInterpolator(method='linear'");
  expect(newton.function).toBe("scipy.interpolate.BarycentricInterpolator");
  expect(pchip.function).toBe("scipy.interpolate.PchipInterpolator");
});

describe(`linear vs ${linear.function} (SciPy ${linear.version})`, () => {
  test.each(linear.cases.map((c) => [name(c), c] as const))("%s", (_, c) => {
    const r = interpolateGrid(linear.grids[c.grid]!, c.point, c.options);
    // reference: SciPy RegularGridInterpolator, linear, version in the fixture header
    expect(relErr(r.value, c.value)).toBeLessThan(1e-12);
    // reference: the zone rule of issue 3 for degree 1 (the cell), re-implemented in the fixture script
    expect(r.stencil).toMatchObject(c.stencil!);
    expect(r.warnings.includes("extrapolated")).toBe(
      c.options.extrapolate === true,
    );
  });
});

describe(`newton vs ${newton.function} on the zone (SciPy ${newton.version})`, () => {
  test.each(newton.cases.map((c) => [name(c), c] as const))("%s", (_, c) => {
    const grid = newton.grids[c.grid]!;
    const r = interpolateGrid(grid, c.point, c.options);
    // reference: SciPy BarycentricInterpolator, two steps on the zone; the contract asks for 1e-9 relative
    expect(relErr(r.value, c.value)).toBeLessThan(1e-9);
    // reference: the zone rule of issue 3, re-implemented independently in the fixture script
    expect(r.stencil).toMatchObject(c.stencil!);
    expect(r.warnings.includes("degree-reduced")).toBe(c.degreeReduced);
    expect(r.warnings.includes("extrapolated")).toBe(
      c.options.extrapolate === true,
    );
    // the error estimate's parts are the changes when one axis' degree is raised (or lowered) by one,
    // each recomputed by SciPy BarycentricInterpolator on its own zone
    const e = explainInterpolation(grid, c.point, c.options);
    const tol = 1e-9 * Math.max(1, Math.abs(c.value));
    expect(
      Math.abs(
        e.errorParts.pressure -
          Math.abs((c.checkPressure?.value ?? c.value) - c.value),
      ),
    ).toBeLessThan(tol);
    expect(
      Math.abs(
        e.errorParts.temperature -
          Math.abs((c.checkTemperature?.value ?? c.value) - c.value),
      ),
    ).toBeLessThan(tol);
    expect(r.errorEstimate).toBeGreaterThan(0);
  });
});

describe(`pchip vs ${pchip.function}, pressure then temperature (SciPy ${pchip.version})`, () => {
  test.each(pchip.cases.map((c) => [name(c), c] as const))("%s", (_, c) => {
    const r = interpolateGrid(pchip.grids[c.grid]!, c.point, c.options);
    // reference: SciPy PchipInterpolator along pressure per column, then along temperature
    expect(relErr(r.value, c.value)).toBeLessThan(1e-11);
    expect(r.warnings.includes("extrapolated")).toBe(
      c.options.extrapolate === true,
    );
  });
});
