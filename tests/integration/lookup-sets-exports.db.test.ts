// Saved lookup sets, their runs and the exports, against a real MariaDB with the invented demo scenario
// (app/.server/db/seed.ts: sample 1, CS-1 BH-01, measured at 400 … 5400 psia and 150 … 240 °F, reservoir
// temperature 212 °F). The numbers are checked against the engine run directly on the revision's grid (the
// engine is checked against SciPy in app/core/interpolation); here we check that runs use, record and show the
// set's settings, that refusals stay refusals, and that the files read back as written (exceljs, csv-parse).
import { parse } from "csv-parse/sync";
import ExcelJS from "exceljs";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import type { ApiCaller } from "~/.server/api/caller";
import { parseApiQuery } from "~/.server/api/request";
import { TableQuery } from "~/.server/api/schemas";
import { tableResponse } from "~/.server/api/table";
import {
  createLookupRun,
  getLookupSet,
  listLookupRuns,
  listLookupSets,
} from "~/.server/db/queries/lookup-sets";
import { getSampleWithPlace } from "~/.server/db/queries/samples";
import { getUserCredentialsByEmail } from "~/.server/db/queries/users";
import { seedDemo } from "~/.server/db/seed";
import { lookupExportSheet } from "~/.server/lookup/export";
import {
  getLookupSetPage,
  lookupRunSheet,
  runLookupSet,
  saveLookupSet,
} from "~/.server/lookup/sets";
import {
  getRevisionData,
  resolveRevision,
} from "~/.server/samples/revision-data";
import { sheetDownload, sheetToXlsx } from "~/.server/spreadsheet";
import { runLookup } from "~/core/lookup";
import { TABLE_CAUTION } from "~/core/tables";
import { toOutputPressure } from "~/core/units";
import { useFreshMigratedDatabase } from "../support/app-database";

let cleanup: () => Promise<void>;
/** A value with binary round-off, as computed values carry: 1.3388517999999998. */
const NOISY = (1.3388518 * 3 * 0.1) / (3 * 0.1);
let engineerId: number;

beforeAll(async () => {
  const fresh = await useFreshMigratedDatabase();
  cleanup = fresh.cleanup;
  await seedDemo(fresh.db, { demoPassword: "demo-password-for-tests" });
  const engineer = await getUserCredentialsByEmail("engineer@calder.example");
  engineerId = engineer!.id;
}, 60_000);
afterAll(async () => cleanup?.());

async function sample1Grid(property: "oil_fvf" | "gas_fvf") {
  const revision = await resolveRevision(1);
  const data = await getRevisionData(revision!);
  return { data, grid: data.grids[property]! };
}

async function saveSet(
  name: string,
  settings: { extrapolate: boolean; units: "field" | "metric" },
  conditions: { pressure: number; temperature: number }[],
) {
  await saveLookupSet(engineerId, {
    intent: "save-set",
    name,
    sampleId: 1,
    pressureBasis: "absolute",
    properties: ["oil_fvf", "gas_fvf"],
    method: "newton",
    degree: [2, 2],
    conditions,
    ...settings,
  });
  const sets = await listLookupSets(engineerId);
  return sets.find((s) => s.name === name)!;
}

describe("saved sets keep and honour their settings", () => {
  test("a set saved in metric with extrapolation on: its run is computed and recorded in metric, degree [2,2]", async () => {
    // 6000 psia lies outside the measured 400 … 5400 psia.
    const set = await saveSet(
      "metric, extrapolation on",
      { extrapolate: true, units: "metric" },
      [
        { pressure: 200, temperature: 100 },
        { pressure: toOutputPressure(6000, "metric"), temperature: 100 },
      ],
    );
    expect(set).toMatchObject({ units: "metric", extrapolate: true });
    const outcome = await runLookupSet(set.id, engineerId);
    expect(outcome?.error).toBeNull();
    const [run] = await listLookupRuns(set.id);
    expect(run).toMatchObject({
      method: "newton",
      degree: [2, 2],
      extrapolate: true,
      units: "metric",
      valueUnits: { oil_fvf: "rm³/sm³" },
    });
    // The same lookup by the engine directly, on the revision's grid, in metric.
    const { grid } = await sample1Grid("oil_fvf");
    const stored = await getLookupSet(set.id, engineerId);
    const direct = runLookup(
      grid,
      stored!.conditions.map((c) => ({
        pressure: toOutputPressure(c.pressurePsia, "metric"),
        temperature: ((c.temperatureF - 32) * 5) / 9,
      })),
      {
        property: "oil_fvf",
        method: "newton",
        degree: [2, 2],
        extrapolate: true,
        units: "metric",
      },
    );
    const bo = run!.results.oil_fvf!;
    expect(bo[0]!.value).toBeCloseTo(direct.results[0]!.value!, 12);
    expect(bo[0]!.method).toBe(direct.results[0]!.method);
    expect(bo[1]!.warnings).toContain("extrapolated");

    const page = await getLookupSetPage(set.id, engineerId);
    expect(page!.set.settings.text).toMatch(/extrapolation on · metric units$/);
    expect(page!.run!.pressureUnit).toBe("bara");
    expect(page!.run!.rows[0]!.pressure).toBe(200);
    const cell = page!.run!.rows[1]!.cells[0]!;
    expect(cell.warnings).toContain("extrapolated");
    expect(cell.method).toBe(bo[1]!.method);
    expect(cell.errorEstimate).not.toBeUndefined();
  });

  test("a set saved with extrapolation off never shows an ordinary value at 6000 psia", async () => {
    const set = await saveSet(
      "field, extrapolation off",
      { extrapolate: false, units: "field" },
      [
        { pressure: 3000, temperature: 212 },
        { pressure: 6000, temperature: 212 },
      ],
    );
    const outcome = await runLookupSet(set.id, engineerId);
    const [run] = await listLookupRuns(set.id);
    if (run) {
      // Refused in place (the per-point form of the lookup).
      expect(run.extrapolate).toBe(false);
      const point = run.results.oil_fvf![1]!;
      expect(point.value).toBeNull();
      expect(point.refused?.message).toMatch(/outside the measured range/);
      expect(run.results.oil_fvf![0]!.value).toBeGreaterThan(1);
    } else {
      // A lookup that refuses the whole request for one point: the run says so and records nothing.
      expect(outcome?.error).toMatch(/outside the measured range/);
    }
  });

  test("refused points show as refused with their reason, in the page and in both exports; two runs compare", async () => {
    const set = await saveSet(
      "refusals and comparison",
      { extrapolate: false, units: "field" },
      [
        { pressure: 3000, temperature: 212 },
        { pressure: 6000, temperature: 212 },
      ],
    );
    const { data } = await sample1Grid("oil_fvf");
    const message =
      "Point 2: pressure 6000 psia lies outside the measured range of oil formation volume factor (400 to 5400 psia).";
    const base = {
      setId: set.id,
      revisionId: data.revisionId,
      revisionNumber: data.number,
      method: "newton",
      degree: [2, 2] as [number, number],
      extrapolate: false,
      units: "field" as const,
      valueUnits: { oil_fvf: "rb/STB" },
      createdBy: engineerId,
    };
    const refused = {
      value: null,
      errorEstimate: null,
      warnings: [],
      method: null,
      refused: { code: "outside-measured-range", message },
    };
    const first = await createLookupRun({
      ...base,
      results: {
        oil_fvf: [
          {
            value: NOISY,
            errorEstimate: 4.842082290679173e-15,
            warnings: [],
            method: "newton",
          },
          refused,
        ],
      },
    });
    const second = await createLookupRun({
      ...base,
      results: {
        oil_fvf: [
          {
            value: 1.3522,
            errorEstimate: 0.0004,
            warnings: ["near-bubble-point"],
            method: "newton",
          },
          refused,
        ],
      },
    });

    const page = await getLookupSetPage(set.id, engineerId, {
      run: first,
      compare: [first, second],
    });
    const cell = page!.run!.rows[1]!.cells[0]!;
    expect(cell).toMatchObject({ value: null, refused: message });
    expect(page!.run!.refused).toBe(1);
    const change = page!.compare!.rows[0]!.cells[0]!;
    expect(change.a).toBe(NOISY);
    expect(change.b).toBe(1.3522);
    expect(change.difference).toBeCloseTo(1.3522 - NOISY, 12);
    // (1.3522 − 1.3388518) / 1.3388518 = 0.99699 % (by hand).
    expect(change.relativePercent).toBeCloseTo(0.997, 3);
    expect(change.beyondEstimates).toBe(true);
    expect(page!.compare!.changedCount).toBe(1);
    expect(page!.compare!.rows[1]!.cells[0]!.bNote).toBe(message);

    // The export: XLSX read back with exceljs, CSV with csv-parse.
    const found = await lookupRunSheet(set.id, first, engineerId);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await sheetToXlsx(found!.sheet)).buffer as ArrayBuffer);
    const ws = wb.worksheets[0]!;
    const lines = Array.from(ws.getSheetValues(), (r) =>
      Array.isArray(r) ? r.slice(1) : [],
    );
    const headerRow = lines.findIndex((r) => r[0] === "Pressure (psia)");
    expect(lines[headerRow]).toEqual([
      "Pressure (psia)",
      "Temperature (°F)",
      "Oil formation volume factor (rb/STB)",
      "Oil formation volume factor error estimate (rb/STB)",
      "Oil formation volume factor method",
      "Oil formation volume factor warnings",
    ]);
    expect(lines.flat()).toContain(`Caution: ${TABLE_CAUTION}`);
    // The grid's measured digits (at most 6 when they cannot be read off the grid) cap the value's digits.
    const value = lines[headerRow + 1]![2] as number;
    expect(typeof value).toBe("number");
    expect(String(value).replace(/\D/g, "").length).toBeLessThanOrEqual(6);
    expect(Math.abs(value - NOISY)).toBeLessThan(1e-4);
    expect(lines[headerRow + 1]![3]).toBe(4.8e-15);
    expect(lines[headerRow + 2]![5]).toBe(`refused: ${message}`);
    expect(lines[headerRow + 2]![2]).toBeUndefined();

    const csv = await sheetDownload(found!.sheet, "csv", found!.fileBase);
    const bytes = new Uint8Array(await csv.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const rows = parse(Buffer.from(bytes), {
      bom: true,
      relax_column_count: true,
    }) as string[][];
    const h = rows.findIndex((r) => r[0] === "Pressure (psia)");
    expect(rows[h + 1]![3]).toBe("4.8e-15");
    expect(rows[h + 2]).toEqual([
      "6000",
      "212",
      "",
      "",
      "",
      `refused: ${message}`,
    ]);
  });
});

describe("the lookup page's export", () => {
  const caller: ApiCaller = {
    user: {
      id: 0,
      email: "engineer@calder.example",
      name: "Engineer",
      role: "engineer",
      unitSystem: "field",
    },
    token: null,
  };

  test("computed again on the server: words and units in the header, the engine's values rounded, the caution", async () => {
    caller.user.id = engineerId;
    const { sheet, fileBase } = await lookupExportSheet(caller, {
      sampleId: 1,
      properties: ["oil_fvf", "gas_fvf"],
      units: "field",
      method: "auto",
      degree: null,
      extrapolate: false,
      conditions: [{ pressure: 3250, temperature: 212 }],
    });
    expect(fileBase).toBe("isopleth-lookup-CS-1 BH-01-rev-1");
    expect(sheet.header[2]).toBe("Oil formation volume factor (rb/STB)");
    expect(sheet.header[6]).toBe("Gas formation volume factor (ft³/scf)");
    expect(sheet.about.at(-1)).toBe(`Caution: ${TABLE_CAUTION}`);
    const { grid } = await sample1Grid("oil_fvf");
    const direct = runLookup(grid, [{ pressure: 3250, temperature: 212 }], {
      property: "oil_fvf",
      method: "auto",
      units: "field",
    }).results[0]!;
    const shown = sheet.rows[0]![2] as number;
    expect(Math.abs(shown - direct.value!)).toBeLessThanOrEqual(
      Math.max(5e-5, direct.errorEstimate ?? 0),
    );
    expect(
      String(sheet.rows[0]![3]).replace(/[^1-9]/g, "").length,
    ).toBeLessThanOrEqual(2);
  });
});

describe("table defaults and plain refusals", () => {
  test("?format=text alone: the reservoir temperature (212 °F) on the measured pressures plus the bubble point", async () => {
    const sample = await getSampleWithPlace(1);
    const data = await getRevisionData((await resolveRevision(1))!);
    const request = new Request(
      "http://test/api/v1/samples/1/table?format=text",
    );
    const q = parseApiQuery(request, TableQuery);
    const response = await tableResponse(request, sample!, data, q);
    expect(response.status).toBe(200);
    const text = await response.text();
    expect(text).toMatch(/^# temperature: 212 deg F$/m);
    const pressures = text
      .split("\n")
      .filter((l) => l.trim() && !l.startsWith("#"))
      .map((l) => Number(l.trim().split(/\s+/)[0]));
    // The demo's measured pressures (app/.server/db/seed.ts, PRESSURES_A) and the bubble point between them.
    const measured = [
      400, 800, 1200, 1600, 2000, 2400, 2800, 3200, 3600, 4200, 4800, 5400,
    ];
    for (const p of measured) expect(pressures).toContain(p);
    expect(pressures).toHaveLength(measured.length + 1);
    const pb = text.match(
      /^# bubble point at this temperature: ([\d.]+) psia/m,
    );
    expect(pressures).toContain(Number(pb![1]));
  });

  test("a sample without a reservoir temperature, a bad format and a bad pressure list: what and where, in words", async () => {
    const sample = {
      ...(await getSampleWithPlace(1))!,
      reservoirTemperatureF: null,
    };
    const data = await getRevisionData((await resolveRevision(1))!);
    const request = new Request("http://test/api/v1/samples/1/table");
    const none = await tableResponse(
      request,
      sample,
      data,
      parseApiQuery(request, TableQuery),
    );
    expect(none.status).toBe(400);
    const body = (await none.json()) as {
      detail: string;
      issues: { path: string[] }[];
    };
    expect(body.detail).toBe(
      "`temperature`: No temperature was given and sample 1 has no reservoir temperature on record; give one, e.g. temperature=212 (°F).",
    );
    expect(body.issues[0]!.path).toEqual(["temperature"]);

    let thrown: unknown;
    try {
      parseApiQuery(new Request("http://test/x?format=pdf"), TableQuery);
    } catch (e) {
      thrown = e;
    }
    const problem = (await (thrown as Response).json()) as { detail: string };
    expect(problem.detail).toBe(
      "The query string is not valid: `format`: Choose json, csv, text or xlsx; got “pdf”.",
    );

    const bad = new Request("http://test/x?temperature=212&pressures=500,abc");
    const refused = await tableResponse(
      bad,
      sample,
      data,
      parseApiQuery(bad, TableQuery),
    );
    const detail = ((await refused.json()) as { detail: string }).detail;
    expect(refused.status).toBe(400);
    expect(detail.startsWith("`pressures`: ")).toBe(true);
    expect(detail).toMatch(/abc/);
  });

  test("format=xlsx: a workbook with headers in words and units and the caution, numbers equal to the JSON", async () => {
    const sample = await getSampleWithPlace(1);
    const data = await getRevisionData((await resolveRevision(1))!);
    const jsonRequest = new Request("http://test/x?pressures=1000:5000:1000");
    const json = (await (
      await tableResponse(
        jsonRequest,
        sample!,
        data,
        parseApiQuery(jsonRequest, TableQuery),
      )
    ).json()) as { rows: { pressure: number; oil_fvf: number }[] };
    const request = new Request(
      "http://test/x?pressures=1000:5000:1000&format=xlsx",
    );
    const response = await tableResponse(
      request,
      sample!,
      data,
      parseApiQuery(request, TableQuery),
    );
    expect(response.headers.get("Content-Disposition")).toBe(
      'attachment; filename="isopleth-sample-1-rev-1-table.xlsx"',
    );
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(await response.arrayBuffer());
    const lines = Array.from(wb.worksheets[0]!.getSheetValues(), (r) =>
      Array.isArray(r) ? r.slice(1) : [],
    );
    const h = lines.findIndex((r) => r[0] === "Pressure (psia)");
    expect(lines[h]!.slice(0, 3)).toEqual([
      "Pressure (psia)",
      "Solution gas–oil ratio (scf/STB)",
      "Oil formation volume factor (rb/STB)",
    ]);
    expect(lines.flat()).toContain(`Caution: ${TABLE_CAUTION}`);
    json.rows.forEach((r, i) => {
      expect(lines[h + 1 + i]![0]).toBe(r.pressure);
      expect(lines[h + 1 + i]![2]).toBe(r.oil_fvf);
    });
  });
});
