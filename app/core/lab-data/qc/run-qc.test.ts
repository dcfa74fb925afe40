import { expect, test } from "vitest";
import {
  createSampleModel,
  generateSample,
  type FluidDescription,
} from "../../properties/generate-sample";
import {
  CUBIC_FOOT_PER_BARREL,
  PROPERTY_KEYS,
  type PropertyKey,
} from "../../units";
import { datasetFromCanonicalGrids, type CanonicalGridInput } from "../dataset";
import type { Finding, ParsedDataset, QcCell } from "../types";
import dlCsv from "../../../../reference-data/properties/dl-table-6-11-220f.csv?raw";
import { RULES } from "./rules";
import { qcStatus, runQc } from "./run-qc";

// ---------------------------------------------------------------------------------------------------
// Tables built from published correlations (app/core/properties generateSample: Standing 1947 for Rs, Bo
// and pb; Vasquez & Beggs 1980 above pb; Beggs & Robinson 1975 viscosity; Sutton 1985 pseudo-criticals with
// Dranchuk & Abou-Kassem 1975 Z; Bg from Z at 60 °F and 14.696 psia; Lee, Gonzalez & Eakin 1966 gas
// viscosity). The fluids are invented.

interface Built {
  readonly dataset: ParsedDataset;
  readonly pressures: number[];
  readonly temperatures: number[];
  readonly bubblePoints: number[];
  readonly values: Record<PropertyKey, (number | null)[][]>;
}

function build(
  fluid: FluidDescription,
  temperatures: number[],
  mutate?: (values: Record<PropertyKey, (number | null)[][]>) => void,
): Built {
  const model = createSampleModel(fluid);
  const bubblePoints = temperatures.map((t) =>
    Math.round(model.bubblePoint(t)),
  );
  const pressures = [
    ...new Set([
      14.7,
      300,
      600,
      1000,
      1400,
      1800,
      2200,
      ...bubblePoints,
      3000,
      3500,
      4000,
      5000,
      6000,
    ]),
  ].sort((a, b) => a - b);
  const sample = generateSample({ ...fluid, temperatures, pressures });
  const values = Object.fromEntries(
    PROPERTY_KEYS.map((k) => [
      k,
      sample.grids[k].values.map((row) => [...row]),
    ]),
  ) as Record<PropertyKey, (number | null)[][]>;
  mutate?.(values);
  const properties: { [K in PropertyKey]?: CanonicalGridInput } = {};
  for (const k of PROPERTY_KEYS)
    properties[k] = { pressures, temperatures, values: values[k] };
  const dataset = datasetFromCanonicalGrids({
    properties,
    bubblePoints: temperatures.map((t, j) => ({
      temperature: t,
      pressure: bubblePoints[j] ?? 0,
    })),
  });
  return { dataset, pressures, temperatures, bubblePoints, values };
}

const FLUIDS: readonly (FluidDescription & { readonly label: string })[] = [
  {
    label: "35 °API, γg 0.75, Rsb 600",
    apiGravity: 35,
    gasGravity: 0.75,
    rsb: 600,
  },
  {
    label: "40.7 °API, γg 0.855, Rsb 768",
    apiGravity: 40.7,
    gasGravity: 0.855,
    rsb: 768,
  },
  {
    label: "25 °API, γg 0.70, Rsb 250",
    apiGravity: 25,
    gasGravity: 0.7,
    rsb: 250,
  },
  {
    label: "45 °API, γg 0.90, Rsb 1400",
    apiGravity: 45,
    gasGravity: 0.9,
    rsb: 1400,
  },
];

const meta = (f: FluidDescription) => ({
  apiGravity: f.apiGravity,
  gasGravity: f.gasGravity,
});
const notInfo = (findings: readonly Finding[]) =>
  findings.filter((f) => f.severity !== "info");
const hits = (findings: readonly Finding[], c: QcCell) =>
  findings.filter((f) =>
    f.cells?.some(
      (x) =>
        x.property === c.property &&
        x.pressure === c.pressure &&
        x.temperature === c.temperature,
    ),
  );

for (const fluid of FLUIDS) {
  test(`a table built from published correlations passes QC (${fluid.label}; 150, 200, 250 °F)`, () => {
    const { dataset } = build(fluid, [150, 200, 250]);
    expect(runQc(dataset, meta(fluid))).toEqual([]);
  });
}

test("the same table with one cell swapped is flagged at that cell, for every property", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const temperatures = [160, 200, 240];
  const base = build(fluid, temperatures);
  // Cells on the saturated branch (oil) and across the table (gas), swapped with the value two pressures up.
  for (const key of PROPERTY_KEYS) {
    for (const [i, j] of [
      [3, 1],
      [4, 0],
      [11, 2],
    ] as const) {
      if (
        key === "solution_gor" &&
        (base.pressures[i] ?? 0) >= (base.bubblePoints[j] ?? 0)
      )
        continue; // Rs = Rsb there: a swap changes nothing
      const { dataset, pressures } = build(fluid, temperatures, (v) => {
        const row = v[key];
        const a = row[i]?.[j] ?? null;
        const b = row[i + 2]?.[j] ?? null;
        (row[i] as (number | null)[])[j] = b;
        (row[i + 2] as (number | null)[])[j] = a;
      });
      const findings = notInfo(runQc(dataset, meta(fluid)));
      const at = hits(findings, {
        property: key,
        pressure: pressures[i] ?? 0,
        temperature: temperatures[j] ?? 0,
      });
      expect(
        at.length,
        `${key} at ${pressures[i]} psia, ${temperatures[j]} °F`,
      ).toBeGreaterThan(0);
    }
  }
});

test("a swapped Bo on the saturated branch is an error naming both cells, in one sentence", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset, pressures } = build(fluid, [200], (v) => {
    const a = v.oil_fvf[3]?.[0] ?? null;
    (v.oil_fvf[3] as (number | null)[])[0] = v.oil_fvf[5]?.[0] ?? null;
    (v.oil_fvf[5] as (number | null)[])[0] = a;
  });
  expect(pressures.slice(3, 6)).toEqual([1000, 1400, 1800]);
  const findings = runQc(dataset, meta(fluid));
  const f = findings.find(
    (x) =>
      x.code === "BO_NOT_RISING_BELOW_PB" &&
      x.cells?.some((c) => c.pressure === 1800),
  );
  expect(f?.severity).toBe("error");
  expect(f?.rule).toBe("bo-saturated-rising");
  expect(f?.source).toBe(RULES["bo-saturated-rising"].source);
  expect(f?.message).toMatch(
    /^Between 1400 psia and 1800 psia at 200 °F, Bo falls from 1\.\d+ rb\/STB to 1\.\d+ rb\/STB; below the bubble point Bo must rise with pressure as the oil swells with dissolved gas \(bubble point 2570 psia\)\.$/,
  );
  expect(qcStatus(findings)).toBe("fail");
});

test("a single misread value (one cell 8 % off) is flagged at that cell as standing off the smooth curve", () => {
  const fluid = FLUIDS[1] as FluidDescription;
  for (const key of [
    "oil_viscosity",
    "z_factor",
    "gas_viscosity",
    "oil_density",
  ] as const) {
    const { dataset, pressures } = build(fluid, [200], (v) => {
      const row = v[key][4] as (number | null)[];
      row[0] = (row[0] ?? 0) * 1.08;
    });
    const outliers = runQc(dataset, meta(fluid)).filter(
      (f) => f.code === "OUTLIER",
    );
    expect(
      outliers.map((f) => f.cells),
      key,
    ).toEqual([[{ property: key, pressure: pressures[4], temperature: 200 }]]);
  }
});

// ---------------------------------------------------------------------------------------------------
// Outside reference: the published differential-liberation table.
//
// Source: W. C. Lyons (ed.), Standard Handbook of Petroleum & Natural Gas Engineering, Vol. 2, Table 6-11,
// "Differential Vaporization at 220 °F" (bubble point 2620 psig down to 159 psig), as committed in
// reference-data/properties/dl-table-6-11-220f.csv (see its README). Pressures in psig; psia = psig + 14.7,
// the book's convention. Rsd in scf per barrel of residual oil, Bod and Btd in barrels per barrel of residual
// oil, Bg in ft³/scf.
const T_DL = 220;
const TABLE_6_11 = dlCsv
  .trim()
  .split(/\r?\n/)
  .slice(1)
  .map((line) =>
    line.split(",").map((x) => (x.trim() === "" ? null : Number(x))),
  );

function dlDataset(
  mutate?: (rows: (number | null)[][]) => void,
): ParsedDataset {
  const rows = TABLE_6_11.map((r) => [...r]).reverse();
  mutate?.(rows);
  const pressures = rows.map((r) => (r[0] ?? 0) + 14.7);
  const column = (k: number, f: (x: number) => number = (x) => x) =>
    rows.map((r) => [
      r[k] === null || r[k] === undefined ? null : f(r[k] as number),
    ]);
  return datasetFromCanonicalGrids({
    properties: {
      solution_gor: { pressures, temperatures: [T_DL], values: column(1) },
      oil_fvf: { pressures, temperatures: [T_DL], values: column(2) },
      z_factor: { pressures, temperatures: [T_DL], values: column(5) },
      gas_fvf: {
        pressures,
        temperatures: [T_DL],
        values: column(6, (x) => x / CUBIC_FOOT_PER_BARREL),
        displayUnit: "ft3/scf",
      },
    },
    bubblePoints: [{ temperature: T_DL, pressure: 2620 + 14.7 }],
  });
}

test("Table 6-11 as read: 11 rows from 2620 to 159 psig, so 10 saturated intervals for the consistency test", () => {
  expect(TABLE_6_11).toHaveLength(11);
  expect(TABLE_6_11[0]?.slice(0, 3)).toEqual([2620, 854, 1.6]);
  expect(TABLE_6_11[10]?.slice(0, 3)).toEqual([159, 157, 1.244]);
});

test("the published differential-liberation table (Standard Handbook Vol. 2, Table 6-11) passes the consistency test dBo/dp < Bg·dRs/dp, and all of QC", () => {
  const findings = runQc(dlDataset());
  expect(findings.filter((f) => f.rule === "saturated-consistency")).toEqual(
    [],
  );
  expect(notInfo(findings)).toEqual([]);
  // With the report's 14.65 psia gas base the Bg–Z check is tighter still, and with the fluid's gravities
  // (40.7 °API, γg 0.855 — the six-oil set's oil 2, same sample) no correlation departure is large.
  expect(
    notInfo(
      runQc(dlDataset(), {
        standardConditions: { pressurePsia: 14.65, temperatureF: 60 },
        apiGravity: 40.7,
        gasGravity: 0.855,
      }),
    ),
  ).toEqual([]);
});

test("Table 6-11 with one Bo raised so that Bo outgrows Bg·ΔRs fails the consistency test at those cells", () => {
  // Bod at 1850 psig 1.479 → 1.565: from 1600 to 1850 psig Bo then rises by 0.120 rb/bbl while Bg·ΔRs is only
  // about 0.116 (mean Bg 0.00171 rb/scf × ΔRs 68 scf/bbl).
  const findings = runQc(
    dlDataset((rows) => {
      const row = rows.find((r) => r[0] === 1850);
      if (row) row[2] = 1.565;
    }),
  );
  const f = findings.find((x) => x.code === "NEGATIVE_TOTAL_COMPRESSIBILITY");
  expect(f?.severity).toBe("error");
  expect(f?.cells).toEqual(
    expect.arrayContaining([
      { property: "oil_fvf", pressure: 1614.7, temperature: 220 },
      { property: "oil_fvf", pressure: 1864.7, temperature: 220 },
    ]),
  );
  expect(f?.message).toMatch(
    /^Between 1614\.7 psia and 1864\.7 psia at 220 °F, Bo changes by 0\.12 rb\/STB while Bg·ΔRs is only 0\.1\d* rb\/STB, so the total compressibility would be negative; below the bubble point dBo\/dp must be less than Bg·dRs\/dp\.$/,
  );
});

// ---------------------------------------------------------------------------------------------------
// Rule by rule

test("Bg written in ft³/scf but labelled rb/scf: the Bg–Z check names the likely unit slip", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset } = build(fluid, [200], (v) => {
    v.gas_fvf = v.gas_fvf.map((row) =>
      row.map((x) => (x === null ? null : x * CUBIC_FOOT_PER_BARREL)),
    );
  });
  const f = runQc(dataset, meta(fluid)).find((x) => x.code === "BG_Z_MISMATCH");
  expect(f?.severity).toBe("warning");
  expect(f?.message).toContain(
    "the values look like ft³/scf (or rm³/sm³) labelled as rb/scf",
  );
  // Without Z, the Z that Bg implies gives the same hint.
  const noZ: ParsedDataset = {
    ...dataset,
    properties: { gas_fvf: dataset.properties.gas_fvf },
  };
  const g = runQc(noZ).find((x) => x.code === "BG_IMPLIED_Z");
  expect(g?.message).toContain("ft³/scf");
});

test("a bubble point stated too low: Rs is not flat above it", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset } = build(fluid, [200]);
  const wrong: ParsedDataset = {
    ...dataset,
    bubblePoints: [{ temperature: 200, pressure: 1800 }],
  };
  const f = runQc(wrong, meta(fluid)).find(
    (x) => x.code === "RS_NOT_FLAT_ABOVE_PB",
  );
  expect(f?.severity).toBe("warning");
  expect(f?.message).toContain(
    "above the bubble point (1800 psia) Rs should stay equal to Rsb",
  );
});

test("no stated bubble point: inferred where Rs stops rising, or at the peak of Bo; otherwise a warning", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset, bubblePoints } = build(fluid, [200]);
  const none: ParsedDataset = { ...dataset, bubblePoints: [] };
  const inferred = runQc(none, meta(fluid));
  const note = inferred.find((x) => x.code === "BUBBLE_POINT_INFERRED");
  expect(note?.cells).toEqual([
    { property: "bubble_point", pressure: bubblePoints[0], temperature: 200 },
  ]);
  expect(notInfo(inferred)).toEqual([]);
  const boOnly: ParsedDataset = {
    properties: { oil_fvf: dataset.properties.oil_fvf },
    bubblePoints: [],
  };
  expect(
    runQc(boOnly).find((x) => x.code === "BUBBLE_POINT_INFERRED")?.message,
  ).toContain("from the peak of Bo");
  const muOnly: ParsedDataset = {
    properties: { oil_viscosity: dataset.properties.oil_viscosity },
    bubblePoints: [],
  };
  expect(
    runQc(muOnly).find((x) => x.code === "BUBBLE_POINT_MISSING")?.severity,
  ).toBe("warning");
  // The sample record's bubble point is used when the file has none.
  const fromRecord = runQc(muOnly, {
    bubblePoints: [{ temperature: 200, pressure: bubblePoints[0] ?? 0 }],
  });
  expect(fromRecord.filter((x) => x.rule === "bubble-point")).toEqual([]);
});

test("file and sample record disagree on the bubble point: a warning", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset, bubblePoints } = build(fluid, [200]);
  const f = runQc(dataset, {
    ...meta(fluid),
    bubblePoints: [
      { temperature: 200, pressure: (bubblePoints[0] ?? 0) + 100 },
    ],
  }).find((x) => x.code === "BUBBLE_POINT_MISMATCH");
  expect(f?.message).toBe(
    "At 200 °F the file gives a bubble point of 2570 psia but the sample record gives 2670 psia; the file's value was used for the checks.",
  );
});

test("plausible ranges: impossible values are errors, unusual ones warnings (Bo, Z, μg, Rs, T, pb)", () => {
  const ds = datasetFromCanonicalGrids({
    properties: {
      oil_fvf: { pressures: [1000], temperatures: [200], values: [[0]] },
      z_factor: {
        pressures: [1000, 2000],
        temperatures: [200],
        values: [[2.5], [2.6]],
      },
      gas_viscosity: {
        pressures: [1000],
        temperatures: [800],
        values: [[0.1]],
      },
      solution_gor: {
        pressures: [1000],
        temperatures: [200],
        values: [[2000]],
      },
    },
    bubblePoints: [{ temperature: 200, pressure: 9000 }],
  });
  const findings = runQc(ds);
  const by = (code: string, property: string) =>
    findings.filter(
      (f) => f.code === code && f.cells?.some((c) => c.property === property),
    );
  expect(by("OUT_OF_RANGE", "oil_fvf")[0]?.message).toBe(
    "The oil formation volume factor 0 rb/STB at 1000 psia and 200 °F is implausible: physically it must be above 0 rb/STB.",
  );
  expect(by("IMPLAUSIBLE", "z_factor")[0]?.message).toBe(
    "2 Z factor values at 200 °F (2.5 to 2.6) are implausible: the usual range is 0.3 to 2; check the unit in the header.",
  );
  expect(by("IMPLAUSIBLE", "gas_viscosity")).toHaveLength(1);
  expect(by("IMPLAUSIBLE", "solution_gor")[0]?.message).toContain(
    "volatile oil",
  );
  expect(
    findings.find(
      (f) =>
        f.code === "OUT_OF_RANGE" &&
        f.message.startsWith("The temperature 800 °F"),
    )?.severity,
  ).toBe("error");
  expect(
    findings.find(
      (f) =>
        f.code === "IMPLAUSIBLE" &&
        f.message.startsWith("The bubble point 9000 psia"),
    ),
  ).toBeDefined();
});

test("oil viscosity rising with temperature, and a bubble point falling with temperature, are warnings", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset } = build(fluid, [150, 200], (v) => {
    v.oil_viscosity = v.oil_viscosity.map((row) => [...row].reverse());
  });
  const swapped: ParsedDataset = {
    ...dataset,
    bubblePoints: [...dataset.bubblePoints].map((b, k, all) => ({
      ...b,
      pressure: all[all.length - 1 - k]?.pressure ?? 0,
    })),
  };
  const findings = runQc(swapped, meta(fluid));
  expect(
    findings.find((f) => f.code === "OIL_VISCOSITY_NOT_FALLING_WITH_T")
      ?.severity,
  ).toBe("warning");
  expect(
    findings.find((f) => f.code === "BUBBLE_POINT_NOT_RISING_WITH_T")?.message,
  ).toMatch(
    /^The bubble point falls from \d+ psia at 150 °F to \d+ psia at 200 °F; for a black oil it should rise with temperature\.$/,
  );
});

test("density off the mass balance by 10 % is a warning; the density check needs the gravities", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset } = build(fluid, [200], (v) => {
    v.oil_density = v.oil_density.map((row) =>
      row.map((x) => (x === null ? null : x * 1.1)),
    );
  });
  expect(
    runQc(dataset, meta(fluid)).find((f) => f.code === "DENSITY_MASS_BALANCE")
      ?.severity,
  ).toBe("warning");
  const skipped = runQc(dataset);
  expect(
    skipped.find((f) => f.code === "DENSITY_MASS_BALANCE"),
  ).toBeUndefined();
  expect(
    skipped.find(
      (f) => f.code === "CHECK_SKIPPED" && f.rule === "correlation-departure",
    )?.severity,
  ).toBe("info");
});

test("departures from correlations are notes or warnings, never errors", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset } = build(fluid, [200]);
  const findings = runQc(dataset, { apiGravity: 20, gasGravity: 1.3 }); // gravities far from the fluid's
  const departures = findings.filter((f) => f.code === "CORRELATION_DEPARTURE");
  expect(departures.length).toBeGreaterThan(0);
  expect(departures.every((f) => f.severity !== "error")).toBe(true);
});

test("undersaturated compressibility outside 2–60 × 10⁻⁶ 1/psi is a warning", () => {
  // Above pb (2570 psia at 200 °F), Bo falls with co = 100 × 10⁻⁶ 1/psi.
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset, pressures } = build(fluid, [200]);
  const bob =
    dataset.properties.oil_fvf?.values[pressures.indexOf(2570)]?.[0] ?? 1;
  const steep = datasetFromCanonicalGrids({
    properties: {
      oil_fvf: {
        pressures,
        temperatures: [200],
        values: pressures.map((p, i) => [
          p > 2570
            ? bob * Math.exp(-100e-6 * (p - 2570))
            : (dataset.properties.oil_fvf?.values[i]?.[0] ?? null),
        ]),
      },
    },
    bubblePoints: [{ temperature: 200, pressure: 2570 }],
  });
  const f = runQc(steep).find(
    (x) => x.code === "UNDERSATURATED_COMPRESSIBILITY",
  );
  expect(f?.message).toMatch(
    /^Between 2570 psia and 3000 psia at 200 °F, Bo implies an oil compressibility of 100 × 10⁻⁶ 1\/psi, outside the usual 2 to 60 × 10⁻⁶ 1\/psi above the bubble point\.$/,
  );
});

test("a malformed grid is reported, the others are still checked, and nothing throws", () => {
  const ds = datasetFromCanonicalGrids({
    properties: {
      oil_fvf: {
        pressures: [2000, 1000],
        temperatures: [200],
        values: [[1.2], [1.1]],
      },
      gas_viscosity: {
        pressures: [1000, 2000],
        temperatures: [200],
        values: [[0.02], [0.015]],
      },
      z_factor: {
        pressures: [1000],
        temperatures: [200],
        values: [[Number.NaN]],
      },
    },
  });
  const findings = runQc(ds);
  expect(
    findings.filter((f) => f.code === "INVALID_GRID").map((f) => f.message),
  ).toEqual([
    "The oil formation volume factor grid cannot be checked because its pressures are not strictly increasing (a pressure is repeated or out of order).",
    "The Z factor grid cannot be checked because a value is neither a number nor empty.",
  ]);
  expect(
    findings.find((f) => f.code === "GAS_VISCOSITY_NOT_RISING")?.severity,
  ).toBe("warning");
  expect(qcStatus([])).toBe("pass");
  expect(qcStatus(findings.filter((f) => f.severity !== "error"))).toBe("warn");
});

test("every finding carries its rule, the rule's source, the cells concerned and one plain sentence", () => {
  const fluid = FLUIDS[0] as FluidDescription;
  const { dataset } = build(fluid, [150, 200], (v) => {
    v.gas_fvf = v.gas_fvf.map((row) => [...row].reverse());
    v.oil_fvf = v.oil_fvf.map((row) => [...row].reverse());
  });
  const findings = runQc(dataset, meta(fluid));
  expect(findings.length).toBeGreaterThan(5);
  const order = { error: 0, warning: 1, info: 2 } as const;
  findings.forEach((f, k) => {
    expect(f.rule && RULES[f.rule as keyof typeof RULES]).toBeTruthy();
    expect(f.source).toBe(RULES[f.rule as keyof typeof RULES].source);
    expect(RULES[f.rule as keyof typeof RULES].severities).toContain(
      f.severity,
    );
    expect(f.message).toMatch(/^[A-Z0-9].*\.$/);
    expect(f.message).not.toMatch(/\n|NaN|undefined/);
    if (k > 0)
      expect(order[f.severity]).toBeGreaterThanOrEqual(
        order[findings[k - 1]?.severity ?? "error"],
      );
  });
});
