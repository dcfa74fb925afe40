import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { computeLookup } from "~/.server/api/lookup";
import { sampleDetailForOutput } from "~/.server/api/samples";
import { storeUploadedRevision } from "~/.server/db/queries/revisions";
import {
  createSampleRecord,
  getSampleWithPlace,
} from "~/.server/db/queries/samples";
import { createUser } from "~/.server/db/queries/users";
import {
  checkUpload,
  revisionFromUpload,
} from "~/.server/samples/check-upload";
import { getRevisionData } from "~/.server/samples/revision-data";
import { buildPreview } from "~/.server/samples/preview";
import { getRevisionByNumber } from "~/.server/db/queries/revisions";
import type { PropertyKey } from "~/core/units";
import { useFreshMigratedDatabase } from "../support/app-database";

/*
 * Standard conditions and gauge pressures end to end, on the real MariaDB: a report is uploaded through the
 * upload service (parse, QC, store), read back as the API's lookup and the API's sample detail.
 *
 * The reports are invented for this test. Hand calculations (ideal gas at standard conditions,
 * V₂ = V₁·(p₁/p₂)·(T₂/T₁), absolute p and T; NIST SP 811: 1 psi = 6.894757293168 kPa, 1 atm = 101.325 kPa,
 * 1 bar = 100 kPa = 14.503773773 psi):
 *  - the metric report is on 15 °C/101.325 kPa, its pressures in barg with a barometric pressure of
 *    14.5 psia recorded for the sample, so 100 barg is 100 × 14.503773773 + 14.5 = 1464.877377 psia; looked up
 *    in metric units at its own nodes (in barg) it gives back the uploaded numbers unchanged. Read as if on
 *    60 °F/14.696 psia it came back × (14.696/14.695949)(518.67/519.67) = × 0.9980792 (0.19 % low).
 *  - the field report is on 60 °F/14.65 psia: its Rs 500 scf/STB is 500 × 14.65/14.696 = 498.43495 scf/STB
 *    on the field base (60 °F, 14.696 psia), its Bg 0.00100 rb/scf is 0.001 × 5.614583 × 14.696/14.65 =
 *    0.0056322127 ft³/scf.
 */

let cleanup: () => Promise<void>;
let userId: number;

const RECORD = {
  fieldRegion: null,
  sampleType: "bottomhole" as const,
  samplingDate: null,
  samplingDepthFt: null,
  reservoirPressurePsia: null,
  reservoirTemperatureF: null,
  stockTankApi: 35,
  gasSpecificGravity: 0.75,
  laboratory: "Invented Laboratory",
  reportReference: null,
  notes: "Invented test record.",
};

// Invented metric report (15 °C, 101.325 kPa), pressures in barg.
const METRIC_CSV = [
  "pressure (barg),temperature (°C),bubble point (barg),oil formation volume factor (rm3/sm3),solution GOR (sm3/sm3),gas formation volume factor (rm3/sm3)",
  "20,80,200,1.120,21.5,0.0562",
  "60,80,,1.175,48.2,0.0187",
  "100,80,,1.230,74.9,0.0111",
  "150,80,,1.296,106.3,0.00748",
  "200,80,,1.362,137.4,0.00568",
  "20,90,200,1.126,20.8,0.0580",
  "60,90,,1.181,47.0,0.0193",
  "100,90,,1.236,73.1,0.0114",
  "150,90,,1.303,104.0,0.00771",
  "200,90,,1.370,135.0,0.00585",
  "20,100,200,1.131,20.1,0.0599",
  "60,100,,1.187,45.7,0.0199",
  "100,100,,1.243,71.2,0.0118",
  "150,100,,1.311,101.9,0.00795",
  "200,100,,1.378,132.6,0.00603",
].join("\n");

// Invented field report (60 °F, 14.65 psia), pressures in psia.
const FIELD_CSV = [
  "pressure (psia),temperature (°F),bubble point (psia),oil formation volume factor (rb/STB),solution GOR (scf/STB),gas formation volume factor (rb/scf)",
  "500,180,2500,1.120,150,0.00600",
  "1000,180,,1.160,250,0.00290",
  "1500,180,,1.200,340,0.00190",
  "2000,180,,1.240,420,0.00140",
  "2500,180,,1.280,500,0.00100",
  "500,220,2500,1.135,140,0.00650",
  "1000,220,,1.176,235,0.00315",
  "1500,220,,1.217,322,0.00205",
  "2000,220,,1.258,400,0.00152",
  "2500,220,,1.300,478,0.00110",
].join("\n");

async function sampleWithReport(
  label: string,
  standard: { standardPressurePsia: number; standardTemperatureF: number },
  csv: string,
  barometricPressurePsia?: number,
) {
  const created = await createSampleRecord(
    {
      ...RECORD,
      ...standard,
      ...(barometricPressurePsia !== undefined
        ? { barometricPressurePsia }
        : {}),
      fieldName: "Invented Field",
      wellName: "U-1",
      label,
    },
    { userId },
  );
  if (!created.ok) throw new Error("sample not created");
  const sample = (await getSampleWithPlace(created.id))!;
  const checked = await checkUpload(
    { name: `${label}.csv`, bytes: new TextEncoder().encode(csv) },
    sample,
  );
  if (!checked.ok)
    throw new Error(checked.errors.map((e) => e.message).join(" "));
  const stored = await storeUploadedRevision({
    ...revisionFromUpload(checked, {
      sampleId: sample.id,
      createdBy: userId,
      comment: "invented",
    }),
    storeIdentical: false,
  });
  if (!stored.ok) throw new Error("revision not stored");
  const revision = (await getRevisionByNumber(sample.id, stored.number))!;
  return { sample, checked, data: await getRevisionData(revision) };
}

/** The API's lookup (computeLookup, as POST …/lookup runs it) at the given points; values per point. */
async function lookUp(
  context: Awaited<ReturnType<typeof sampleWithReport>>,
  property: PropertyKey,
  units: "field" | "metric",
  points: [number, number][],
  pressureBasis: "absolute" | "gauge" = "absolute",
) {
  const run = await computeLookup(context.data, {
    property,
    method: "linear",
    units,
    extrapolate: false,
    pressureBasis,
    pressures: Float64Array.from(points, (p) => p[0]),
    temperatures: Float64Array.from(points, (p) => p[1]),
    sample: context.sample,
  });
  const results = JSON.parse(new TextDecoder().decode(run!.value.resultsUtf8));
  return (results as { value: number }[]).map((r) => r.value);
}

beforeAll(async () => {
  const fresh = await useFreshMigratedDatabase();
  cleanup = fresh.cleanup;
  userId = await createUser({
    email: "lead@example.test",
    name: "Lead",
    role: "lab_lead",
    passwordHash: "x",
  });
}, 60_000);

afterAll(async () => cleanup?.());

describe("a metric report (15 °C, 101.325 kPa; barg with 14.5 psia barometric)", () => {
  let ctx: Awaited<ReturnType<typeof sampleWithReport>>;
  beforeAll(async () => {
    ctx = await sampleWithReport(
      "metric",
      {
        standardPressurePsia: 101.325 / 6.894757293168,
        standardTemperatureF: 59,
      },
      METRIC_CSV,
      14.5,
    );
  });

  test("the sample records its barometric pressure; the upload made barg absolute with it, and its preview says so", () => {
    expect(buildPreview(ctx.checked, "metric").gaugeNote).toMatch(
      /^Gauge pressures \(barg\) were made absolute with the sample's barometric pressure, 14\.5 psia/,
    );
    expect(ctx.sample.barometricPressurePsia).toBe(14.5);
    // 100 barg = 100 × 14.503773773 + 14.5 psia (hand calculation above)
    expect(ctx.data.grids.solution_gor!.pressures).toContainEqual(
      expect.closeTo(1464.8773773, 6),
    );
  });

  test("looked up in metric units at its nodes (barg, °C), the uploaded numbers come back unchanged", async () => {
    // measured nodes inside the grid (a node at the edge of the range may be refused by round-off of the
    // °C → °F conversion: the subject of the engine's snapping)
    const nodes: [number, number][] = [
      [60, 90],
      [100, 90],
      [150, 90],
    ];
    const uploaded = {
      solution_gor: [47.0, 73.1, 104.0],
      gas_fvf: [0.0193, 0.0114, 0.00771],
      oil_fvf: [1.181, 1.236, 1.303],
    } as const;
    for (const property of ["solution_gor", "gas_fvf", "oil_fvf"] as const) {
      const values = await lookUp(ctx, property, "metric", nodes, "gauge");
      values.forEach((v, i) =>
        expect(v / uploaded[property][i]!).toBeCloseTo(1, 10),
      );
    }
    // the same nodes in bara: barg + 14.5 psia ÷ 14.503773773 psi/bar
    const bara = nodes.map(
      ([p, t]) => [p + 14.5 / 14.503773773, t] as [number, number],
    );
    const absolute = await lookUp(ctx, "solution_gor", "metric", bara);
    absolute.forEach((v, i) =>
      expect(v / uploaded.solution_gor[i]!).toBeCloseTo(1, 9),
    );
  });

  test("the sample API's metric grids are the uploaded numbers; its units name both bases", async () => {
    const detail = sampleDetailForOutput(
      (await getSampleWithPlace(ctx.sample.id))!,
      ctx.data,
      "metric",
    );
    const rs = detail.grids.find((g) => g.property === "solution_gor")!;
    expect(rs.values.map((row) => row[0])).toEqual([
      21.5, 48.2, 74.9, 106.3, 137.4,
    ]);
    expect(detail.units).toMatchObject({
      standardConditions: "15 °C, 101.325 kPa",
      reportStandardConditions: "15 °C, 101.325 kPa",
    });
    expect(detail.sample.barometricPressurePsia).toBe(14.5);
  });
});

describe("a field report on 60 °F, 14.65 psia", () => {
  let ctx: Awaited<ReturnType<typeof sampleWithReport>>;
  beforeAll(async () => {
    ctx = await sampleWithReport(
      "us-gas",
      { standardPressurePsia: 14.65, standardTemperatureF: 60 },
      FIELD_CSV,
    );
  });

  test("a new sample's barometric pressure defaults to 14.696 psia", () => {
    expect(ctx.sample.barometricPressurePsia).toBe(14.696);
  });

  test("field lookups rebase Rs and Bg to 60 °F, 14.696 psia (hand calculation above)", async () => {
    const [rs] = await lookUp(ctx, "solution_gor", "field", [[2500, 180]]);
    expect(rs).toBeCloseTo(498.43495, 4);
    const [bg] = await lookUp(ctx, "gas_fvf", "field", [[2500, 180]]);
    expect(bg).toBeCloseTo(0.0056322127, 9);
    const [bo] = await lookUp(ctx, "oil_fvf", "field", [[2500, 180]]);
    expect(bo).toBe(1.28);
    // 2485.304 psig is 2500 psia with the default barometric 14.696 psia
    const [gauge] = await lookUp(
      ctx,
      "solution_gor",
      "field",
      [[2500 - 14.696, 180]],
      "gauge",
    );
    expect(gauge).toBeCloseTo(498.43495, 4);
  });
});
