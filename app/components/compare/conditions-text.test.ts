import { expect, test } from "vitest";
import {
  convertConditionsText,
  defaultConditionsText,
} from "./conditions-text";
import type { CompareSampleOption } from "./types";

const option = (
  id: number,
  reservoirPressure: number | null,
  reservoirTemperature: number | null,
): CompareSampleOption => ({
  id,
  label: `S-${id}`,
  field: "F",
  well: "W",
  approvedRevision: 1,
  properties: ["oil_fvf"],
  reservoirPressure,
  reservoirTemperature,
});
const chosen = (id: number) => ({
  id,
  label: `S-${id}`,
  revision: 1,
  grid: null,
});

test("the conditions box opens with each chosen sample's reservoir conditions once, 4 significant digits", () => {
  const samples = [
    option(1, 5123.45, 221.04),
    option(2, 5123.4, 221.01),
    option(3, null, 200),
    option(4, 3000, 180),
  ];
  expect(
    defaultConditionsText({
      samples,
      selected: [chosen(4), chosen(1), chosen(2), chosen(3)],
    }),
  ).toBe("3000, 180\n5123, 221");
  expect(defaultConditionsText({ samples, selected: [] })).toBe("");
});

test("typed conditions follow a unit change: pressures with 5, temperatures with 4 significant digits", () => {
  // 3250 psia = 224.0797 bar; 212 °F = 100 °C; 100 bar = 1450.377 psia; 20 °C = 68 °F
  expect(convertConditionsText("3250, 212", "field", "metric")).toBe(
    "224.08, 100",
  );
  expect(convertConditionsText("100\t20\n50; 15", "metric", "field")).toBe(
    "1450.4, 68\n725.19, 59",
  );
});

test("text that does not parse, or the same unit system, is kept as typed", () => {
  expect(convertConditionsText("3250 psia", "field", "metric")).toBe(
    "3250 psia",
  );
  expect(convertConditionsText("3250,212", "field", "field")).toBe("3250,212");
});
