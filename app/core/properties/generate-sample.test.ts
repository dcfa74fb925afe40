import { expect, test } from "vitest";
import { convert } from "../units";
import { PropertyInputError } from "./errors";
import {
  createSampleModel,
  generateSample,
  type SampleDescription,
} from "./generate-sample";
import { createRandom } from "./prng";
import { saturatedConsistencyTest } from "./saturated-branch";
import { standingBubblePoint } from "./standing";

// An invented black oil (not a real fluid): 35 °API, γg 0.75, Rsb 600 scf/STB.
const PRESSURES = Array.from({ length: 24 }, (_, i) => 250 + 250 * i); // 250 … 6000 psia
const TEMPERATURES = [140, 170, 200, 230, 260];
const BASE: SampleDescription = {
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  temperatures: TEMPERATURES,
  pressures: PRESSURES,
};

test("grid shape: values[i][j] at pressures[i], temperatures[j]; bubble points on oil grids only; units stated", () => {
  const s = generateSample(BASE);
  expect(s.synthetic).toBe(true);
  expect(s.notice).toMatch(/Invented data/);
  expect(s.units).toMatchObject({
    pressure: "psia",
    temperature: "degF",
    oil_fvf: "rb/STB",
    gas_fvf: "rb/scf",
    solution_gor: "scf/STB",
  });
  for (const [key, grid] of Object.entries(s.grids)) {
    expect(grid.pressures).toEqual(PRESSURES);
    expect(grid.temperatures).toEqual(TEMPERATURES);
    expect(grid.values).toHaveLength(PRESSURES.length);
    for (const row of grid.values)
      expect(row).toHaveLength(TEMPERATURES.length);
    if (key.startsWith("oil_") || key === "solution_gor")
      expect(grid.bubblePoints).toEqual(s.bubblePoints);
    else expect(grid.bubblePoints).toBeUndefined();
  }
  expect(s.bubblePoints).toHaveLength(TEMPERATURES.length);
});

test("noise-free grid values are exactly the model's values at the nodes; the bubble point closes Rs = Rsb", () => {
  const s = generateSample(BASE);
  const model = createSampleModel(BASE);
  PRESSURES.forEach((p, i) =>
    TEMPERATURES.forEach((t, j) => {
      const pt = model.evaluate(p, t);
      for (const key of Object.keys(s.grids) as (keyof typeof s.grids)[]) {
        expect(s.grids[key].values[i]?.[j]).toBe(pt[key]);
      }
    }),
  );
  for (const t of TEMPERATURES) {
    const pb = model.bubblePoint(t);
    expect(model.evaluate(pb, t).solution_gor).toBeCloseTo(600, 9);
    // the generator's pb is the exact inverse of Standing's Rs form: within 0.5 psi of Standing's pb equation (C5)
    expect(
      Math.abs(
        pb -
          standingBubblePoint({
            apiGravity: 35,
            gasGravity: 0.75,
            temperature: t,
            solutionGor: 600,
          }).value,
      ),
    ).toBeLessThan(0.5);
  }
});

test("physics of the generated grids (noise-free): branches, kinks at pb, temperature trends", () => {
  const model = createSampleModel(BASE);
  for (const t of TEMPERATURES) {
    const pb = model.bubblePoint(t);
    const below = [0.3, 0.6, 0.9, 1].map((f) => model.evaluate(f * pb, t));
    const above = [1.2, 1.5, 2].map((f) => model.evaluate(f * pb, t));
    for (let k = 1; k < below.length; k++) {
      const a = below[k - 1]!;
      const b = below[k]!;
      expect(b.solution_gor).toBeGreaterThan(a.solution_gor);
      expect(b.oil_fvf).toBeGreaterThan(a.oil_fvf);
      expect(b.oil_viscosity).toBeLessThan(a.oil_viscosity);
      expect(b.oil_density).toBeLessThan(a.oil_density);
    }
    const atPb = below[3]!;
    let prev = atPb;
    for (const b of above) {
      expect(b.solution_gor).toBe(600);
      expect(b.oil_fvf).toBeLessThan(prev.oil_fvf);
      expect(b.oil_viscosity).toBeGreaterThan(prev.oil_viscosity);
      expect(b.oil_density).toBeGreaterThan(prev.oil_density);
      prev = b;
    }
    // continuity at pb (both branches meet): just above equals the bubble-point value to first order
    const justAbove = model.evaluate(pb * (1 + 1e-9), t);
    expect(justAbove.oil_fvf).toBeCloseTo(atPb.oil_fvf, 7);
    expect(justAbove.oil_viscosity).toBeCloseTo(atPb.oil_viscosity, 7);
    // gas: Bg falls and μg rises with pressure
    expect(model.evaluate(3000, t).gas_fvf).toBeLessThan(
      model.evaluate(1000, t).gas_fvf,
    );
    expect(model.evaluate(3000, t).gas_viscosity).toBeGreaterThan(
      model.evaluate(1000, t).gas_viscosity,
    );
  }
  const pbs = TEMPERATURES.map((t) => model.bubblePoint(t));
  for (let j = 1; j < pbs.length; j++)
    expect(pbs[j]).toBeGreaterThan(pbs[j - 1]!);
  // at fixed p below pb, Rs falls with T; μo falls with T
  expect(model.evaluate(1000, 230).solution_gor).toBeLessThan(
    model.evaluate(1000, 170).solution_gor,
  );
  expect(model.evaluate(1000, 230).oil_viscosity).toBeLessThan(
    model.evaluate(1000, 170).oil_viscosity,
  );
});

test("the generated saturated branch passes the inequality test dBo/dp < Bg dRs/dp", () => {
  const s = generateSample(BASE);
  TEMPERATURES.forEach((t, j) => {
    const pb = s.bubblePoints[j]!;
    const rows = PRESSURES.flatMap((p, i) =>
      p <= pb
        ? [
            {
              pressure: p,
              oilFvf: s.grids.oil_fvf.values[i]![j]!,
              solutionGor: s.grids.solution_gor.values[i]![j]!,
              gasFvf: s.grids.gas_fvf.values[i]![j]!,
            },
          ]
        : [],
    );
    expect(rows.length).toBeGreaterThan(3);
    expect(saturatedConsistencyTest(rows).passed).toBe(true);
  });
});

test("deterministic with a seed: same seed → identical grids, another seed → different; noise level respected", () => {
  const a = generateSample({ ...BASE, noise: 0.01, seed: 42 });
  const b = generateSample({ ...BASE, noise: 0.01, seed: 42 });
  const c = generateSample({ ...BASE, noise: 0.01, seed: 43 });
  expect(a).toEqual(b);
  expect(a.grids.oil_fvf.values).not.toEqual(c.grids.oil_fvf.values);
  const clean = generateSample(BASE);
  const deviations: number[] = [];
  for (const key of [
    "oil_fvf",
    "oil_viscosity",
    "z_factor",
    "gas_viscosity",
  ] as const) {
    clean.grids[key].values.forEach((row, i) =>
      row.forEach((v, j) =>
        deviations.push(
          (a.grids[key].values[i]![j]! as number) / (v as number) - 1,
        ),
      ),
    );
  }
  const mean = deviations.reduce((s, d) => s + d, 0) / deviations.length;
  const sd = Math.sqrt(
    deviations.reduce((s, d) => s + (d - mean) ** 2, 0) / deviations.length,
  );
  expect(Math.abs(mean)).toBeLessThan(0.002);
  expect(sd).toBeGreaterThan(0.008);
  expect(sd).toBeLessThan(0.012);
  expect(Math.max(...deviations.map(Math.abs))).toBeLessThanOrEqual(
    0.03 + 1e-12,
  );
  // undersaturated Rs is a definition and stays exact; bubble points carry no noise
  a.grids.solution_gor.values.forEach((row, i) =>
    row.forEach((v, j) => {
      if (PRESSURES[i]! > a.bubblePoints[j]!) expect(v).toBe(600);
    }),
  );
  expect(a.bubblePoints).toEqual(clean.bubblePoints);
  expect(a.notice).toMatch(/1\.00 % artificial noise/);
});

test("the PRNG is reproducible and roughly standard normal (mean 0 ± 0.02, sd 1 ± 0.02 over 20 000 draws)", () => {
  const r1 = createRandom(7);
  const r2 = createRandom(7);
  const xs = Array.from({ length: 20_000 }, () => r1.normal());
  expect(Array.from({ length: 5 }, () => r2.normal())).toEqual(xs.slice(0, 5));
  const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
  const sd = Math.sqrt(xs.reduce((s, x) => s + (x - mean) ** 2, 0) / xs.length);
  expect(Math.abs(mean)).toBeLessThan(0.02);
  expect(Math.abs(sd - 1)).toBeLessThan(0.02);
});

test("bubble point instead of Rsb: the described bubble point is reproduced at its temperature (1e-9 relative)", () => {
  const s = generateSample({
    apiGravity: 35,
    gasGravity: 0.75,
    bubblePoint: 2500,
    bubblePointTemperature: 200,
    temperatures: [150, 200, 250],
    pressures: PRESSURES,
  });
  expect(Math.abs(s.bubblePoints[1]! / 2500 - 1)).toBeLessThan(1e-9);
  expect(s.bubblePoints[0]).toBeLessThan(2500);
  expect(s.bubblePoints[2]).toBeGreaterThan(2500);
  // default reference temperature: the lowest of the temperatures
  const d = generateSample({
    apiGravity: 35,
    gasGravity: 0.75,
    bubblePoint: 2500,
    temperatures: [150, 200],
    pressures: PRESSURES,
  });
  expect(Math.abs(d.bubblePoints[0]! / 2500 - 1)).toBeLessThan(1e-9);
});

test("metric output: axes, bubble points and values converted at the edge (bara, °C, sm³/sm³ at 15 °C)", () => {
  const field = generateSample(BASE);
  const metric = generateSample({ ...BASE, unitSystem: "metric" });
  expect(metric.units).toMatchObject({
    pressure: "bara",
    temperature: "degC",
    solution_gor: "sm3/sm3",
    oil_density: "kg/m3",
  });
  expect(metric.pressures[0]).toBeCloseTo(
    convert(250, "pressure", "psia", "bara"),
    12,
  );
  expect(metric.temperatures[0]).toBeCloseTo(60, 12);
  expect(metric.bubblePoints[0]).toBeCloseTo(
    convert(field.bubblePoints[0]!, "pressure", "psia", "bara"),
    12,
  );
  expect(metric.grids.oil_density.values[5]![2]).toBeCloseTo(
    convert(
      field.grids.oil_density.values[5]![2]!,
      "density",
      "lb/ft3",
      "kg/m3",
    ),
    10,
  );
  expect(metric.grids.oil_fvf.values[5]![2]).toBe(
    field.grids.oil_fvf.values[5]![2],
  );
  // 600 scf/STB at 60 °F/14.696 psia ≈ 600 × 0.177765 sm³/sm³ at 15 °C/101.325 kPa
  expect(metric.grids.solution_gor.values[23]![0]).toBeCloseTo(
    600 * 0.177765,
    2,
  );
});

test("bad descriptions → PropertyInputError with a clear message", () => {
  const bad: Array<[Partial<SampleDescription>, RegExp]> = [
    [{ pressures: [1000, 900] }, /strictly increasing/],
    [{ pressures: [-10, 100] }, /absolute pressure/],
    [{ pressures: [] }, /non-empty/],
    [{ temperatures: [Number.NaN] }, /finite/],
    [{ temperatures: [-20, 100] }, /above 0 °F/],
    [{ bubblePoint: 2000 }, /not both/],
    [{ rsb: undefined }, /rsb/],
    [{ noise: 0.5 }, /0 to 0.1/],
    [{ apiGravity: -5 }, /API/],
    [
      { rsb: 30, temperatures: [80] },
      /compressibility is not positive|too small/,
    ],
  ];
  for (const [patch, message] of bad) {
    expect(() =>
      generateSample({ ...BASE, ...patch } as SampleDescription),
    ).toThrow(PropertyInputError);
    expect(() =>
      generateSample({ ...BASE, ...patch } as SampleDescription),
    ).toThrow(message);
  }
});
