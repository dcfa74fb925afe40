/** Limits and choices of the compare page, shared by its loader (which parses the query) and its components. */

/** At most this many samples are compared at once. */
export const MAX_COMPARED_SAMPLES = 4;

/** How the 3D surfaces of several samples are arranged: in one scene, or one scene each. */
export const SURFACE_ARRANGEMENTS = ["overlaid", "side-by-side"] as const;
export type SurfaceArrangement = (typeof SURFACE_ARRANGEMENTS)[number];
