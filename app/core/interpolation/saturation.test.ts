// Saturation-aware interpolation on an invented kinked table: a property that rises with pressure up to
// the bubble point and falls above it, with a bubble point that moves with temperature.
import { describe, expect, test } from "vitest";
import { explainInterpolation, interpolateGrid } from "./index";
import type { Grid, Method } from "./index";

// Invented surface (not a measured fluid): saturated branch S rises with pressure; undersaturated branch
// U falls from the bubble-point value; pb rises with temperature. Both branches are smooth on their own.
const pbOf = (t: number): number => 1800 + 6 * (t - 100);
const S = (p: number, t: number): number =>
  1.05 + 2.2e-4 * p * (1 + 0.0015 * (t - 100)) - 1.5e-8 * p * p;
const U = (p: number, t: number): number =>
  S(pbOf(t), t) * Math.exp(-1.2e-5 * (p - pbOf(t)));
const f = (p: number, t: number): number => (p <= pbOf(t) ? S(p, t) : U(p, t));

const P = Array.from({ length: 11 }, (_, i) => 900 + 300 * i); // 900 … 3900
const T = [100, 130, 160, 190, 220, 250]; // pb 1800 (a grid row) … 2700 (a grid row); the others fall between rows
const values = P.map((p) => T.map((t) => f(p, t)));
const withBubble: Grid = {
  pressures: P,
  temperatures: T,
  values,
  bubblePoints: T.map(pbOf),
};
const withoutBubble: Grid = { pressures: P, temperatures: T, values };

function sweep(
  grid: Grid,
  method: Method,
): {
  maxError: number;
  maxAboveBubbleValue: number;
  overshootWarnings: number;
} {
  let maxError = 0;
  let maxAboveBubbleValue = -Infinity;
  let overshootWarnings = 0;
  for (let a = 0; a <= 120; a++) {
    for (let b = 0; b <= 15; b++) {
      const p = 900 + (3000 * a) / 120;
      const t = 100 + (150 * b) / 15;
      const r = interpolateGrid(
        grid,
        { pressure: p, temperature: t },
        { method },
      );
      maxError = Math.max(maxError, Math.abs(r.value - f(p, t)));
      // the bubble-point value is the largest value at this temperature: neither branch may exceed it
      maxAboveBubbleValue = Math.max(
        maxAboveBubbleValue,
        r.value - S(pbOf(t), t),
      );
      if (r.warnings.includes("overshoot")) overshootWarnings++;
    }
  }
  return { maxError, maxAboveBubbleValue, overshootWarnings };
}

describe("kinked table (reference: domain notes §1.4/§2.5 — never interpolate across pb; the invented function gives the truth)", () => {
  test("newton with bubble points: accurate on both branches, no overshoot above the bubble-point value", () => {
    const s = sweep(withBubble, "newton");
    expect(s.maxError).toBeLessThan(1e-6);
    expect(s.maxAboveBubbleValue).toBeLessThan(1e-7);
    expect(s.overshootWarnings).toBe(0);
  });

  test("ignoring the bubble points would have been wrong: the cubic across the kink overshoots", () => {
    const s = sweep(withoutBubble, "newton");
    expect(s.maxError).toBeGreaterThan(5e-3);
    expect(s.maxAboveBubbleValue).toBeGreaterThan(1e-3);
    const aware = sweep(withBubble, "newton");
    expect(s.maxError).toBeGreaterThan(1000 * aware.maxError);
  });

  test("linear and pchip also keep to the branches and do better with the bubble points than without", () => {
    for (const method of ["linear", "pchip"] as const) {
      const aware = sweep(withBubble, method);
      const blind = sweep(withoutBubble, method);
      // reference: linear interpolation error h²/8·|f''| ≈ 3.4e-4 here; the kink adds much more
      expect(aware.maxError).toBeLessThan(1e-3);
      expect(blind.maxError).toBeGreaterThan(10 * aware.maxError);
    }
  });

  test("no zone straddles the bubble point: every node used lies on the point's branch of its column", () => {
    for (const [p, t] of [
      [2350, 175],
      [2500, 175],
      [2250, 205],
      [2450, 205],
      [1850, 110],
      [2690, 248],
      [2710, 248],
    ] as const) {
      for (const method of ["newton", "linear", "pchip"] as const) {
        const e = explainInterpolation(
          withBubble,
          { pressure: p, temperature: t },
          { method },
        );
        expect(e.branch?.side).toBe(
          p <= pbOf(t) ? "saturated" : "undersaturated",
        );
        for (const col of e.stepOne) {
          const pbj = pbOf(col.temperature!);
          for (const node of col.nodes) {
            if (e.branch!.side === "saturated")
              expect(node.at).toBeLessThanOrEqual(pbj + 1e-9);
            else expect(node.at).toBeGreaterThanOrEqual(pbj - 1e-9);
          }
        }
      }
    }
  });

  test("the bubble-point pressure at the point's temperature is interpolated along temperature", () => {
    // pb is linear in temperature here, so any of the methods reproduces it (reference: common practice)
    for (const method of ["newton", "linear", "pchip"] as const) {
      const r = interpolateGrid(
        withBubble,
        { pressure: 2000, temperature: 175 },
        { method },
      );
      expect(r.bubblePointPressure).toBeCloseTo(pbOf(175), 9);
      expect(r.branch).toBe("saturated");
    }
  });

  test("a bubble point between grid rows becomes a node shared by both branches", () => {
    // column 160 °F: pb = 2160, between rows 2100 and 2400
    const below = explainInterpolation(
      withBubble,
      { pressure: 2150, temperature: 160 },
      { method: "newton" },
    );
    const above = explainInterpolation(
      withBubble,
      { pressure: 2170, temperature: 160 },
      { method: "newton" },
    );
    const nodeAt = (
      e: typeof below,
    ): { at: number; value: number } | undefined =>
      e.stepOne
        .find((c) => c.temperature === 160)
        ?.nodes.find((n) => n.index === null);
    const b = nodeAt(below);
    const a = nodeAt(above);
    expect(b?.at).toBe(2160);
    expect(a?.at).toBe(2160);
    expect(a?.value).toBe(b?.value);
    // its value comes from both branches' extrapolations; close to the truth at the kink
    expect(Math.abs(b!.value - S(2160, 160))).toBeLessThan(2e-4);
  });

  test("a neighbouring column continued past its own bubble point is reported", () => {
    // at 205 °F pb ≈ 2430; the 190 °F column's pb is 2340, so it is continued on its saturated branch
    const r = interpolateGrid(
      withBubble,
      { pressure: 2400, temperature: 205 },
      { method: "newton" },
    );
    expect(r.branch).toBe("saturated");
    expect(r.warnings).toContain("branch-extrapolated");
    const inside = interpolateGrid(
      withBubble,
      { pressure: 1500, temperature: 205 },
      { method: "newton" },
    );
    expect(inside.warnings).not.toContain("branch-extrapolated");
  });

  test("unknown bubble points (null) are filled along temperature; all unknown is flagged", () => {
    const some: Grid = {
      ...withBubble,
      bubblePoints: T.map((t, j) => (j === 2 ? null : pbOf(t))),
    };
    const r = interpolateGrid(
      some,
      { pressure: 2100, temperature: 160 },
      { method: "newton" },
    );
    expect(r.bubblePointPressure).toBeCloseTo(pbOf(160), 9);
    const none: Grid = { ...withBubble, bubblePoints: T.map(() => null) };
    const n = interpolateGrid(
      none,
      { pressure: 2100, temperature: 160 },
      { method: "newton" },
    );
    expect(n.warnings).toContain("bubble-point-unknown");
    expect(n.branch).toBeUndefined();
    const onlyLow: Grid = {
      ...withBubble,
      bubblePoints: T.map((t, j) => (j < 3 ? pbOf(t) : null)),
    };
    const x = interpolateGrid(
      onlyLow,
      { pressure: 2100, temperature: 230 },
      { method: "newton" },
    );
    expect(x.warnings).toContain("bubble-point-extrapolated");
  });

  test("an undersaturated point with no undersaturated data nearby is an error, not a guess", () => {
    // every column's bubble point above the table: no undersaturated branch at all
    const allSaturated: Grid = {
      ...withBubble,
      bubblePoints: T.map(() => 5000),
    };
    expect(
      interpolateGrid(
        allSaturated,
        { pressure: 3000, temperature: 175 },
        { method: "newton" },
      ).branch,
    ).toBe("saturated");
    const mostlySaturated: Grid = {
      ...withBubble,
      bubblePoints: [2000, 5000, 5000, 5000, 5000, 5000],
    };
    // at 105 °F pb lies between 2000 and 5000 but below 3900; above it only the 100 °F column has data
    expect(() =>
      interpolateGrid(
        mostlySaturated,
        { pressure: 3900, temperature: 105 },
        { method: "newton" },
      ),
    ).toThrow(/undersaturated branch/);
    expect(
      interpolateGrid(
        mostlySaturated,
        { pressure: 3900, temperature: 105 },
        { method: "newton", extrapolate: true },
      ).warnings,
    ).toContain("extrapolated");
  });
});
