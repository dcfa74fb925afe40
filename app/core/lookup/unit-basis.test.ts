// The unit basis of a lookup: the report's standard conditions (Rs and Bg rebased from them to the output
// system's) and gauge pressures in and out. Grids come from the synthetic sample generator (invented data
// from published correlations, see app/core/properties); every expected number is a hand calculation of the
// ideal-gas rebase V₂ = V₁·(p₁/p₂)·(T₂/T₁) (absolute p, T) and of the NIST SP 811 factors
// (1 psi = 6.894757293168 kPa, 1 atm = 101.325 kPa, 1 bbl = 5.614583 ft³).
import { describe, expect, test } from "vitest";
import { generateSample } from "../properties";
import {
  isLookupError,
  runLookup,
  runLookupColumns,
  type LookupOptions,
} from "./index";

const sample = generateSample({
  apiGravity: 35,
  gasGravity: 0.75,
  rsb: 600,
  pressures: Array.from({ length: 23 }, (_, i) => 500 + 250 * i),
  temperatures: [120, 150, 180, 210, 240],
});
const rs = sample.grids.solution_gor;
const bg = sample.grids.gas_fvf;
const US_GAS = { pressurePsia: 14.65, temperatureF: 60 };
const METRIC_REPORT = {
  pressurePsia: 101.325 / 6.894757293168,
  temperatureF: 59,
};
const SCF_PER_STB_PER_SM3 = (42 * 231) / 1728; // 5.614583: ft³ per bbl

const opts = (extra: Partial<LookupOptions>): LookupOptions => ({
  method: "linear",
  property: "solution_gor",
  units: "field",
  ...extra,
});
const pts = [
  { pressure: 1234, temperature: 133 },
  { pressure: 2750, temperature: 180 },
  { pressure: 4321, temperature: 222 },
];

describe("standard conditions: from the report's to the output's", () => {
  test("a 14.65 psia report in field units: Rs × 14.65/14.696, Bg (ft³/scf) × 14.696/14.65, estimates too", () => {
    const plain = runLookup(rs, pts, opts({}));
    const rebased = runLookup(rs, pts, opts({ standardConditions: US_GAS }));
    for (let i = 0; i < pts.length; i++) {
      // hand calculation: same temperature, V₂ = V₁ · 14.65/14.696
      expect(rebased.results[i]!.value).toBeCloseTo(
        (plain.results[i]!.value * 14.65) / 14.696,
        9,
      );
      expect(rebased.results[i]!.errorEstimate).toBeCloseTo(
        (plain.results[i]!.errorEstimate * 14.65) / 14.696,
        12,
      );
    }
    expect(rebased.units.standardConditions).toBe("60 °F, 14.696 psia");
    expect(rebased.units.reportStandardConditions).toBe("60 °F, 14.65 psia");
    expect(plain.units.reportStandardConditions).toBe("60 °F, 14.696 psia");
    const g = runLookup(
      bg,
      pts,
      opts({ property: "gas_fvf", standardConditions: US_GAS }),
    );
    const g0 = runLookup(bg, pts, opts({ property: "gas_fvf" }));
    expect(g.results[0]!.value / g0.results[0]!.value).toBeCloseTo(
      14.696 / 14.65,
      12,
    );
    // a property without a gas volume is never rebased
    const bo = runLookup(
      sample.grids.oil_fvf,
      pts,
      opts({ property: "oil_fvf", standardConditions: US_GAS }),
    );
    const bo0 = runLookup(
      sample.grids.oil_fvf,
      pts,
      opts({ property: "oil_fvf" }),
    );
    expect(bo.results.map((r) => r.value)).toEqual(
      bo0.results.map((r) => r.value),
    );
  });

  test("a metric report comes back unchanged in metric units: at a measured node, the stored number ÷ 5.614583", () => {
    // node (row 9 = 2750 psia, column 2 = 180 °F), asked in bara and °C
    const stored = rs.values[9]![2]!;
    const node = {
      pressure: (2750 * 6.894757293168) / 100,
      temperature: (180 - 32) / 1.8,
    };
    const out = runLookup(
      rs,
      [node],
      opts({ units: "metric", standardConditions: METRIC_REPORT }),
    );
    expect(out.results[0]!.value).toBeCloseTo(stored / SCF_PER_STB_PER_SM3, 9);
    expect(out.units.standardConditions).toBe("15 °C, 101.325 kPa");
    expect(out.units.reportStandardConditions).toBe("15 °C, 101.325 kPa");
    // read as if on 60 °F/14.696 psia it is 0.19 % low: × (14.696/14.695949)(518.67/519.67) = 0.998079
    const old = runLookup(rs, [node], opts({ units: "metric" }));
    expect(old.results[0]!.value / out.results[0]!.value).toBeCloseTo(
      0.99807918,
      7,
    );
    const columns = runLookupColumns(
      rs,
      [node],
      opts({ units: "metric", standardConditions: METRIC_REPORT }),
    );
    expect(columns.values[0]).toBeCloseTo(stored / SCF_PER_STB_PER_SM3, 9);
  });
});

describe("gauge pressures", () => {
  test("psig points are the absolute points less the barometric pressure; stencil and bubble point in psig", () => {
    const abs = runLookup(rs, pts, opts({}));
    const gauge = runLookup(
      rs,
      pts.map((p) => ({ ...p, pressure: p.pressure - 14.696 })),
      opts({ pressureBasis: "gauge" }),
    );
    expect(gauge.units.pressure).toEqual({ id: "psig", symbol: "psig" });
    expect(gauge.units.pressureBasis).toBe("gauge");
    expect(gauge.units.barometricPressurePsia).toBe(14.696);
    for (let i = 0; i < pts.length; i++) {
      expect(gauge.results[i]!.value).toBeCloseTo(abs.results[i]!.value, 9);
      expect(gauge.results[i]!.bubblePointPressure!).toBeCloseTo(
        abs.results[i]!.bubblePointPressure! - 14.696,
        9,
      );
      expect(gauge.results[i]!.stencil.pressures[0]!).toBeCloseTo(
        abs.results[i]!.stencil.pressures[0]! - 14.696,
        9,
      );
    }
    // the lab's 14.7 psia: 2620 psig is 2634.7 psia
    const lab = runLookup(
      rs,
      [{ pressure: 2620, temperature: 180 }],
      opts({ pressureBasis: "gauge", barometricPressurePsia: 14.7 }),
    );
    const same = runLookup(
      rs,
      [{ pressure: 2634.7, temperature: 180 }],
      opts({}),
    );
    expect(lab.results[0]!.value).toBeCloseTo(same.results[0]!.value, 9);
  });

  test("barg in metric: 100 barg = 100 × 14.5037738 + 14.696 psia", () => {
    const a = runLookup(
      rs,
      [{ pressure: 100, temperature: 80 }],
      opts({ units: "metric", pressureBasis: "gauge" }),
    );
    const b = runLookup(
      rs,
      [
        {
          pressure: (100 * 14.503773773 + 14.696) * 0.06894757293168,
          temperature: 80,
        },
      ],
      opts({ units: "metric" }),
    );
    expect(a.units.pressure.id).toBe("barg");
    expect(a.results[0]!.value).toBeCloseTo(b.results[0]!.value, 8);
  });

  test("a gauge pressure below a vacuum is refused, saying the barometric pressure was added", () => {
    expect(() =>
      runLookup(
        rs,
        [{ pressure: -20, temperature: 150 }],
        opts({ pressureBasis: "gauge" }),
      ),
    ).toThrow(/-20 psig.*barometric 14\.696 psia added/);
  });
});

test("bad unit-basis options are refused naming the field", () => {
  const bad = [
    [{ pressureBasis: "psig" as never }, "pressureBasis"],
    [{ barometricPressurePsia: -1 }, "barometricPressurePsia"],
    [{ barometricPressurePsia: Number.NaN }, "barometricPressurePsia"],
    [
      { standardConditions: { pressurePsia: 0, temperatureF: 60 } },
      "standardConditions",
    ],
    [
      { standardConditions: { pressurePsia: 14.7, temperatureF: -500 } },
      "standardConditions",
    ],
  ] as const;
  for (const [extra, field] of bad) {
    try {
      runLookup(rs, pts, opts(extra));
      expect.unreachable(field);
    } catch (error) {
      expect(isLookupError(error) && error.code).toBe("INVALID_OPTIONS");
      expect((error as { details: { field: string } }).details.field).toBe(
        field,
      );
    }
  }
});
