import { expect, test } from "vitest";
import { PROPERTY_KEYS } from "../units";
import { datasetFromCanonicalGrids } from "./dataset";
import { parseUpload } from "./parse-upload";
import { runQc } from "./qc/run-qc";
import {
  buildTemplateCsv,
  buildTemplateXlsx,
  templateDataset,
  templateFileName,
} from "./templates";
import { bytesOf, datasetOf } from "./uploads.test-helpers";
import type { ParsedDataset } from "./types";
import { layoutSheets, toCsv, toXlsx } from "./write-tables";

/** Same grids (axes and values to 1e-9 relative) and bubble points. */
function expectSameGrids(actual: ParsedDataset, expected: ParsedDataset): void {
  for (const key of PROPERTY_KEYS) {
    const a = actual.properties[key];
    const e = expected.properties[key];
    expect(Boolean(a), key).toBe(Boolean(e));
    if (!a || !e) continue;
    expect(a.pressures.length, key).toBe(e.pressures.length);
    const close = (x: number, y: number | undefined): void =>
      expect(Math.abs(x - (y ?? Number.NaN))).toBeLessThanOrEqual(
        1e-9 * Math.abs(x),
      );
    a.pressures.forEach((p, i) => close(p, e.pressures[i]));
    a.temperatures.forEach((t, j) => close(t, e.temperatures[j]));
    a.values.forEach((row, i) =>
      row.forEach((v, j) => {
        const w = e.values[i]?.[j] ?? null;
        if (w === null || v === null) expect(v, `${key}[${i}][${j}]`).toBe(w);
        else
          expect(
            Math.abs(v - w) / Math.abs(w),
            `${key}[${i}][${j}]`,
          ).toBeLessThan(1e-9);
      }),
    );
    expect(a.unit.id, key).toBe(e.unit.id);
  }
  expect(actual.bubblePoints.length).toBe(expected.bubblePoints.length);
  actual.bubblePoints.forEach((b, k) => {
    expect(
      Math.abs(
        b.temperature - (expected.bubblePoints[k]?.temperature ?? Number.NaN),
      ),
    ).toBeLessThan(1e-9);
    expect(
      Math.abs(
        b.pressure / (expected.bubblePoints[k]?.pressure ?? Number.NaN) - 1,
      ),
    ).toBeLessThan(1e-9);
  });
}

for (const layout of ["long", "grid"] as const) {
  test(`the ${layout} CSV template round-trips through parseUpload`, async () => {
    const csv = buildTemplateCsv(layout);
    expect(csv).toMatch(/^# Isopleth upload template/);
    expect(csv).toContain("INVENTED");
    // eslint-disable-next-line no-control-regex -- the allowed set names tab, LF and CR on purpose
    expect(/^[\x09\x0a\x0d\x20-\x7e]*$/.test(csv)).toBe(true); // ASCII: opens cleanly in any spreadsheet program
    const outcome = await parseUpload({
      filename: templateFileName(layout, "csv"),
      bytes: bytesOf(csv),
    });
    const d = datasetOf(outcome);
    expect(outcome.warnings).toEqual([]);
    expect(d.file?.layout).toBe(layout);
    expectSameGrids(d, templateDataset());
  });

  test(`the ${layout} XLSX template round-trips through parseUpload`, async () => {
    const bytes = await buildTemplateXlsx(layout);
    expect([...bytes.subarray(0, 4)]).toEqual([0x50, 0x4b, 0x03, 0x04]);
    const outcome = await parseUpload({
      filename: templateFileName(layout, "xlsx"),
      bytes,
    });
    const d = datasetOf(outcome);
    expect(d.file).toMatchObject({ format: "xlsx", layout });
    if (layout === "grid") expect(d.file?.sheets?.length).toBe(8); // a bubble-point sheet and one per property
    expectSameGrids(d, templateDataset());
  }, 30_000);
}

test("the template's invented example passes QC without errors or warnings (fluid: 35 °API, γg 0.75)", () => {
  const findings = runQc(templateDataset(), {
    apiGravity: 35,
    gasGravity: 0.75,
  });
  expect(findings.filter((f) => f.severity !== "info")).toEqual([]);
});

test("writers: a metric dataset written with semicolons and decimal commas, or to XLSX, reads back the same", async () => {
  const dataset = datasetFromCanonicalGrids({
    properties: {
      oil_fvf: {
        pressures: [1450.377, 2900.754, 4351.131],
        temperatures: [176, 212],
        values: [
          [1.3, 1.33],
          [1.29, null],
          [1.28, 1.31],
        ],
        displayUnit: "rm3/sm3",
        pressureUnit: "bara",
        temperatureUnit: "degC",
      },
      solution_gor: {
        pressures: [1450.377],
        temperatures: [212],
        values: [[500]],
        displayUnit: "sm3/sm3",
        pressureUnit: "bara",
        temperatureUnit: "degC",
      },
    },
    bubblePoints: [{ temperature: 212, pressure: 1500 }],
  });
  for (const layout of ["long", "grid"] as const) {
    const sheets = layoutSheets(
      dataset,
      layout,
      { unitLabels: "symbols" },
      true,
    );
    const csv = toCsv(sheets[0]?.rows ?? [], {
      delimiter: ";",
      decimalMark: ",",
    });
    expect(csv).toContain(";");
    const fromCsv = datasetOf(
      await parseUpload({
        filename: `metric-${layout}.csv`,
        bytes: bytesOf(csv),
      }),
    );
    expect(fromCsv.file?.decimalMark).toBe(",");
    expectSameGrids(fromCsv, dataset);
    const xlsx = await toXlsx(layoutSheets(dataset, layout));
    expectSameGrids(
      datasetOf(
        await parseUpload({ filename: `metric-${layout}.xlsx`, bytes: xlsx }),
      ),
      dataset,
    );
  }
}, 30_000);

test("an unknown layout is a typed error", () => {
  expect(() => buildTemplateCsv("wide" as never)).toThrow(
    expect.objectContaining({ code: "UNKNOWN_LAYOUT" }),
  );
});
