/**
 * The only module that imports Plotly. It is loaded with a lazy import by PropertySurface and PropertySlices
 * after the page has mounted, so Plotly is fetched only on pages that plot, never rendered on the server, and
 * never part of another page's bundle. It uses Plotly's partial bundle with the 3D traces (1.75 MB instead of the
 * 4.6 MB full bundle; it holds scatter, surface and scatter3d, all these plots draw), which starts in about 2 s
 * instead of 3.5–7 s on machines without a GPU.
 */
import Plotly from "plotly.js-gl3d-dist-min";
import { useEffect, useMemo, useState } from "react";
import createPlotlyComponent from "react-plotly.js/factory";
import { slicesFigure, surfaceFigure, type Figure } from "./figures";
import { NARROW_WIDTH } from "./size";
import type { PropertySlicesProps, PropertySurfaceProps } from "./types";

const Plot = createPlotlyComponent(Plotly);

// User-timing marks for scripts/bench-surface.ts and the browser's performance panel.
performance.mark("isopleth:plotly-ready");

const CONFIG = {
  // Plotly draws 3D scenes at twice the CSS resolution by default; with software WebGL (no GPU) that quadruples
  // the work of every frame. The screen's own ratio keeps them sharp on high-density displays.
  plotGlPixelRatio:
    typeof window === "undefined"
      ? 1
      : Math.min(window.devicePixelRatio || 1, 2),
  displaylogo: false,
  responsive: true,
  modeBarButtonsToRemove: ["sendDataToCloud", "lasso2d", "select2d"],
  toImageButtonOptions: { format: "png", scale: 2 },
};

type State = "drawing" | "drawn" | "error";

/** True on screens narrower than NARROW_WIDTH (after mount; this module never runs on the server). */
function useNarrow(): boolean {
  const [narrow, setNarrow] = useState(
    () => window.matchMedia(`(max-width: ${NARROW_WIDTH}px)`).matches,
  );
  useEffect(() => {
    const query = window.matchMedia(`(max-width: ${NARROW_WIDTH}px)`);
    const update = () => setNarrow(query.matches);
    query.addEventListener("change", update);
    return () => query.removeEventListener("change", update);
  }, []);
  return narrow;
}

function FigureView({
  build,
  inputs,
  label,
  height,
  className,
  testId,
  onReady,
}: {
  build: () => Figure;
  /** Everything the figure depends on: it is rebuilt only when these change in value, not in identity. */
  inputs: unknown[];
  label: string;
  height: number;
  className?: string;
  testId: string;
  onReady?: () => void;
}) {
  const [state, setState] = useState<State>("drawing");
  const key = JSON.stringify(inputs);
  const result = useMemo(() => {
    try {
      return { figure: build(), error: null };
    } catch (error) {
      return {
        figure: null,
        error: error instanceof Error ? error.message : String(error),
      };
    }
    // `key` stands for the inputs, which `build` closes over
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  const failed = result.figure === null;
  useEffect(() => {
    if (failed) onReady?.();
    // Once per failure: a parent's new callback identity must not report it again.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [failed]);
  if (!result.figure) {
    return (
      <div
        role="alert"
        className={`flex items-center justify-center rounded border border-line bg-panel p-6 text-sm text-danger ${className ?? ""}`}
        style={{ height }}
      >
        The plot could not be drawn: {result.error}
      </div>
    );
  }
  return (
    <div
      className={className}
      data-testid={testId}
      data-state={state}
      role="figure"
      aria-label={label}
    >
      <Plot
        data={result.figure.data}
        layout={result.figure.layout}
        config={CONFIG}
        useResizeHandler
        style={{ width: "100%", height: result.figure.layout.height ?? height }}
        onInitialized={() => {
          performance.mark(`isopleth:${testId}-drawn`);
          setState("drawn");
          onReady?.();
        }}
        onUpdate={() => setState("drawn")}
        onError={() => {
          setState("error");
          onReady?.();
        }}
      />
    </div>
  );
}

export function SurfaceFigure(props: PropertySurfaceProps) {
  const narrow = useNarrow();
  const {
    series,
    valueLabel,
    units,
    method,
    degree,
    queryPoints,
    arrangement,
    resolution,
    height,
    className,
    onReady,
  } = props;
  return (
    <FigureView
      testId="property-surface"
      label={`3D surface of ${valueLabel} over pressure and temperature`}
      height={height ?? 460}
      className={className}
      onReady={onReady}
      build={() =>
        surfaceFigure({
          series,
          valueLabel,
          units,
          method,
          degree,
          queryPoints,
          arrangement,
          resolution,
          height,
          narrow,
        })
      }
      inputs={[
        series,
        valueLabel,
        units,
        method,
        degree,
        queryPoints,
        arrangement,
        resolution,
        height,
        narrow,
      ]}
    />
  );
}

export function SlicesFigure(props: PropertySlicesProps) {
  const narrow = useNarrow();
  const {
    series,
    valueLabel,
    units,
    method,
    degree,
    queryPoints,
    temperatures,
    resolution,
    height,
    className,
    onReady,
  } = props;
  return (
    <FigureView
      testId="property-slices"
      label={`${valueLabel} against pressure at fixed temperatures`}
      height={height ?? 420}
      className={className}
      onReady={onReady}
      build={() =>
        slicesFigure({
          series,
          valueLabel,
          units,
          method,
          degree,
          queryPoints,
          temperatures,
          resolution,
          height,
          narrow,
        })
      }
      inputs={[
        series,
        valueLabel,
        units,
        method,
        degree,
        queryPoints,
        temperatures,
        resolution,
        height,
        narrow,
      ]}
    />
  );
}
