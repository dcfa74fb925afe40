/**
 * Plain-data props of the plot components (see README.md in this folder). Everything is in display units:
 * the caller converts (the samples API already answers in field or metric units) and passes the unit labels.
 */
import type { ApiGrid } from "~/utils/api/client";

/**
 * A measured property grid, as the samples API returns it (`grids[]` of GET /api/v1/samples/:id, its generated
 * type): pressures and temperatures strictly increasing, values[i][j] at pressures[i], temperatures[j] (null = not
 * measured), the bubble-point pressure per temperature column where known; all in display units.
 */
export type PlotGrid = Pick<
  ApiGrid,
  "pressures" | "temperatures" | "values" | "bubblePoints"
>;

/** One sample's grid of the plotted property. */
export type PlotSeries = {
  /** Stable key (the sample id). */
  id: string | number;
  /** Shown in legends, titles and hover labels, e.g. "CS-1 BH-01". */
  label: string;
  grid: PlotGrid;
};

/** Unit symbols as shown on axes and in hover labels, e.g. { pressure: "psia", temperature: "°F", value: "rb/STB" }. */
export type PlotUnits = {
  pressure: string;
  temperature: string;
  value: string;
};

/** "auto" is newton with pchip where newton overshoots, as the lookup API does. */
export type PlotMethod = "auto" | "newton" | "pchip" | "linear";

/** A condition asked for by the user, shown on the plots with its own symbol. */
export type QueryPoint = {
  pressure: number;
  temperature: number;
  /** Short label drawn next to the marker; default "Q1", "Q2", … */
  label?: string;
};

/** How a query point relates to the measured data of one series. */
export type QueryFlag =
  "inside" | "extrapolated" | "beyond-envelope" | "unavailable";

/** Props shared by PropertySurface and PropertySlices. */
type CommonPlotProps = {
  /** One to four series (samples) of the same property. */
  series: PlotSeries[];
  /** Name of the plotted property for axis titles and hover, e.g. "Bo" or "Oil viscosity". */
  valueLabel: string;
  units: PlotUnits;
  /** Interpolation method of the drawn surface and curves; default "auto". */
  method?: PlotMethod;
  /** Newton degree: one number for both axes or [pressure, temperature]; default 3. */
  degree?: number | [number, number];
  /** Conditions to mark on the plot. */
  queryPoints?: QueryPoint[];
  /** Plot height in CSS pixels. */
  height?: number;
  className?: string;
  /** Called once, when the first draw has finished (or failed): e.g. to draw a second plot only afterwards. */
  onReady?: () => void;
};

export type PropertySurfaceProps = CommonPlotProps & {
  /**
   * Several series: all surfaces in one scene, each in its own colour (default), or one scene per series side
   * by side. Every scene is one more WebGL context to set up, so "overlaid" draws sooner.
   */
  arrangement?: "side-by-side" | "overlaid";
  /** Evenly spaced grid the surface is interpolated on; default 60 × 30 (see DEFAULT_SURFACE_RESOLUTION). */
  resolution?: { pressures: number; temperatures: number };
};

export type PropertySlicesProps = CommonPlotProps & {
  /** Temperatures of the slices (display unit); default: the measured temperatures of the first series. */
  temperatures?: number[];
  /** Points per interpolated curve (measured pressures and the bubble point are added); default 120. */
  resolution?: number;
};
