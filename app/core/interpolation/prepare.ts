// The validated, typed-array form of a grid, built once per grid object and reused by every call.
// Indices are in range by construction.
import { AxisIndex } from "./axis";
import { dividedDifferences, newtonOut, newtonTerms } from "./newton";
import { snapTolerance } from "./range";
import type { Grid } from "./types";
import { validateGrid } from "./validate";

/**
 * Measured nodes of every temperature column on one branch, flattened: column j owns
 * [off[j], off[j+1]) in x (pressure), y (value) and row (grid row index, −1 for a bubble-point node that
 * is not a grid row). The "full" arrays also keep the cells that were not measured (y = NaN); they give
 * the zone the rule would pick on a complete table, which tells whether missing cells moved it.
 */
export type BranchNodes = {
  x: Float64Array;
  y: Float64Array;
  row: Int32Array;
  off: Int32Array;
  fullX: Float64Array;
  fullY: Float64Array;
  fullOff: Int32Array;
  /** 1 when the column's list starts (undersaturated) or ends (saturated) at its bubble-point node. */
  bubbleFirst: Uint8Array;
  bubbleLast: Uint8Array;
};

type BubbleInfo = {
  /** Bubble-point pressure per column; columns given as null are filled along temperature (see README). */
  pb: Float64Array;
  known: Uint8Array;
  /** Temperatures of the first and last column with a known bubble point. */
  knownLo: number;
  knownHi: number;
  /** Value shared by both branches at each column's bubble point (NaN when none can be formed). */
  value: Float64Array;
  /** Grid row of the bubble-point node, or −1 when it was inserted between rows. */
  row: Int32Array;
};

export type PreparedGrid = {
  readonly source: Grid;
  readonly refs: readonly unknown[];
  readonly N: number;
  readonly M: number;
  readonly P: Float64Array;
  readonly T: Float64Array;
  /** Values column by column: V[j * N + i] = values[i][j]; NaN where not measured. */
  readonly V: Float64Array;
  readonly complete: boolean;
  readonly pAxis: AxisIndex;
  readonly tAxis: AxisIndex;
  /** Snap tolerances of the two axes (see range.ts, `snapTolerance`). */
  readonly pSnap: number;
  readonly tSnap: number;
  readonly bubble: BubbleInfo | null;
  /** Bubble points were given, but every entry is null. */
  readonly bubbleUnknown: boolean;
  /** Index 0: all nodes (no bubble point); 1: saturated branch; 2: undersaturated branch. */
  readonly branches: readonly [
    BranchNodes,
    BranchNodes | null,
    BranchNodes | null,
  ];
};

const cache = new WeakMap<Grid, PreparedGrid>();
let last: PreparedGrid | null = null;

function refsOf(grid: Grid): unknown[] {
  return [grid.pressures, grid.temperatures, grid.values, grid.bubblePoints];
}

/**
 * Validates and prepares a grid, or returns the prepared form cached for this grid object (kept as long
 * as the grid object lives). The cache notices when the grid's pressures, temperatures, values or
 * bubblePoints array is replaced by another; it does not notice a number or a row changed inside them.
 * Treat a grid as an immutable value: to change it, make a new grid object.
 */
export function prepareGrid(grid: Grid): PreparedGrid {
  const l = last;
  if (l !== null && l.source === grid && sameRefs(l.refs, grid)) return l;
  const hit = cache.get(grid);
  if (hit && sameRefs(hit.refs, grid)) return (last = hit);
  validateGrid(grid);
  const prepared = buildPrepared(grid);
  cache.set(grid, prepared);
  return (last = prepared);
}

function sameRefs(refs: readonly unknown[], grid: Grid): boolean {
  return (
    refs[0] === grid.pressures &&
    refs[1] === grid.temperatures &&
    refs[2] === grid.values &&
    refs[3] === grid.bubblePoints
  );
}

function buildPrepared(grid: Grid): PreparedGrid {
  const N = grid.pressures.length;
  const M = grid.temperatures.length;
  const P = Float64Array.from(grid.pressures);
  const T = Float64Array.from(grid.temperatures);
  const V = new Float64Array(N * M);
  let complete = true;
  for (let i = 0; i < N; i++) {
    const row = grid.values[i]!;
    for (let j = 0; j < M; j++) {
      const v = row[j];
      if (v === null || v === undefined) {
        V[j * N + i] = NaN;
        complete = false;
      } else V[j * N + i] = v;
    }
  }
  let bubble: BubbleInfo | null = null;
  let bubbleUnknown = false;
  if (grid.bubblePoints) {
    bubble = buildBubble(grid.bubblePoints, P, T, V);
    bubbleUnknown = bubble === null;
  }
  const all = buildBranch(P, V, N, M, null, 0);
  const branches: PreparedGrid["branches"] = bubble
    ? [
        all,
        buildBranch(P, V, N, M, bubble, 1),
        buildBranch(P, V, N, M, bubble, 2),
      ]
    : [all, null, null];
  return {
    source: grid,
    refs: refsOf(grid),
    N,
    M,
    P,
    T,
    V,
    complete,
    pAxis: new AxisIndex(P),
    tAxis: new AxisIndex(T),
    pSnap: snapTolerance(P),
    tSnap: snapTolerance(T),
    bubble,
    bubbleUnknown,
    branches,
  };
}

/** Relative distance under which a bubble point is taken to sit on a grid row. */
const SNAP = 1e-6;

function buildBubble(
  given: (number | null)[],
  P: Float64Array,
  T: Float64Array,
  V: Float64Array,
): BubbleInfo | null {
  const M = T.length;
  const N = P.length;
  const known = new Uint8Array(M);
  const knownIdx: number[] = [];
  for (let j = 0; j < M; j++) {
    if (given[j] !== null && given[j] !== undefined) {
      known[j] = 1;
      knownIdx.push(j);
    }
  }
  if (knownIdx.length === 0) return null;
  const pb = new Float64Array(M);
  for (let j = 0; j < M; j++) {
    const g = given[j];
    if (g !== null && g !== undefined) {
      pb[j] = g;
      continue;
    }
    pb[j] = fillAlongTemperature(given, knownIdx, T, j);
  }
  const value = new Float64Array(M);
  const row = new Int32Array(M);
  for (let j = 0; j < M; j++) {
    const col = j * N;
    const p = pb[j]!;
    row[j] = -1;
    value[j] = NaN;
    // On a grid row (within rounding) with a measured value: that row is the shared node.
    let nearest = 0;
    for (let i = 1; i < N; i++)
      if (Math.abs(P[i]! - p) < Math.abs(P[nearest]! - p)) nearest = i;
    const gapBelow = nearest > 0 ? P[nearest]! - P[nearest - 1]! : Infinity;
    const gapAbove = nearest < N - 1 ? P[nearest + 1]! - P[nearest]! : Infinity;
    const gap = N > 1 ? Math.min(gapBelow, gapAbove) : Math.max(1, Math.abs(p));
    if (
      Math.abs(P[nearest]! - p) <= SNAP * gap &&
      !Number.isNaN(V[col + nearest]!)
    ) {
      pb[j] = P[nearest]!;
      row[j] = nearest;
      value[j] = V[col + nearest]!;
      continue;
    }
    if (!(p > P[0]! && p < P[N - 1]!)) continue; // outside the table: the column lies on one branch
    value[j] = bubbleValue(P, V, col, N, p);
  }
  let knownLo = Infinity;
  let knownHi = -Infinity;
  for (const idx of knownIdx) {
    knownLo = Math.min(knownLo, T[idx]!);
    knownHi = Math.max(knownHi, T[idx]!);
  }
  return { pb, known, knownLo, knownHi, value, row };
}

/**
 * Bubble point of a column given as null: piecewise linear along temperature through the known columns,
 * continued straight through the nearest two beyond them, constant when only one is known.
 */
function fillAlongTemperature(
  given: (number | null)[],
  knownIdx: number[],
  T: Float64Array,
  j: number,
): number {
  let lower = -1;
  let upper = -1;
  for (const idx of knownIdx) {
    if (T[idx]! < T[j]!) lower = idx;
    else if (upper < 0) upper = idx;
  }
  if (lower < 0 || upper < 0) {
    if (knownIdx.length === 1) return given[knownIdx[0]!]!;
    const k = knownIdx.length;
    [lower, upper] =
      lower < 0
        ? [knownIdx[0]!, knownIdx[1]!]
        : [knownIdx[k - 2]!, knownIdx[k - 1]!];
  }
  const a = given[lower]!;
  const b = given[upper]!;
  return a + ((b - a) * (T[j]! - T[lower]!)) / (T[upper]! - T[lower]!);
}

const xs3 = new Float64Array(3);
const cs3 = new Float64Array(3);

/**
 * Value at a bubble point that lies between two grid rows: each branch is continued to pb with the
 * quadratic through its three measured nodes nearest to pb (fewer if it has fewer), and the two
 * estimates are blended with weights inversely proportional to the distance from pb to each branch's
 * nearest node, so the side measured closer to pb counts more. NaN when neither branch has a value.
 */
function bubbleValue(
  P: Float64Array,
  V: Float64Array,
  col: number,
  N: number,
  pb: number,
): number {
  let sum = 0;
  let weights = 0;
  for (const side of [-1, 1] as const) {
    let count = 0;
    // walk away from pb on this side, collecting up to three measured nodes, nearest first
    let i = side < 0 ? N - 1 : 0;
    while (i >= 0 && i < N && (side < 0 ? P[i]! >= pb : P[i]! <= pb)) i += side;
    for (; i >= 0 && i < N && count < 3; i += side) {
      if (Number.isNaN(V[col + i]!)) continue;
      xs3[count] = P[i]!;
      cs3[count] = V[col + i]!;
      count++;
    }
    if (count === 0) continue;
    dividedDifferences(xs3, 0, cs3, 0, count);
    newtonTerms(xs3, 0, cs3, 0, count, count, pb);
    const w = 1 / Math.abs(pb - xs3[0]!);
    sum += w * newtonOut.value;
    weights += w;
  }
  return weights > 0 ? sum / weights : NaN;
}

function buildBranch(
  P: Float64Array,
  V: Float64Array,
  N: number,
  M: number,
  bubble: BubbleInfo | null,
  branch: 0 | 1 | 2,
): BranchNodes {
  const x: number[] = [];
  const y: number[] = [];
  const row: number[] = [];
  const fullX: number[] = [];
  const fullY: number[] = [];
  const off = new Int32Array(M + 1);
  const fullOff = new Int32Array(M + 1);
  const bubbleFirst = new Uint8Array(M);
  const bubbleLast = new Uint8Array(M);
  for (let j = 0; j < M; j++) {
    off[j] = x.length;
    fullOff[j] = fullX.length;
    const col = j * N;
    const pb = bubble ? bubble.pb[j]! : NaN;
    const bRow = bubble ? bubble.row[j]! : -1;
    const hasNode =
      bubble !== null && (bRow >= 0 || (pb > P[0]! && pb < P[N - 1]!));
    const push = (px: number, py: number, r: number): void => {
      fullX.push(px);
      fullY.push(py);
      if (!Number.isNaN(py)) {
        x.push(px);
        y.push(py);
        row.push(r);
      }
    };
    if (branch === 2 && hasNode) {
      push(pb, bubble.value[j]!, bRow);
      if (!Number.isNaN(bubble.value[j]!)) bubbleFirst[j] = 1;
    }
    for (let i = 0; i < N; i++) {
      const p = P[i]!;
      if (i === bRow) continue;
      if (branch === 1 && !(p < pb)) continue;
      if (branch === 2 && !(p > pb)) continue;
      push(p, V[col + i]!, i);
    }
    if (branch === 1 && hasNode) {
      push(pb, bubble.value[j]!, bRow);
      if (!Number.isNaN(bubble.value[j]!)) bubbleLast[j] = 1;
    }
  }
  off[M] = x.length;
  fullOff[M] = fullX.length;
  return {
    x: Float64Array.from(x),
    y: Float64Array.from(y),
    row: Int32Array.from(row),
    off,
    fullX: Float64Array.from(fullX),
    fullY: Float64Array.from(fullY),
    fullOff,
    bubbleFirst,
    bubbleLast,
  };
}
