/** Sizes shared by the loading placeholder and the drawn figure, so the page does not jump when Plotly arrives. */
const SURFACE_ROW_HEIGHT = 460;
/** One scene (one sample, or several overlaid) gets a little more room. */
const SINGLE_SCENE_HEIGHT = 520;
export const SLICES_HEIGHT = 420;
/** Below this width (CSS pixels) the plots stack their scenes and put the legend under the axes. */
export const NARROW_WIDTH = 640;
const NARROW_ROW_HEIGHT = 380;

/**
 * Side-by-side scenes: at most two per row. A third column leaves each scene too narrow for its axis titles
 * at the width of the app's pages.
 */
export function sceneGrid(
  n: number,
  narrow = false,
): { columns: number; rows: number } {
  const columns = narrow ? 1 : Math.min(Math.max(n, 1), 2);
  return { columns, rows: Math.ceil(Math.max(n, 1) / columns) };
}

export function surfaceHeight(
  n: number,
  arrangement: "side-by-side" | "overlaid" = "side-by-side",
  narrow = false,
): number {
  if (arrangement === "overlaid" || n <= 1)
    return narrow ? NARROW_ROW_HEIGHT + 40 : SINGLE_SCENE_HEIGHT;
  return (
    sceneGrid(n, narrow).rows *
    (narrow ? NARROW_ROW_HEIGHT : SURFACE_ROW_HEIGHT)
  );
}
