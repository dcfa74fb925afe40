import { expect, test } from "vitest";
import { unitLabel } from "~/core/units";
import type { StoredGrid } from "~/.server/db/queries/revisions";
import { diffRevisions, presentDiff } from "./diff";

/* The diff page's view: cells in the reader's units, counted by property, at most a limit listed per kind. */

const grid = (values: (number | null)[][]): StoredGrid => ({
  property: "oil_fvf",
  unit: "rb/STB",
  sourceUnit: null,
  pressures: [1000, 2000],
  temperatures: [200],
  values,
});
const older = {
  grids: [grid([[1.2], [1.3]])],
  bubblePoints: [{ temperatureF: 200, bubblePointPsia: 2500 }],
};
const newer = {
  grids: [grid([[1.25], [null]])],
  bubblePoints: [{ temperatureF: 200, bubblePointPsia: 2600 }],
};

test("field units: the values as stored, the bubble point in the pressure unit, counts by property", () => {
  const shown = presentDiff(diffRevisions(older, newer), "field");
  expect(shown.counts).toEqual({
    changed: 2,
    added: 0,
    removed: 1,
    unchanged: 0,
  });
  expect(shown.changed).toEqual([
    {
      property: "bubble_point",
      unit: "psia",
      pressure: null,
      temperature: 200,
      from: 2500,
      to: 2600,
    },
    {
      property: "oil_fvf",
      unit: unitLabel("field", "oil_fvf"),
      pressure: 1000,
      temperature: 200,
      from: 1.2,
      to: 1.25,
    },
  ]);
  expect(shown.removed[0]).toMatchObject({ pressure: 2000, to: null });
  expect(shown.byProperty).toEqual([
    { property: "bubble_point", changed: 1, added: 0, removed: 0 },
    { property: "oil_fvf", changed: 1, added: 0, removed: 1 },
  ]);
});

test("metric units: pressures and temperatures converted and rounded to 10 significant digits", () => {
  const shown = presentDiff(diffRevisions(older, newer), "metric");
  const bo = shown.changed.find((r) => r.property === "oil_fvf")!;
  expect(bo.temperature).toBeCloseTo(93.333333333, 8);
  expect(
    String(bo.temperature).replace(/[.-]/g, "").length,
  ).toBeLessThanOrEqual(10);
  expect(bo.pressure).not.toBe(1000);
  expect(shown.changed[0]!.unit).toBe(unitLabel("metric", "pressure"));
});

test("only the first rows are listed; the counts stay complete", () => {
  const shown = presentDiff(diffRevisions(older, newer), "field", 1);
  expect(shown.changed).toHaveLength(1);
  expect(shown.counts.changed).toBe(2);
});
