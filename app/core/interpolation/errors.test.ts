// Bad input gives a typed error with a code and a message a person can act on.
// Reference for what counts as bad: the contract in issue 3 (strictly increasing axes, rectangular values,
// finite numbers or null, degree ≥ 1).
import { describe, expect, test } from "vitest";
import {
  interpolateGrid,
  interpolateGridMany,
  InterpolationError,
} from "./index";
import type { Grid, InterpolationErrorCode, Options } from "./index";

const good = (): Grid => ({
  pressures: [1000, 2000, 3000],
  temperatures: [100, 150],
  values: [
    [1.1, 1.2],
    [1.3, 1.4],
    [1.5, 1.6],
  ],
});
const at = { pressure: 1500, temperature: 120 };
const newton: Options = { method: "newton" };

function thrown(fn: () => unknown): InterpolationError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InterpolationError);
    return e as InterpolationError;
  }
  throw new Error("expected an InterpolationError");
}

function expectError(
  fn: () => unknown,
  code: InterpolationErrorCode,
  ...fragments: (string | RegExp)[]
): void {
  const e = thrown(fn);
  expect(e.code).toBe(code);
  expect(e.name).toBe("InterpolationError");
  for (const f of fragments) expect(e.message).toMatch(f);
}

describe("axes", () => {
  test("unsorted pressures name the index and both values", () => {
    const g = good();
    g.pressures = [1000, 3000, 2000];
    expectError(
      () => interpolateGrid(g, at, newton),
      "axis-not-increasing",
      "pressures[2] = 2000",
      "smaller than pressures[1] = 3000",
    );
  });
  test("a duplicate temperature says so", () => {
    const g = good();
    g.temperatures = [100, 100];
    expectError(
      () => interpolateGrid(g, at, newton),
      "axis-not-increasing",
      "temperatures[1] = 100",
      "appears twice",
    );
  });
  test("NaN and Infinity in an axis", () => {
    const g = good();
    g.pressures = [1000, NaN, 3000];
    expectError(
      () => interpolateGrid(g, at, newton),
      "axis-not-finite",
      "pressures[1] is NaN",
    );
    g.pressures = [1000, 2000, Infinity];
    expectError(
      () => interpolateGrid(g, at, newton),
      "axis-not-finite",
      "pressures[2] is Infinity",
    );
  });
  test("an empty axis", () => {
    const g = good();
    g.temperatures = [];
    expectError(
      () => interpolateGrid(g, at, newton),
      "axis-empty",
      "no temperatures",
    );
  });
});

describe("values", () => {
  test("too few rows", () => {
    const g = good();
    g.values = g.values.slice(0, 2);
    expectError(
      () => interpolateGrid(g, at, newton),
      "ragged-values",
      "2 rows but there are 3 pressures",
    );
  });
  test("a short row names its row and pressure", () => {
    const g = good();
    g.values[1] = [1.3];
    expectError(
      () => interpolateGrid(g, at, newton),
      "ragged-values",
      "values[1] (pressure 2000) has 1 entries but there are 2 temperatures",
    );
  });
  test("NaN or Infinity in the data names the cell and says to use null", () => {
    const g = good();
    g.values[2]![1] = NaN;
    expectError(
      () => interpolateGrid(g, at, newton),
      "value-not-finite",
      "values[2][1] (pressure 3000, temperature 150) is NaN",
      "null",
    );
    g.values[2]![1] = -Infinity;
    expectError(
      () => interpolateGrid(g, at, newton),
      "value-not-finite",
      "is -Infinity",
    );
  });
  test("bubble points of the wrong length or not finite", () => {
    const g = good();
    g.bubblePoints = [2000];
    expectError(
      () => interpolateGrid(g, at, newton),
      "invalid-bubble-points",
      "1 entries but there are 2 temperatures",
    );
    g.bubblePoints = [2000, NaN];
    expectError(
      () => interpolateGrid(g, at, newton),
      "invalid-bubble-points",
      "bubblePoints[1] (temperature 150) is NaN",
    );
  });
  test("a grid that is not an object", () => {
    expectError(
      () => interpolateGrid(null as unknown as Grid, at, newton),
      "invalid-grid-shape",
    );
  });
});

describe("points", () => {
  test("NaN or Infinity in a point", () => {
    expectError(
      () =>
        interpolateGrid(good(), { pressure: NaN, temperature: 120 }, newton),
      "invalid-point",
      "pressure NaN",
    );
    expectError(
      () =>
        interpolateGrid(
          good(),
          { pressure: 1500, temperature: Infinity },
          newton,
        ),
      "invalid-point",
      "temperature Infinity",
    );
  });
  test("out of range names the axis, the value and the measured range", () => {
    const e = thrown(() =>
      interpolateGrid(good(), { pressure: 3500, temperature: 120 }, newton),
    );
    expect(e.code).toBe("out-of-range");
    expect(e.message).toBe(
      "The measured pressures run from 1000 to 3000; the pressure 3500 is above that range. Pass extrapolate: true to extrapolate; the result is then marked 'extrapolated'.",
    );
    expect(e.details).toMatchObject({
      axis: "pressure",
      value: 3500,
      min: 1000,
      max: 3000,
    });
    expectError(
      () =>
        interpolateGrid(good(), { pressure: 1500, temperature: 90 }, newton),
      "out-of-range",
      "temperature 90 is below",
    );
  });
  test("with extrapolate: a value and the extrapolated warning", () => {
    const r = interpolateGrid(
      good(),
      { pressure: 3500, temperature: 120 },
      { method: "linear", extrapolate: true },
    );
    expect(Number.isFinite(r.value)).toBe(true);
    // the calibration of the estimate covers points inside the table only
    expect(r.warnings).toEqual(["extrapolated", "estimate-unreliable"]);
  });
  test("a one-column table is measured at one temperature", () => {
    const g: Grid = {
      pressures: [1000, 2000, 3000],
      temperatures: [212],
      values: [[1.1], [1.2], [1.4]],
    };
    expectError(
      () => interpolateGrid(g, { pressure: 1500, temperature: 200 }, newton),
      "out-of-range",
      "single temperature, 212",
    );
    expect(
      interpolateGrid(g, { pressure: 1500, temperature: 212 }, newton).warnings,
    ).toEqual(["degree-reduced"]);
  });
  test("a batch names the failing point (the typed batch refuses it in place instead)", () => {
    const pts = {
      pressures: Float64Array.from([1500, 1600, 9000]),
      temperatures: Float64Array.from([120, 120, 120]),
    };
    const out = interpolateGridMany(good(), pts, newton);
    expect(Array.from(out.refusals!)).toEqual([0, 0, 1]);
    expect(Number.isNaN(out.values[2]!)).toBe(true);
    expect(Number.isFinite(out.values[1]!)).toBe(true);
    expectError(
      () =>
        interpolateGridMany(
          good(),
          {
            pressures: Float64Array.from([1]),
            temperatures: new Float64Array(2),
          },
          newton,
        ),
      "invalid-point",
      "must pair up",
    );
    expectError(
      () =>
        interpolateGridMany(
          good(),
          [at, { pressure: "x" } as unknown as typeof at],
          newton,
        ),
      "invalid-point",
      "Point 1",
    );
    const e2 = thrown(() =>
      interpolateGridMany(
        good(),
        [at, at, { pressure: 9000, temperature: 120 }],
        newton,
      ),
    );
    expect(e2.code).toBe("out-of-range");
    expect(e2.message).toMatch(
      /^Point 2: The measured pressures run from 1000 to 3000/,
    );
    expect(e2.details).toMatchObject({ pointIndex: 2, axis: "pressure" });
  });
});

describe("options", () => {
  test("degree below 1, fractional, too high, or a bad pair", () => {
    expectError(
      () => interpolateGrid(good(), at, { method: "newton", degree: 0 }),
      "invalid-options",
      "whole number from 1 to 8; got 0",
    );
    expectError(
      () => interpolateGrid(good(), at, { method: "newton", degree: 2.5 }),
      "invalid-options",
      "got 2.5",
    );
    expectError(
      () => interpolateGrid(good(), at, { method: "newton", degree: 9 }),
      "invalid-options",
    );
    expectError(
      () => interpolateGrid(good(), at, { method: "newton", degree: [3, 0] }),
      "invalid-options",
      "temperature degree",
    );
    expectError(
      () =>
        interpolateGrid(good(), at, {
          method: "newton",
          degree: [3] as unknown as [number, number],
        }),
      "invalid-options",
      "[pressure degree, temperature degree]",
    );
    // checked for every method, even where the degree is not used
    expectError(
      () => interpolateGrid(good(), at, { method: "pchip", degree: -1 }),
      "invalid-options",
    );
  });
  test("an unknown method", () => {
    expectError(
      () =>
        interpolateGrid(good(), at, { method: "cubic" } as unknown as Options),
      "invalid-options",
      "'linear', 'newton' or 'pchip'",
    );
  });
});
