// Plot components for property grids. Safe to import anywhere: Plotly itself is loaded lazily, in the browser
// only, by the components below. See README.md.
export {
  PlotPlaceholder,
  PropertySlices,
  PropertySurface,
  preloadPlots,
} from "./lazy-plot";
export type { PlotSeries, PlotUnits, QueryPoint } from "./types";
