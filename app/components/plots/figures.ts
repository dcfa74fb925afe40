/**
 * Plotly figures (traces and layout as plain objects) for the surface and slice plots. Pure: it imports only
 * Plotly's types, never Plotly itself, so it is unit-tested without a browser.
 *
 * Readability for colour-blind people: the surface uses the Cividis scale; series and slices are told apart by
 * the Okabe–Ito colours and, in addition, by line dash and marker symbol; query points have their own symbols
 * (a filled diamond or star, and a vermilion cross when flagged).
 */
import type {
  Annotation,
  Data,
  Layout,
  ScatterData,
  Scatter3dData,
  Shape,
  SurfaceData,
} from "plotly.js-dist-min";
import {
  curveOf,
  DEFAULT_CURVE_RESOLUTION,
  DEFAULT_SURFACE_RESOLUTION,
  evaluateQueries,
  measuredPoints,
  QUERY_FLAG_TEXT,
  surfaceOf,
  type EvaluatedQuery,
} from "./compute";
import { SLICES_HEIGHT, sceneGrid, surfaceHeight } from "./size";
import type {
  PlotMethod,
  PlotSeries,
  PlotUnits,
  PropertySlicesProps,
  PropertySurfaceProps,
  QueryPoint,
} from "./types";
import { formatPlotValue } from "~/core/format";

/** Okabe–Ito colours (distinguishable with the common colour-vision deficiencies). */
const SERIES_COLOURS = ["#0072B2", "#E69F00", "#009E73", "#CC79A7"] as const;
const DASHES = ["solid", "dash", "dot", "dashdot"] as const;
const SYMBOLS_2D = [
  "circle",
  "square",
  "triangle-up",
  "triangle-down",
] as const;
const SYMBOLS_3D = ["circle", "square", "circle-open", "square-open"] as const;
const INK = "#1c2733";
const FLAG = "#D55E00";
const GRID_LINE = "#dfe4e1";
const FONT = {
  family: "Noto Sans, ui-sans-serif, system-ui, sans-serif",
  size: 12,
  color: INK,
};

export type Figure = {
  data: Data[];
  layout: Partial<Layout> & Record<string, unknown>;
};

/** Legend entry of query points outside the measured data (extrapolated or beyond the envelope). */
const FLAGGED_NAME = "Query points outside the data (*)";

const pick = <T>(list: readonly T[], i: number): T => list[i % list.length]!;

/** Text for Plotly hover templates and annotations: its tags and %{…} placeholders are neutralised. */
export function plotText(s: string): string {
  return s
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/%/g, "&#37;");
}

const NUM = ",.5~g";

function axisTitles(units: PlotUnits, valueLabel: string) {
  return {
    pressure: `Pressure (${units.pressure})`,
    temperature: `Temperature (${units.temperature})`,
    value: units.value ? `${valueLabel} (${units.value})` : valueLabel,
  };
}

function hoverLines(
  units: PlotUnits,
  valueLabel: string,
  x = "x",
  y = "y",
  z = "z",
) {
  const u = plotText(units.value);
  return [
    `p ${"%{"}${x}:${NUM}} ${plotText(units.pressure)}`,
    `T ${"%{"}${y}:${NUM}} ${plotText(units.temperature)}`,
    `${plotText(valueLabel)} ${"%{"}${z}:${NUM}}${u ? ` ${u}` : ""}`,
  ];
}

function queryHover(
  q: EvaluatedQuery,
  series: string,
  units: PlotUnits,
  valueLabel: string,
): string {
  const value =
    q.value === null
      ? "no value"
      : `${formatPlotValue(q.value)}${units.value ? ` ${units.value}` : ""}`;
  return plotText(
    `${q.label} · ${series}\np ${formatPlotValue(q.pressure)} ${units.pressure}\nT ${formatPlotValue(q.temperature)} ${units.temperature}\n${valueLabel} ${value}\n${QUERY_FLAG_TEXT[q.flag]}`,
  ).replace(/\n/g, "<br>");
}

/** Two traces: query points inside the data, and flagged ones (extrapolated or beyond the envelope). */
function queryTraces3d(
  queries: EvaluatedQuery[],
  series: PlotSeries,
  units: PlotUnits,
  valueLabel: string,
  scene: string,
  showlegend: boolean,
): Partial<Scatter3dData>[] {
  const shown = queries.filter((q) => q.value !== null);
  const ok = shown.filter((q) => q.flag === "inside");
  const flagged = shown.filter((q) => q.flag !== "inside");
  const out: Partial<Scatter3dData>[] = [];
  const common = (list: EvaluatedQuery[]) => ({
    type: "scatter3d" as const,
    mode: "text+markers" as const,
    scene,
    x: list.map((q) => q.pressure),
    y: list.map((q) => q.temperature),
    z: list.map((q) => q.value),
    hovertext: list.map((q) => queryHover(q, series.label, units, valueLabel)),
    hoverinfo: "text" as const,
    textposition: "top center" as const,
    legendgroup: "query",
    showlegend,
  });
  if (ok.length > 0) {
    out.push({
      ...common(ok),
      name: "Query points",
      text: ok.map((q) => plotText(q.label)),
      marker: {
        symbol: "diamond",
        size: 7,
        color: "#000000",
        line: { color: "#ffffff", width: 1 },
      },
      textfont: { color: "#000000", size: 12, family: FONT.family },
    });
  }
  if (flagged.length > 0) {
    out.push({
      ...common(flagged),
      name: FLAGGED_NAME,
      legendgroup: "query-flagged",
      text: flagged.map((q) => plotText(`${q.label}*`)),
      // 3D markers are drawn as text glyphs: "x" and "cross" have none in the app's font, the open diamond has
      marker: {
        symbol: "diamond-open",
        size: 8,
        color: FLAG,
        line: { color: FLAG, width: 2 },
      },
      textfont: { color: FLAG, size: 12, family: FONT.family },
    });
  }
  return out;
}

/** A sample measured at one temperature only: a curve, not a surface. */
const oneTemperature = (s: PlotSeries) => s.grid.temperatures.length === 1;

/** Whether temperature `t` is `at` (a measured temperature of axis `axis`), to display precision. */
function sameTemperature(t: number, at: number, axis: readonly number[]) {
  const span = Math.abs(axis[axis.length - 1]! - axis[0]!);
  return Math.abs(t - at) <= Math.max(span, Math.abs(at), 1) * 1e-6;
}

/**
 * [min, max] of the finite values with `room` (a fraction of the span) either side, or 5 % of the value (at least
 * 1) when they are all one value; never below 0 for values that are not.
 */
export function paddedRange(
  values: readonly number[],
  room = 0.03,
): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [0, 1];
  const lo = Math.min(...finite);
  const hi = Math.max(...finite);
  const pad = hi > lo ? (hi - lo) * room : Math.max(Math.abs(lo) * 0.05, 1);
  return [lo >= 0 ? Math.max(lo - pad, 0) : lo - pad, hi + pad];
}

type SurfaceInput = Pick<
  PropertySurfaceProps,
  | "series"
  | "valueLabel"
  | "units"
  | "method"
  | "degree"
  | "queryPoints"
  | "arrangement"
  | "resolution"
  | "height"
> & { narrow?: boolean };

export function surfaceFigure(input: SurfaceInput): Figure {
  const method: PlotMethod = input.method ?? "auto";
  const series = input.series.filter(
    (s) => s.grid.pressures.length > 0 && s.grid.temperatures.length > 0,
  );
  const arrangement =
    series.length > 1 ? (input.arrangement ?? "overlaid") : "side-by-side";
  const titles = axisTitles(input.units, input.valueLabel);
  const resolution = input.resolution ?? DEFAULT_SURFACE_RESOLUTION;
  // a sample measured at one temperature has no surface: it is drawn as its curve, a line at that temperature
  const surfaces = series.map((s) =>
    oneTemperature(s)
      ? null
      : surfaceOf(s.grid, method, input.degree, resolution),
  );
  const lines = series.map((s) =>
    oneTemperature(s)
      ? curveOf(
          s.grid,
          s.grid.temperatures[0]!,
          method,
          input.degree,
          resolution.pressures * 2,
        )
      : null,
  );
  const lineValues = lines.flatMap((l) =>
    l ? l.values.filter((v): v is number => v !== null) : [],
  );
  const cmin = Math.min(
    ...surfaces.map((s) => s?.min ?? Infinity),
    ...lineValues,
  );
  const cmax = Math.max(
    ...surfaces.map((s) => s?.max ?? -Infinity),
    ...lineValues,
  );
  const queries = input.queryPoints ?? [];
  // every scene of the figure shows the same pressure, temperature and value ranges, so side-by-side panels compare
  const extent = { x: [] as number[], y: [] as number[], z: [cmin, cmax] };
  const data: Data[] = [];
  const overlaid = arrangement === "overlaid";
  const sceneCount = overlaid ? 1 : series.length;
  const sceneId = (k: number) =>
    overlaid || k === 0 ? "scene" : `scene${k + 1}`;
  const hover = hoverLines(input.units, input.valueLabel);

  series.forEach((s, k) => {
    const surface = surfaces[k];
    const line = lines[k];
    const colour = pick(SERIES_COLOURS, k);
    const scene = sceneId(k);
    const { pressures: P, temperatures: T } = s.grid;
    extent.x.push(P[0]!, P[P.length - 1]!);
    extent.y.push(T[0]!, T[T.length - 1]!);
    if (line) {
      data.push({
        type: "scatter3d",
        mode: "lines",
        name: plotText(
          `${s.label} (measured at ${formatPlotValue(T[0]!)} ${input.units.temperature} only)`,
        ),
        scene,
        x: line.pressures,
        y: line.pressures.map(() => T[0]!),
        z: line.values,
        connectgaps: false,
        hovertemplate: `<b>${plotText(s.label)}</b><br>${hover.join("<br>")}<extra>interpolated</extra>`,
        line: overlaid
          ? { color: colour, width: 6, dash: pick(DASHES, k) }
          : { color: line.values, colorscale: "Cividis", cmin, cmax, width: 7 },
        showlegend: overlaid || sceneCount === 1,
        legendgroup: overlaid ? `series-${k}` : `line-${k}`,
      } as Partial<Scatter3dData>);
    }
    const trace: Partial<SurfaceData> | null = surface
      ? {
          type: "surface",
          name: plotText(s.label),
          scene,
          x: surface.pressures,
          y: surface.temperatures,
          z: surface.z,
          connectgaps: false,
          hovertemplate: `<b>${plotText(s.label)}</b><br>${hover.join("<br>")}<extra>interpolated</extra>`,
          contours: { z: { show: false } },
        }
      : null;
    if (!trace) {
      // no surface: nothing to add
    } else if (overlaid) {
      Object.assign(trace, {
        colorscale: [
          [0, colour],
          [1, colour],
        ],
        showscale: false,
        opacity: 0.82,
        showlegend: true,
        legendgroup: `series-${k}`,
        lighting: {
          ambient: 0.65,
          diffuse: 0.6,
          specular: 0.05,
          roughness: 0.9,
        },
      });
    } else {
      Object.assign(trace, {
        colorscale: "Cividis",
        cmin,
        cmax,
        showscale: k === series.length - 1,
        showlegend: false,
        colorbar: {
          title: { text: plotText(titles.value), side: "right" },
          thickness: 14,
          len: 0.75,
          outlinewidth: 0,
          tickfont: { size: 11 },
        },
      });
    }
    if (trace) data.push(trace);

    const measured = measuredPoints(s.grid);
    extent.z.push(...measured.map((m) => m.value));
    const markers: Partial<Scatter3dData> = {
      type: "scatter3d",
      mode: "markers",
      scene,
      name: overlaid ? `${plotText(s.label)}, measured` : "Measured",
      x: measured.map((m) => m.pressure),
      y: measured.map((m) => m.temperature),
      z: measured.map((m) => m.value),
      hovertemplate: `<b>${plotText(s.label)}</b><br>${hover.join("<br>")}<extra>measured</extra>`,
      marker: overlaid
        ? {
            symbol: pick(SYMBOLS_3D, k),
            size: 3.5,
            color: colour,
            line: { color: INK, width: 1 },
          }
        : {
            symbol: "circle",
            size: 3,
            color: "#ffffff",
            line: { color: INK, width: 1.5 },
          },
      legendgroup: overlaid ? `series-${k}` : "measured",
      showlegend: overlaid ? false : k === 0,
    };
    data.push(markers);
    // on a line, only the points at its temperature: the others have no surface to sit on
    const evaluated = evaluateQueries(
      s.grid,
      line
        ? queries.filter((q) => sameTemperature(q.temperature, T[0]!, T))
        : queries,
      method,
      input.degree,
    );
    for (const q of evaluated)
      if (q.value !== null) {
        extent.x.push(q.pressure);
        extent.y.push(q.temperature);
        extent.z.push(q.value);
      }
    data.push(
      ...queryTraces3d(
        evaluated,
        s,
        input.units,
        input.valueLabel,
        scene,
        overlaid ? k === 0 : k === 0,
      ),
    );
  });

  // pressure and temperature exactly as measured (and asked), as Plotly's own ranges were; room for the values
  const ranges = {
    x: paddedRange(extent.x, 0),
    y: paddedRange(extent.y, 0),
    z: paddedRange(extent.z),
  };
  const narrow = input.narrow ?? false;
  const { columns, rows } = sceneGrid(sceneCount, narrow);
  const sceneLayout = (k: number) => {
    const col = k % columns;
    const row = Math.floor(k / columns);
    const colourbarRoom = overlaid ? 0 : 0.06;
    const width = (1 - colourbarRoom) / columns;
    const heightShare = 1 / rows;
    const titleRoom = sceneCount > 1 ? 0.07 / rows : 0;
    return {
      domain: {
        x: [col * width, (col + 1) * width - 0.01],
        y: [1 - (row + 1) * heightShare, 1 - row * heightShare - titleRoom],
      },
      xaxis: {
        title: { text: plotText(titles.pressure) },
        gridcolor: GRID_LINE,
        backgroundcolor: "#ffffff",
        showbackground: true,
        hoverformat: NUM,
        range: ranges.x,
        autorange: false,
      },
      yaxis: {
        title: { text: plotText(titles.temperature) },
        gridcolor: GRID_LINE,
        backgroundcolor: "#ffffff",
        showbackground: true,
        hoverformat: NUM,
        range: ranges.y,
        autorange: false,
      },
      zaxis: {
        title: { text: plotText(titles.value) },
        gridcolor: GRID_LINE,
        backgroundcolor: "#f6f7f5",
        showbackground: true,
        hoverformat: NUM,
        range: ranges.z,
        autorange: false,
      },
      aspectmode: "manual",
      aspectratio: { x: 1.35, y: 1, z: 0.75 },
      // narrow side-by-side scenes need the camera further back, or the axis titles fall outside
      camera: narrow
        ? { eye: { x: 1.85, y: -2.0, z: 1.1 }, center: { x: 0, y: 0, z: -0.1 } }
        : sceneCount > 1
          ? {
              eye: { x: 1.6, y: -1.75, z: 0.95 },
              center: { x: 0, y: 0, z: -0.1 },
            }
          : {
              eye: { x: 1.3, y: -1.45, z: 0.75 },
              center: { x: 0, y: 0, z: -0.2 },
            },
    };
  };
  const layout: Figure["layout"] = {
    font: FONT,
    paper_bgcolor: "#ffffff",
    margin: { l: 0, r: 0, t: sceneCount > 1 ? 8 : 4, b: 0 },
    height: input.height ?? surfaceHeight(series.length, arrangement, narrow),
    autosize: true,
    showlegend: true,
    legend: {
      orientation: "h",
      x: 0,
      y: 0,
      yanchor: "bottom",
      bgcolor: "rgba(255,255,255,0.8)",
      font: { size: 12 },
    },
    hoverlabel: { font: { family: FONT.family, size: 12 } },
    uirevision: "isopleth-surface",
  };
  for (let k = 0; k < sceneCount; k++) layout[sceneId(k)] = sceneLayout(k);
  if (sceneCount > 1) {
    const annotations: Partial<Annotation>[] = series.map((s, k) => {
      const domain = sceneLayout(k).domain;
      const only = oneTemperature(s)
        ? ` · measured at ${formatPlotValue(s.grid.temperatures[0]!)} ${input.units.temperature} only`
        : "";
      return {
        text: `<b>${plotText(s.label)}</b>${plotText(only)}`,
        xref: "paper",
        yref: "paper",
        x: (domain.x[0]! + domain.x[1]!) / 2,
        y: domain.y[1]! + 0.01,
        xanchor: "center",
        yanchor: "bottom",
        showarrow: false,
        font: { size: 13, color: INK, family: FONT.family },
      };
    });
    layout.annotations = annotations;
  }
  return { data, layout };
}

type SlicesInput = Pick<
  PropertySlicesProps,
  | "series"
  | "valueLabel"
  | "units"
  | "method"
  | "degree"
  | "queryPoints"
  | "temperatures"
  | "resolution"
  | "height"
> & { narrow?: boolean };

/** The default slice temperatures: the measured temperatures of the first series. */
function defaultSliceTemperatures(series: PlotSeries[]): number[] {
  return series[0]?.grid.temperatures.slice() ?? [];
}

export function slicesFigure(input: SlicesInput): Figure {
  const method: PlotMethod = input.method ?? "auto";
  const series = input.series.filter(
    (s) => s.grid.pressures.length > 0 && s.grid.temperatures.length > 0,
  );
  const temperatures = (
    input.temperatures && input.temperatures.length > 0
      ? input.temperatures
      : defaultSliceTemperatures(series)
  ).filter(Number.isFinite);
  const titles = axisTitles(input.units, input.valueLabel);
  const units = input.units;
  const many = series.length > 1;
  const data: Data[] = [];
  const shapes: Partial<Shape>[] = [];
  const annotations: Partial<Annotation>[] = [];
  const hover = hoverLines(units, input.valueLabel);
  const tUnit = units.temperature;
  // a sample measured at one temperature has its one curve, whatever temperatures the others are cut at
  const curves = series.flatMap((s, k) =>
    (oneTemperature(s) ? [s.grid.temperatures[0]!] : temperatures).map(
      (t, j) => ({
        s,
        k,
        t,
        j,
        curve: curveOf(
          s.grid,
          t,
          method,
          input.degree,
          input.resolution ?? DEFAULT_CURVE_RESOLUTION,
        ),
      }),
    ),
  );
  // with many curves the dashed lines and legend entries would bury the data: the hollow diamonds remain, with
  // one legend entry for all of them
  const annotateBubble = curves.filter((c) => c.curve.bubblePoint).length <= 6;
  let anyBubble = false;

  for (const { s, k, t, j, curve } of curves) {
    const colour = many ? pick(SERIES_COLOURS, k) : pick(SERIES_COLOURS, j);
    const dash =
      many && temperatures.length > 1
        ? pick(DASHES, j)
        : many
          ? pick(DASHES, k)
          : pick(DASHES, j);
    const symbol = many ? pick(SYMBOLS_2D, k) : pick(SYMBOLS_2D, j);
    const name = many
      ? `${s.label} · ${formatPlotValue(t)} ${tUnit}`
      : `${formatPlotValue(t)} ${tUnit}`;
    const group = `curve-${k}-${j}`;
    const tLine = `T ${formatPlotValue(t)} ${plotText(tUnit)}`;
    data.push({
      type: "scatter",
      mode: "lines",
      name: plotText(name),
      legendgroup: group,
      x: curve.pressures,
      y: curve.values,
      connectgaps: false,
      line: { color: colour, dash, width: 2 },
      hovertemplate: `<b>${plotText(s.label)}</b><br>${hover[0]}<br>${tLine}<br>${hover[2]}<extra>interpolated</extra>`,
    } satisfies Partial<ScatterData>);
    if (curve.measured.length > 0) {
      data.push({
        type: "scatter",
        mode: "markers",
        name: plotText(`${name}, measured`),
        legendgroup: group,
        showlegend: false,
        x: curve.measured.map((m) => m.pressure),
        y: curve.measured.map((m) => m.value),
        marker: {
          symbol,
          size: 8,
          color: colour,
          line: { color: INK, width: 1 },
        },
        hovertemplate: `<b>${plotText(s.label)}</b><br>${hover[0]}<br>${tLine}<br>${hover[2]}<extra>measured</extra>`,
      } satisfies Partial<ScatterData>);
    }
    const pb = curve.bubblePoint;
    if (pb) {
      anyBubble = true;
      if (annotateBubble)
        shapes.push({
          type: "line",
          xref: "x",
          yref: "paper",
          x0: pb.pressure,
          x1: pb.pressure,
          y0: 0,
          y1: 1,
          line: { color: colour, width: 1.5, dash: "dash" },
          opacity: 0.75,
        });
      // each bubble point is named in the legend (its pressure beside its curve's name), never as text on the
      // axes, where close bubble points' labels would overlap each other and the curves
      if (pb.value !== null || annotateBubble) {
        data.push({
          type: "scatter",
          mode: "markers",
          name: annotateBubble
            ? plotText(
                `pb ${formatPlotValue(pb.pressure)} ${units.pressure} (${name})`,
              )
            : "Bubble point",
          legendgroup: group,
          showlegend: annotateBubble,
          x: [pb.pressure],
          y: [pb.value],
          marker: {
            symbol: "diamond-wide",
            size: 13,
            color: "#ffffff",
            line: { color: colour, width: 2.5 },
          },
          hovertemplate:
            plotText(`Bubble point of ${s.label}`) +
            `<br>pb ${formatPlotValue(pb.pressure)} ${plotText(units.pressure)}<br>${tLine}<br>${plotText(input.valueLabel)} %{y:${NUM}} ${plotText(units.value)}<extra></extra>`,
        } satisfies Partial<ScatterData>);
      }
    }
  }
  if (anyBubble && !annotateBubble) {
    data.push({
      type: "scatter",
      mode: "markers",
      name: "Bubble point",
      x: [null],
      y: [null],
      marker: {
        symbol: "diamond-wide",
        size: 13,
        color: "#ffffff",
        line: { color: INK, width: 2 },
      },
      hoverinfo: "skip",
    } satisfies Partial<ScatterData>);
  }

  // query points on every series, at their own temperature
  const queries: QueryPoint[] = input.queryPoints ?? [];
  if (queries.length > 0) {
    // labelled once (on the first sample's curve); the other samples' markers say which point they are on hover
    // each point sits only on its own slice: a series' curve at the point's temperature (none when no curve is)
    const all = series.flatMap((s, k) => {
      const cut = curves.filter((c) => c.k === k).map((c) => c.t);
      const own = queries.filter((q) =>
        cut.some((t) => sameTemperature(q.temperature, t, s.grid.temperatures)),
      );
      return evaluateQueries(s.grid, own, method, input.degree).map((q) => ({
        q,
        s,
        labelled: k === 0,
      }));
    });
    const shown = all.filter(({ q }) => q.value !== null);
    const groups = [
      {
        list: shown.filter(({ q }) => q.flag === "inside"),
        name: "Query points",
        marker: {
          symbol: "star" as const,
          size: 13,
          color: "#000000",
          line: { color: "#ffffff", width: 1 },
        },
        text: "#000000",
      },
      {
        list: shown.filter(({ q }) => q.flag !== "inside"),
        name: FLAGGED_NAME,
        marker: {
          symbol: "x" as const,
          size: 11,
          color: FLAG,
          line: { color: "#ffffff", width: 0.5 },
        },
        text: FLAG,
      },
    ];
    for (const g of groups) {
      if (g.list.length === 0) continue;
      data.push({
        type: "scatter",
        mode: "text+markers",
        name: g.name,
        x: g.list.map(({ q }) => q.pressure),
        y: g.list.map(({ q }) => q.value),
        text: g.list.map(({ q, labelled }) =>
          labelled
            ? plotText(q.flag === "inside" ? q.label : `${q.label}*`)
            : "",
        ),
        textposition: "top center",
        textfont: { color: g.text, size: 12, family: FONT.family },
        marker: g.marker,
        hovertext: g.list.map(({ q, s }) =>
          queryHover(q, s.label, units, input.valueLabel),
        ),
        hoverinfo: "text",
      } satisfies Partial<ScatterData>);
    }
  }

  const layout: Figure["layout"] = {
    font: FONT,
    paper_bgcolor: "#ffffff",
    plot_bgcolor: "#ffffff",
    height:
      input.height ??
      (input.narrow
        ? SLICES_HEIGHT +
          24 *
            Math.ceil(
              data.filter(
                (d) => (d as { showlegend?: boolean }).showlegend !== false,
              ).length / 2,
            )
        : SLICES_HEIGHT),
    autosize: true,
    margin: input.narrow
      ? { l: 56, r: 8, t: 16, b: 56 }
      : { l: 72, r: 16, t: 16, b: 56 },
    xaxis: {
      title: { text: plotText(titles.pressure) },
      gridcolor: GRID_LINE,
      zeroline: false,
      hoverformat: NUM,
      linecolor: "#9aa5a0",
      ticks: "outside",
    },
    yaxis: {
      title: { text: plotText(titles.value) },
      gridcolor: GRID_LINE,
      zeroline: false,
      hoverformat: NUM,
      linecolor: "#9aa5a0",
      ticks: "outside",
    },
    hovermode: "closest",
    showlegend: true,
    // narrow screens: the legend goes under the axes instead of taking half the width
    legend: input.narrow
      ? {
          orientation: "h",
          x: 0,
          xanchor: "left",
          y: -0.18,
          yanchor: "top",
          font: { size: 11 },
        }
      : {
          orientation: "v",
          x: 1.01,
          xanchor: "left",
          y: 1,
          font: { size: 12 },
        },
    hoverlabel: { font: { family: FONT.family, size: 12 } },
    shapes,
    annotations,
    uirevision: "isopleth-slices",
  };
  return { data, layout };
}
