/**
 * Bubble-point pressure at many temperatures in one batch. The engine interpolates pb(T) through the
 * columns' bubble points with the method's own temperature step (Newton on the zone of the requested
 * temperature degree, pchip, or linear), after filling columns given as null piecewise linearly along
 * temperature. The same interpolation is run here as a one-row grid through the typed-array batch path, so
 * 10,000 temperatures cost one pass instead of 10,000 single-point calls. It agrees with the engine's
 * `bubblePointPressure` to rounding (checked in bubble-point.test.ts); the engine also snaps a bubble point
 * lying within 10⁻⁶ of a pressure step of a grid row onto that row, which this leaves out.
 */
import { interpolateGridMany, type Grid, type Method } from "../interpolation";

type Entry = {
  readonly source: Grid["bubblePoints"];
  readonly temperatures: number[];
  readonly grid: Grid | null;
};
const cache = new WeakMap<Grid, Entry>();

/** The one-row grid of bubble points along temperature, or null when the grid has none known. */
function bubblePointGrid(grid: Grid): Grid | null {
  const hit = cache.get(grid);
  if (
    hit &&
    hit.source === grid.bubblePoints &&
    hit.temperatures === grid.temperatures
  )
    return hit.grid;
  const built = build(grid);
  cache.set(grid, {
    source: grid.bubblePoints,
    temperatures: grid.temperatures,
    grid: built,
  });
  return built;
}

function build(grid: Grid): Grid | null {
  const given = grid.bubblePoints;
  if (!given) return null;
  const T = grid.temperatures;
  const known: number[] = [];
  for (let j = 0; j < given.length; j++)
    if (given[j] !== null && given[j] !== undefined) known.push(j);
  if (known.length === 0) return null;
  const row = T.map((t, j) => {
    const g = given[j];
    if (g !== null && g !== undefined) return g;
    // as the engine: linear between the nearest known columns, straight on through the two nearest
    // known columns beyond them, constant when only one is known
    let lower = -1;
    let upper = -1;
    for (const idx of known) {
      if (T[idx]! < t) lower = idx;
      else if (upper < 0) upper = idx;
    }
    if (lower < 0 || upper < 0) {
      if (known.length === 1) return given[known[0]!]!;
      const k = known.length;
      [lower, upper] =
        lower < 0 ? [known[0]!, known[1]!] : [known[k - 2]!, known[k - 1]!];
    }
    const a = given[lower]!;
    const b = given[upper]!;
    return a + ((b - a) * (t - T[lower]!)) / (T[upper]! - T[lower]!);
  });
  return { pressures: [0], temperatures: T, values: [row] };
}

/**
 * pb at each temperature (canonical units), with the temperature step of `method` and temperature degree
 * `temperatureDegree` (newton only). Null when the grid has no known bubble point.
 */
export function bubblePointsAt(
  grid: Grid,
  temperatures: Float64Array,
  method: Method,
  temperatureDegree: number,
): Float64Array | null {
  const pbGrid = bubblePointGrid(grid);
  if (!pbGrid) return null;
  const pressures = new Float64Array(temperatures.length);
  const out = interpolateGridMany(
    pbGrid,
    { pressures, temperatures },
    {
      method,
      degree: [1, method === "linear" ? 1 : temperatureDegree],
      extrapolate: true,
      // the engine extrapolates pb(T) along temperature without limit: a point's own distance from the
      // measured temperatures is judged by the lookup itself
      maxExtrapolation: Infinity,
    },
  );
  return out.values;
}
