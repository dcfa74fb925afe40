import { expect, test } from "vitest";
import { PropertyInputError } from "./errors";
import {
  adjustDifferentialLiberation,
  adjustSaturatedPoint,
  adjustUndersaturatedPoint,
} from "./separator-adjustment";

// DL values Bod = 1.515, Rsd = 684 at 2100 psig and Bodb = 1.600, Rsdb = 854 from Table 6-11 [S];
// separator test Bofb = 1.474, Rsfb = 768 (100 psig/75 °F) from memory (McCain ch. 10 / Ahmed) [M].
const BASIS = { bofb: 1.474, rsfb: 768, bodb: 1.6, rsdb: 854 };

test("C19 DL → separator at 2100 psig: Bo = 1.396 ±0.001 rb/STB, Rs = 611 ±1 scf/STB (McCain ch. 10 / Ahmed, from memory)", () => {
  const r = adjustSaturatedPoint(BASIS, { bod: 1.515, rsd: 684 });
  expect(Math.abs(r.value.oilFvf - 1.396)).toBeLessThanOrEqual(0.001);
  expect(Math.abs(r.value.solutionGor - 611)).toBeLessThanOrEqual(1);
  expect(r.warnings).toEqual([]);
});

test("at the bubble point both branches give Bofb and Rsfb; using DL Bo directly overstates by ~8.5 % (domain §3.9 [C])", () => {
  const sat = adjustSaturatedPoint(BASIS, { bod: 1.6, rsd: 854 });
  const under = adjustUndersaturatedPoint(BASIS, { relativeVolume: 1 });
  expect(sat.value.oilFvf).toBeCloseTo(1.474, 12);
  expect(sat.value.solutionGor).toBeCloseTo(768, 12);
  expect(under.value).toEqual({ oilFvf: 1.474, solutionGor: 768 });
  expect(1.6 / 1.474 - 1).toBeCloseTo(0.0855, 3);
});

test("whole table: DL points below pb and CCE relative volumes above, sorted; a negative adjusted Rs is flagged", () => {
  const r = adjustDifferentialLiberation({
    bubblePoint: 2634.7,
    basis: BASIS,
    differential: [
      { pressure: 2634.7, bod: 1.6, rsd: 854 },
      { pressure: 2114.7, bod: 1.515, rsd: 684 },
      { pressure: 173.7, bod: 1.244, rsd: 157 },
    ],
    relativeVolumes: [
      { pressure: 2634.7, relativeVolume: 1 },
      { pressure: 4014.7, relativeVolume: 0.9848 },
    ],
  });
  expect(r.value.map((row) => row.pressure)).toEqual([
    173.7, 2114.7, 2634.7, 4014.7,
  ]);
  expect(r.value.map((row) => row.branch)).toEqual([
    "saturated",
    "saturated",
    "saturated",
    "undersaturated",
  ]);
  expect(r.value[3]?.oilFvf).toBeCloseTo(0.9848 * 1.474, 12);
  expect(r.value[0]?.solutionGor).toBeCloseTo(
    768 - (854 - 157) * (1.474 / 1.6),
    10,
  );
  const volatile = adjustSaturatedPoint(
    { bofb: 1.2, rsfb: 300, bodb: 2.0, rsdb: 1000 },
    { bod: 1.3, rsd: 100 },
  );
  expect(volatile.value.solutionGor).toBeLessThan(0);
  expect(volatile.warnings[0]?.code).toBe("NONPHYSICAL_RESULT");
  expect(() =>
    adjustDifferentialLiberation({
      bubblePoint: 2000,
      basis: BASIS,
      differential: [{ pressure: 2500, bod: 1.5, rsd: 800 }],
    }),
  ).toThrow(PropertyInputError);
});
