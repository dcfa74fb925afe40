// Figure structure: scenes, colour scales, legends, bubble-point marks and query-point flags.
import { describe, expect, test } from "vitest";
import { plotText, slicesFigure, surfaceFigure } from "./figures";
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
    expect(f.layout.annotations?.[0]?.text).toBe("pb 2,000 psia");
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

test("plotText neutralises markup and template placeholders in labels", () => {
  expect(plotText("<b>x</b> %{y} & z")).toBe(
    "&lt;b&gt;x&lt;/b&gt; &#37;{y} &amp; z",
  );
});
