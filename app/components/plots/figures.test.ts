// Figure structure: scenes, colour scales, legends, bubble-point marks and query-point flags.
import { describe, expect, test } from "vitest";
import { paddedRange, plotText, slicesFigure, surfaceFigure } from "./figures";
import type { PlotSeries } from "./types";

const P = [500, 1000, 1500, 2000, 2500, 3000];
const T = [150, 180, 210, 240];
// invented grids
const series = (id: number, shift: number): PlotSeries => ({
  id,
  label: `Sample ${id}`,
  grid: {
    pressures: P,
    temperatures: T,
    values: P.map((p) => T.map((t) => 1.05 + shift + 0.0001 * p + 0.0005 * t)),
    bubblePoints: [1800, 1900, 2000, 2100],
  },
});
const units = { pressure: "psia", temperature: "°F", value: "rb/STB" };

type Trace = Record<string, unknown>;

describe("surfaceFigure", () => {
  test("side by side: one scene per sample, Cividis on a shared range, one colour bar, titles", () => {
    const f = surfaceFigure({
      series: [series(1, 0), series(2, 0.1)],
      valueLabel: "Bo",
      units,
      arrangement: "side-by-side",
      resolution: { pressures: 10, temperatures: 5 },
    });
    const surfaces = f.data.filter((d) => d.type === "surface") as Trace[];
    expect(surfaces.map((s) => s.scene)).toEqual(["scene", "scene2"]);
    expect(surfaces.every((s) => s.colorscale === "Cividis")).toBe(true);
    expect(surfaces[0]!.cmin).toBe(surfaces[1]!.cmin);
    expect(surfaces[0]!.cmax).toBe(surfaces[1]!.cmax);
    expect(surfaces.map((s) => s.showscale)).toEqual([false, true]);
    expect(f.layout.scene2).toBeDefined();
    expect(f.layout.annotations?.map((a) => a.text)).toEqual([
      "<b>Sample 1</b>",
      "<b>Sample 2</b>",
    ]);
    expect(f.layout.font?.family).toContain("Noto Sans");
    const scene = f.layout.scene as {
      xaxis: { title: { text: string } };
      zaxis: { title: { text: string } };
    };
    expect(scene.xaxis.title.text).toBe("Pressure (psia)");
    expect(scene.zaxis.title.text).toBe("Bo (rb/STB)");
    expect(String(surfaces[0]!.hovertemplate)).toContain("rb/STB");
  });

  test("overlaid (the default): one scene, a legend entry and its own colour and marker symbol per sample", () => {
    const f = surfaceFigure({
      series: [series(1, 0), series(2, 0.1)],
      valueLabel: "Bo",
      units,
      resolution: { pressures: 10, temperatures: 5 },
    });
    const surfaces = f.data.filter((d) => d.type === "surface") as Trace[];
    expect(surfaces.map((s) => s.scene)).toEqual(["scene", "scene"]);
    expect(surfaces.every((s) => s.showlegend === true)).toBe(true);
    expect(JSON.stringify(surfaces[0]!.colorscale)).not.toBe(
      JSON.stringify(surfaces[1]!.colorscale),
    );
    const markers = f.data.filter(
      (d) => d.type === "scatter3d" && String(d.name).endsWith("measured"),
    ) as { marker: { symbol: string } }[];
    expect(new Set(markers.map((m) => m.marker.symbol)).size).toBe(2);
    expect(f.layout.scene2).toBeUndefined();
  });

  test("query points: inside ones as diamonds, extrapolated ones as a separate flagged trace", () => {
    const f = surfaceFigure({
      series: [series(1, 0)],
      valueLabel: "Bo",
      units,
      queryPoints: [
        { pressure: 1750, temperature: 200 },
        { pressure: 3500, temperature: 200 },
      ],
      resolution: { pressures: 10, temperatures: 5 },
    });
    const q = f.data.filter((d) => String(d.name).startsWith("Query")) as {
      name: string;
      text: string[];
      marker: { symbol: string };
    }[];
    expect(q.map((t) => t.name)).toEqual([
      "Query points",
      "Query points outside the data (*)",
    ]);
    expect(q[0]!.marker.symbol).toBe("diamond");
    expect(q[1]!.marker.symbol).toBe("diamond-open");
    expect(q[1]!.text).toEqual(["Q2*"]);
  });
});

describe("slicesFigure", () => {
  test("a curve per sample and temperature, told apart by dash as well as colour; the bubble point marked", () => {
    const f = slicesFigure({
      series: [series(1, 0), series(2, 0.1)],
      valueLabel: "Bo",
      units,
      temperatures: [210],
    });
    const lines = f.data.filter(
      (d) => d.type === "scatter" && d.mode === "lines",
    ) as { name: string; line: { dash: string; color: string } }[];
    expect(lines.map((l) => l.name)).toEqual([
      "Sample 1 · 210 °F",
      "Sample 2 · 210 °F",
    ]);
    expect(lines[0]!.line.dash).not.toBe(lines[1]!.line.dash);
    expect(lines[0]!.line.color).not.toBe(lines[1]!.line.color);
    expect(f.layout.shapes).toHaveLength(2);
    expect(f.layout.shapes?.[0]).toMatchObject({
      x0: 2000,
      x1: 2000,
      line: { dash: "dash" },
    });
    // named in the legend, never as text on the axes (where close bubble points' labels overlapped)
    expect(f.layout.annotations).toEqual([]);
    const bubbles = f.data.filter((d) => String(d.name).startsWith("pb ")) as {
      name: string;
      showlegend: boolean;
      x: number[];
    }[];
    expect(bubbles.map((b) => b.name)).toEqual([
      "pb 2,000 psia (Sample 1 · 210 °F)",
      "pb 2,000 psia (Sample 2 · 210 °F)",
    ]);
    expect(bubbles.every((b) => b.showlegend && b.x[0] === 2000)).toBe(true);
    const measured = f.data.filter((d) => String(d.name).endsWith("measured"));
    expect(measured).toHaveLength(2);
    const xaxis = f.layout.xaxis as { title: { text: string } };
    expect(xaxis.title.text).toBe("Pressure (psia)");
  });

  test("default slices: the measured temperatures of the first sample", () => {
    const f = slicesFigure({ series: [series(1, 0)], valueLabel: "Bo", units });
    const lines = f.data.filter(
      (d) => d.type === "scatter" && d.mode === "lines",
    ) as { name: string }[];
    expect(lines.map((l) => l.name)).toEqual([
      "150 °F",
      "180 °F",
      "210 °F",
      "240 °F",
    ]);
  });
});

// A sample measured at one temperature (invented values), beside a full grid.
const oneColumn: PlotSeries = {
  id: 9,
  label: "One-T",
  grid: {
    pressures: P,
    temperatures: [200],
    values: P.map((p) => [1.2 + 0.00005 * p]),
  },
};

type Axis = { range: [number, number]; autorange: boolean };
type Scene = { xaxis: Axis; yaxis: Axis; zaxis: Axis };

describe("comparing samples", () => {
  test("side by side: every panel shows the same pressure, temperature and value ranges, covering all samples", () => {
    const narrowGrid = series(2, 0.3);
    narrowGrid.grid = {
      ...narrowGrid.grid,
      pressures: [1000, 1500, 2000],
      values: [1000, 1500, 2000].map((p) => T.map(() => 1.3 + 0.0001 * p)),
    };
    const f = surfaceFigure({
      series: [series(1, 0), narrowGrid],
      valueLabel: "Bo",
      units,
      arrangement: "side-by-side",
      resolution: { pressures: 10, temperatures: 5 },
    });
    const scenes = [f.layout.scene, f.layout.scene2] as Scene[];
    for (const axis of ["xaxis", "yaxis", "zaxis"] as const) {
      expect(scenes[0]![axis].range).toEqual(scenes[1]![axis].range);
      expect(scenes[0]![axis].autorange).toBe(false);
    }
    const [x0, x1] = scenes[0]!.xaxis.range;
    expect(x0).toBeLessThanOrEqual(500);
    expect(x1).toBeGreaterThanOrEqual(3000);
    // values: sample 1 from 1.05 + 0.05 + 0.075 at its lowest to sample 2's 1.3 + 0.2 at its highest
    const [z0, z1] = scenes[0]!.zaxis.range;
    expect(z0).toBeLessThanOrEqual(1.05 + 0.05 + 0.075);
    expect(z0).toBeGreaterThan(1);
    expect(z1).toBeGreaterThanOrEqual(1.5);
    expect(z1).toBeLessThan(1.6);
  });

  test("a one-temperature sample is a line at its temperature, not a surface; its value axis is not from 0", () => {
    for (const arrangement of ["side-by-side", "overlaid"] as const) {
      const f = surfaceFigure({
        series: [series(1, 0), oneColumn],
        valueLabel: "Bo",
        units,
        arrangement,
        resolution: { pressures: 10, temperatures: 5 },
        queryPoints: [
          { pressure: 1750, temperature: 200 },
          { pressure: 1750, temperature: 230 },
        ],
      });
      const surfaces = f.data.filter((d) => d.type === "surface") as Trace[];
      expect(surfaces.map((t) => t.name)).toEqual(["Sample 1"]);
      const line = f.data.find(
        (d) => d.type === "scatter3d" && d.mode === "lines",
      ) as { y: number[]; z: (number | null)[]; name: string };
      expect(new Set(line.y)).toEqual(new Set([200]));
      expect(line.z.every((v) => v !== null && v > 1.2)).toBe(true);
      expect(line.name).toBe("One-T (measured at 200 °F only)");
      const z = (f.layout.scene as Scene).zaxis.range;
      expect(z[0]).toBeGreaterThan(1);
      // the line takes only the query point at its own temperature
      const queries = f.data.filter(
        (d) =>
          String(d.name).startsWith("Query") &&
          (d as { scene: string }).scene ===
            (arrangement === "overlaid" ? "scene" : "scene2"),
      ) as { x: number[]; y: number[] }[];
      const ys = queries.flatMap((q) => q.y);
      if (arrangement === "side-by-side") expect(ys).toEqual([200]);
    }
  });

  test("slices: a one-temperature sample has its one curve; query points sit only on the curve at their temperature", () => {
    const f = slicesFigure({
      series: [series(1, 0), oneColumn],
      valueLabel: "Bo",
      units,
      temperatures: [180, 210],
      queryPoints: [
        { pressure: 1750, temperature: 210, label: "Q1" },
        { pressure: 1750, temperature: 200, label: "Q2" },
        { pressure: 2200, temperature: 180, label: "Q3" },
      ],
    });
    const lines = f.data.filter(
      (d) => d.type === "scatter" && d.mode === "lines",
    ) as { name: string }[];
    expect(lines.map((l) => l.name)).toEqual([
      "Sample 1 · 180 °F",
      "Sample 1 · 210 °F",
      "One-T · 200 °F",
    ]);
    const points = f.data
      .filter((d) => String(d.name).startsWith("Query"))
      .flatMap((d) => {
        const t = d as { x: number[]; hovertext: string[] };
        return t.x.map((x, i) => `${x} ${t.hovertext[i]!.split(" · ")[0]}`);
      });
    // Q1 on sample 1's 210 °F curve, Q3 on its 180 °F curve, Q2 on the one-temperature sample's 200 °F curve only
    expect(points.sort()).toEqual(["1750 Q1", "1750 Q2", "2200 Q3"]);
  });
});

test("paddedRange: 3 % either side (or as asked), not below 0 for values that are not; one value gets room of its own", () => {
  expect(paddedRange([1, 2, 3])).toEqual([1 - 0.06, 3 + 0.06]);
  expect(paddedRange([200, 200])).toEqual([190, 210]);
  expect(paddedRange([0])).toEqual([0, 1]);
  expect(paddedRange([15, 5500])).toEqual([0, 5500 + 0.03 * 5485]);
  expect(paddedRange([15, 5500], 0)).toEqual([15, 5500]);
  expect(paddedRange([210], 0)).toEqual([199.5, 220.5]);
  expect(paddedRange([-10, 10])).toEqual([-10.6, 10.6]);
  expect(paddedRange([NaN])).toEqual([0, 1]);
});

test("plotText neutralises markup and template placeholders in labels", () => {
  expect(plotText("<b>x</b> %{y} & z")).toBe(
    "&lt;b&gt;x&lt;/b&gt; &#37;{y} &amp; z",
  );
});
