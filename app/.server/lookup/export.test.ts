// What the lookup export and the saved-set runs keep of the API's per-point results, and the measured digits
// of a grid read in the laboratory's unit (here sm³/sm³, stored as scf/STB).
import { expect, test } from "vitest";
import { toCanonical } from "~/core/units";
import { gridDigits, readLookupPoints } from "./export";

test("served and refused points, under either name the API has used for a refusal", () => {
  const json = JSON.stringify([
    {
      value: 1.2,
      errorEstimate: 0.001,
      warnings: ["extrapolated"],
      method: "newton",
      stencil: { pressure: [0], temperature: [0] },
    },
    {
      value: null,
      errorEstimate: null,
      warnings: [],
      method: null,
      refused: { code: "outside-measured-range", message: "Point 2: …" },
    },
    {
      value: null,
      errorEstimate: null,
      warnings: [],
      method: "linear",
      refusal: { code: "not_computable", message: "Point 3: …" },
    },
  ]);
  expect(readLookupPoints(new TextEncoder().encode(json))).toEqual([
    {
      value: 1.2,
      errorEstimate: 0.001,
      warnings: ["extrapolated"],
      method: "newton",
    },
    {
      value: null,
      errorEstimate: null,
      warnings: [],
      method: null,
      refused: { code: "outside-measured-range", message: "Point 2: …" },
    },
    {
      value: null,
      errorEstimate: null,
      warnings: [],
      method: "linear",
      refused: { code: "not_computable", message: "Point 3: …" },
    },
  ]);
});

test("a grid's digits in the unit the laboratory reported; unknown units and no grid say nothing", () => {
  const values = [
    [101.25, 95.5],
    [null, 88],
  ].map((row) =>
    row.map((v) =>
      v === null ? null : toCanonical(v, "gas_oil_ratio", "sm3/sm3"),
    ),
  );
  const grid = {
    pressures: [1000, 2000],
    temperatures: [150, 200],
    values,
    sourceUnit: "sm3/sm3",
  };
  expect(gridDigits(grid, "solution_gor")).toBe(5);
  expect(
    gridDigits({ ...grid, sourceUnit: "no such unit" }, "solution_gor"),
  ).toBeNull();
  expect(gridDigits(undefined, "solution_gor")).toBeNull();
});
