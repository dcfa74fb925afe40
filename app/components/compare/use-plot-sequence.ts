import { useCallback, useEffect, useState } from "react";
import { preloadPlots } from "~/components/plots";

/** The slices are drawn anyway after this long if the surface never reports its first draw. */
const SLICES_AT_THE_LATEST_MS = 30_000;

/**
 * The order the compare page draws its plots in. The plot code is fetched at once, in parallel with everything
 * else on the page; the slices wait for the surface's first draw, so that the two do not share the main thread
 * while Plotly starts (the 3D scene is the slow one).
 */
export function usePlotSequence(plotCount: number) {
  useEffect(() => {
    if (plotCount > 0) void preloadPlots().catch(() => {});
  }, [plotCount]);

  const [slicesMayDraw, setSlicesMayDraw] = useState(false);
  useEffect(() => {
    const timer = setTimeout(
      () => setSlicesMayDraw(true),
      SLICES_AT_THE_LATEST_MS,
    );
    return () => clearTimeout(timer);
  }, []);
  const surfaceDrawn = useCallback(() => setSlicesMayDraw(true), []);
  return { slicesMayDraw, surfaceDrawn };
}
