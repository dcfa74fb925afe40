import { expect, test } from "vitest";
import { convert } from "../units";
import dlCsv from "../../../reference-data/properties/dl-table-6-11-220f.csv?raw";
import { massBalanceOilDensity } from "./oil-density";
import { saturatedConsistencyTest, totalFvf } from "./saturated-branch";

// Table 6-11 "Differential vaporization at 220 °F", Standard Handbook of Petroleum & Natural Gas Engineering,
// Vol. 2 [S]; reference-data/properties/dl-table-6-11-220f.csv. psia = psig + 14.7. Bg printed in ft³/scf.
const table = dlCsv
  .trim()
  .split("\n")
  .slice(1)
  .map((line) => {
    const [p, rsd, bod, btd, rho, z, bg] = line.split(",");
    return {
      pressure: Number(p) + 14.7,
      solutionGor: Number(rsd),
      oilFvf: Number(bod),
      totalFvf: Number(btd),
      density: Number(rho),
      z: z ? Number(z) : null,
      gasFvf: bg ? convert(Number(bg), "gas_fvf", "ft3/scf", "rb/scf") : null,
    };
  });

test("Table 6-11 has 11 rows from 2620 to 159 psig (10 saturated intervals)", () => {
  expect(table).toHaveLength(11);
});

test("two-phase FVF Btd = Bod + Bg (Rsdb − Rsd) reproduces every row of Table 6-11 to ±0.001 (domain §2.3 [C/S])", () => {
  const rsdb = table[0]?.solutionGor ?? Number.NaN;
  for (const row of table.slice(1)) {
    const bt = totalFvf({
      oilFvf: row.oilFvf,
      gasFvf: row.gasFvf ?? Number.NaN,
      solutionGorAtBubblePoint: rsdb,
      solutionGor: row.solutionGor,
    });
    expect(Math.abs(bt.value - row.totalFvf)).toBeLessThanOrEqual(0.001);
  }
});

test("C23 inequality test dBo/dp < Bg dRs/dp: zero violations over all 10 intervals of Table 6-11 (rule: positive apparent compressibility below pb, from its definition, domain brief §3.12; data: Standard Handbook Vol. 2 Table 6-11 [S])", () => {
  const result = saturatedConsistencyTest(table);
  expect(result.intervals).toHaveLength(10);
  expect(result.violations).toHaveLength(0);
  expect(result.passed).toBe(true);
  expect(result.intervals.every((iv) => iv.apparentCompressibility > 0)).toBe(
    true,
  );
});

test("the inequality test catches a flat Rs with rising Bo (a corrupted 1100 psig row: Rs copied from 850 psig)", () => {
  const i1100 = table.findIndex(
    (row) => Math.abs(row.pressure - 1114.7) < 1e-9,
  );
  const i850 = table.findIndex((row) => Math.abs(row.pressure - 864.7) < 1e-9);
  const corrupted = table.map((row, i) =>
    i === i1100 ? { ...row, solutionGor: table[i850]?.solutionGor ?? 0 } : row,
  );
  const result = saturatedConsistencyTest(corrupted);
  expect(result.passed).toBe(false);
  expect(result.violations).toHaveLength(1);
  expect(result.violations[0]?.pressureLow).toBeCloseTo(864.7, 9);
  expect(result.violations[0]?.apparentCompressibility).toBeLessThan(0);
});

test("C25 mass-balance density at pb: γo(40.7 °API), Rs 768, γg 0.855, Bo 1.474 → 40.82 lb/ft³, within 5 % of the lab 0.6562 g/cm³ (Table 6-11 density [S]; inputs from memory)", () => {
  const rho = massBalanceOilDensity({
    apiGravity: 40.7,
    gasGravity: 0.855,
    solutionGor: 768,
    oilFvf: 1.474,
  });
  expect(Math.abs(rho.value - 40.82)).toBeLessThanOrEqual(0.01); // domain [C] value
  const gcc = convert(rho.value, "density", "lb/ft3", "g/cm3");
  expect(
    Math.abs(gcc / (table[0]?.density ?? Number.NaN) - 1),
  ).toBeLessThanOrEqual(0.05);
  expect(Math.abs(gcc - 0.6539)).toBeLessThanOrEqual(0.0001);
});

test("the gas term constant is 0.013594 γg Rs at 60 °F/14.696 psia (domain §2.3 [C]; 1e-4 relative)", () => {
  const withGas = massBalanceOilDensity({
    apiGravity: 35,
    gasGravity: 1,
    solutionGor: 1000,
    oilFvf: 1,
  }).value;
  const dead = massBalanceOilDensity({
    apiGravity: 35,
    gasGravity: 1,
    solutionGor: 0,
    oilFvf: 1,
  }).value;
  expect(Math.abs((withGas - dead) / 1000 / 0.013594 - 1)).toBeLessThan(1e-4);
});
