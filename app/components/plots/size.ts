/** Sizes shared by the loading placeholder and the drawn figure, so the page does not jump when Plotly arrives. */
export const SURFACE_ROW_HEIGHT = 460;
/** One scene (one sample, or several overlaid) gets a little more room. */
export const SINGLE_SCENE_HEIGHT = 520;
export const SLICES_HEIGHT = 420;

/** Side-by-side scenes: columns and rows for n series (one row up to three, then two by two). */
export function sceneGrid(n: number): { columns: number; rows: number } {
  const columns = n <= 3 ? Math.max(n, 1) : 2;
  return { columns, rows: Math.ceil(Math.max(n, 1) / columns) };
}

export function surfaceHeight(n: number, arrangement: "side-by-side" | "overlaid" = "side-by-side", rowHeight = SURFACE_ROW_HEIGHT): number {
  if (arrangement === "overlaid" || n <= 1) return SINGLE_SCENE_HEIGHT;
  return sceneGrid(n).rows * rowHeight;
}
