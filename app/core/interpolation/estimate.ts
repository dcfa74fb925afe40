// The calibrated error estimate (README "Error estimate"): what the evaluators' raw correction terms become
// before they are reported. Per grid (built once, cached with the prepared grid): the value resolution the
// laboratory printed, a rounding floor per grid cell, and the cells next to a kink that no bubble point
// explains. Per point: safety factor × raw correction + floor, grown with the distance outside the table.
// Indices are in range by construction.
import type { PreparedGrid } from "./prepare";
import type { Method } from "./types";
import { W_ESTIMATE_UNAVAILABLE, W_ESTIMATE_UNRELIABLE } from "./warnings";

/**
 * The calibration (README "Error estimate"; `npm run calibrate:estimates` measures it). A safety factor
 * per method on the raw correction (|pressure part| + |temperature part|), and the share of a unit of the
 * printed resolution added as a floor (interpolating rounded data cannot be better than the rounding).
 * Chosen as the smallest round numbers with which, on the smooth reference tables, the actual error is
 * within the estimate at ≥ 90 % of off-node points and within 3× at ≥ 99 % for every method.
 */
export const ESTIMATE_CALIBRATION: Readonly<
  Record<Method, number> & { newtonEven: number; floor: number }
> = {
  linear: 2,
  /** Odd pressure degree (the zone is centred on the cell). */
  newton: 2,
  /** Even pressure degree: the zone leans to one side of the point, and so does its extra node. */
  newtonEven: 2.5,
  pchip: 12,
  floor: 0.5,
};

/** The safety factor of a method and pressure degree. */
export function estimateFactor(method: Method, degree: number): number {
  return method === "newton" && degree % 2 === 0
    ? ESTIMATE_CALIBRATION.newtonEven
    : ESTIMATE_CALIBRATION[method];
}

/** Decimal resolution is looked for down to this many significant digits; finer means "not rounded". */
const MAX_DIGITS = 10;

/**
 * The largest power of ten of which v is a whole multiple (to round-off), or 0 when v needs more than
 * MAX_DIGITS significant digits (not a printed laboratory value) or is 0 (says nothing).
 */
function quantum(v: number): number {
  if (!(v !== 0 && Number.isFinite(v))) return 0;
  const a = Math.abs(v);
  const top = Math.floor(Math.log10(a));
  // v is N × 10^k as printed when the decimal "N e k" reads back as exactly this number
  const whole = (k: number): boolean =>
    Number(`${Math.round(a / 10 ** k)}e${k}`) === a;
  let k = top - MAX_DIGITS + 1;
  while (k <= top && !whole(k)) k++;
  if (k > top) return 0;
  while (k < top && whole(k + 1)) k++;
  return 10 ** k;
}

/**
 * Resolution of each measured value (NaN → 0). A table is printed either to a fixed number of decimals
 * (Bo 1.2345, Rs 523) or to a fixed number of significant digits (µo 0.312, 1.45, 12.3). For each value,
 * its decimals d (−log10 of the largest power of ten it is a multiple of) and significant digits s; a
 * trailing zero the lab printed but the number lost makes both smaller than printed, so the table's
 * decimals are the largest d and its significant digits the largest s. The model is the one that more
 * values attain exactly (fixed decimals on a tie): resolution 10^−d for every value, or the unit in the
 * s-th significant digit of each value. When any value needs more than 10 significant digits (converted
 * units, computed values) nothing is inferred: every resolution is 0.
 */
export function valueResolution(V: Float64Array): Float64Array {
  const out = new Float64Array(V.length);
  const dec = new Int32Array(V.length);
  const sig = new Int32Array(V.length);
  const mag = new Int32Array(V.length);
  let dMax = -Infinity;
  let sMax = -Infinity;
  let n = 0;
  for (let i = 0; i < V.length; i++) {
    const v = V[i]!;
    if (Number.isNaN(v) || v === 0) continue;
    const q = quantum(v);
    if (q === 0) return out;
    mag[i] = Math.floor(Math.log10(Math.abs(v)));
    dec[i] = -Math.round(Math.log10(q));
    sig[i] = mag[i]! + dec[i]! + 1;
    dMax = Math.max(dMax, dec[i]!);
    sMax = Math.max(sMax, sig[i]!);
    n++;
  }
  if (n === 0) return out;
  let atD = 0;
  let atS = 0;
  for (let i = 0; i < V.length; i++) {
    const v = V[i]!;
    if (Number.isNaN(v) || v === 0) continue;
    if (dec[i] === dMax) atD++;
    if (sig[i] === sMax) atS++;
  }
  const bySignificant = atS > atD;
  const D = 10 ** -dMax;
  for (let i = 0; i < V.length; i++) {
    const v = V[i]!;
    if (Number.isNaN(v)) continue;
    out[i] = bySignificant && v !== 0 ? 10 ** (mag[i]! - sMax + 1) : D;
  }
  return out;
}

type EstimateInfo = {
  /** Number of pressure cells (max(1, N − 1)); cell index = kp + kt × cellsP. */
  cellsP: number;
  /** The largest resolution of a cell's measured corners (the floor is ESTIMATE_CALIBRATION.floor × it). */
  floor: Float64Array;
  /** W_ESTIMATE_UNRELIABLE for cells whose zone may reach a kink no bubble point explains; else 0. */
  flags: Uint16Array;
  /** Whether any cell has the kink flag (the fast kernels skip reading `flags` otherwise). */
  kinks: boolean;
  /** Per-node resolution (for explanations and tests). */
  resolution: Float64Array;
};

const infos = new WeakMap<PreparedGrid, EstimateInfo>();
let lastPrep: PreparedGrid | null = null;
let lastInfo: EstimateInfo | null = null;

/** The estimate tables of a prepared grid, built on first use (kept with the grid, like its plans). */
export function estimateInfo(prep: PreparedGrid): EstimateInfo {
  if (prep === lastPrep) return lastInfo!;
  let info = infos.get(prep);
  if (!info) {
    info = buildInfo(prep);
    infos.set(prep, info);
  }
  lastPrep = prep;
  lastInfo = info;
  return info;
}

function buildInfo(prep: PreparedGrid): EstimateInfo {
  const { N, M, V } = prep;
  const resolution = valueResolution(V);
  const cellsP = Math.max(1, N - 1);
  const cellsT = Math.max(1, M - 1);
  const floor = new Float64Array(cellsP * cellsT);
  for (let kt = 0; kt < cellsT; kt++) {
    for (let kp = 0; kp < cellsP; kp++) {
      let u = 0;
      for (let dj = 0; dj < 2; dj++) {
        const j = Math.min(M - 1, kt + dj);
        for (let di = 0; di < 2; di++) {
          const i = Math.min(N - 1, kp + di);
          u = Math.max(u, resolution[j * N + i]!);
        }
      }
      floor[kp + kt * cellsP] = u;
    }
  }
  const flags = new Uint16Array(cellsP * cellsT);
  if (prep.bubble === null) markKinks(prep, resolution, cellsP, cellsT, flags);
  return {
    cellsP,
    floor,
    flags,
    kinks: flags.some((f) => f !== 0),
    resolution,
  };
}

/** Zones reach at most this many nodes beyond a point's cell (cubic plus the error-check node, and more). */
const KINK_REACH = 3;

/**
 * A kink with no bubble point given. On each column (along pressure) and each row (along temperature),
 * over the measured values in order, with Δ the change over one step and u the value resolution:
 *  - a step is *decided* when |Δ| > 3u (above the rounding), and *flat* when |Δ| ≤ u;
 *  - the slope *turns* at a node when the decided steps on either side have opposite signs, or one side
 *    is flat and the other decided;
 *  - the turn is *steep* when, on at least one side, the slope does not taper towards the node: the step
 *    next to the node is at least 0.7 of the step beyond it (decided, same sign). At a smooth maximum or
 *    minimum the slope falls off linearly towards the turn, so that ratio is at most 1/2; at a kink the
 *    slope keeps its size up to the kink.
 * Cells within KINK_REACH nodes of a steep turn (along both axes) get `estimate-unreliable`.
 */
function markKinks(
  prep: PreparedGrid,
  res: Float64Array,
  cellsP: number,
  cellsT: number,
  flags: Uint16Array,
): void {
  const { N, M, V } = prep;
  const mark = (i: number, j: number): void => {
    for (let kt = j - KINK_REACH; kt <= j + KINK_REACH - 1; kt++) {
      if (kt < 0 || kt >= cellsT) continue;
      for (let kp = i - KINK_REACH; kp <= i + KINK_REACH - 1; kp++)
        if (kp >= 0 && kp < cellsP)
          flags[kp + kt * cellsP] = W_ESTIMATE_UNRELIABLE;
    }
  };
  const idx = new Int32Array(Math.max(N, M));
  // along pressure, column by column
  for (let j = 0; j < M; j++) {
    let n = 0;
    for (let i = 0; i < N; i++)
      if (!Number.isNaN(V[j * N + i]!)) idx[n++] = j * N + i;
    scanTurns(V, res, idx, n, (k) => mark(idx[k]! - j * N, j));
  }
  // along temperature, row by row
  if (M >= 4) {
    for (let i = 0; i < N; i++) {
      let n = 0;
      for (let j = 0; j < M; j++)
        if (!Number.isNaN(V[j * N + i]!)) idx[n++] = j * N + i;
      scanTurns(V, res, idx, n, (k) => mark(i, Math.floor(idx[k]! / N)));
    }
  }
}

function scanTurns(
  V: Float64Array,
  res: Float64Array,
  idx: Int32Array,
  n: number,
  onKink: (k: number) => void,
): void {
  // step s goes from node s to node s + 1
  const step = (s: number): number => V[idx[s + 1]!]! - V[idx[s]!]!;
  const unit = (s: number): number =>
    Math.max(res[idx[s]!]!, res[idx[s + 1]!]!);
  const decided = (s: number): boolean =>
    s >= 0 && s < n - 1 && Math.abs(step(s)) > 3 * unit(s);
  const flat = (s: number): boolean => Math.abs(step(s)) <= unit(s);
  const keeps = (near: number, far: number): boolean =>
    decided(near) &&
    decided(far) &&
    Math.sign(step(near)) === Math.sign(step(far)) &&
    Math.abs(step(near)) >= 0.7 * Math.abs(step(far));
  for (let k = 1; k < n - 1; k++) {
    const l = k - 1;
    const r = k;
    const dl = decided(l);
    const dr = decided(r);
    const turns =
      (dl && dr && Math.sign(step(l)) !== Math.sign(step(r))) ||
      (dl && flat(r)) ||
      (dr && flat(l));
    if (!turns) continue;
    if ((dl && keeps(l, l - 1)) || (dr && keeps(r, r + 1))) onKink(k);
  }
}

/**
 * Growth of the estimate outside the measured range: 1 + δ/h per axis (δ the distance beyond the range,
 * h the end cell's width on that side), multiplied over the axes. Newton's raw correction already grows
 * like the node polynomial ∏|t − x_i|; this factor makes every method's estimate grow at least in
 * proportion to the distance. An axis with a single node has no width: the caller reports NaN there.
 */
function extrapolationGrowth(prep: PreparedGrid, p: number, t: number): number {
  return axisGrowth(prep.P, prep.N, p) * axisGrowth(prep.T, prep.M, t);
}

function axisGrowth(x: Float64Array, n: number, v: number): number {
  if (n < 2) return 1;
  if (v < x[0]!) return 1 + (x[0]! - v) / (x[1]! - x[0]!);
  if (v > x[n - 1]!) return 1 + (v - x[n - 1]!) / (x[n - 1]! - x[n - 2]!);
  return 1;
}

/** True when a one-node axis is asked about another coordinate: the table says nothing that way. */
function silentAxis(prep: PreparedGrid, p: number, t: number): boolean {
  return (prep.N === 1 && p !== prep.P[0]) || (prep.M === 1 && t !== prep.T[0]);
}

/** Where `extrapolatedEstimate` leaves the warnings it adds (reused; no allocation per call). */
export const extrapolationOut = { flags: 0 };

/**
 * The estimate of an extrapolated point from its in-table form `err`: NaN with `estimate-unavailable`
 * when a one-node axis is asked about another coordinate, otherwise `err` × extrapolationGrowth with
 * `estimate-unreliable` (the calibration covers points inside the table only).
 */
export function extrapolatedEstimate(
  prep: PreparedGrid,
  err: number,
  p: number,
  t: number,
): number {
  if (silentAxis(prep, p, t)) {
    extrapolationOut.flags = W_ESTIMATE_UNAVAILABLE;
    return NaN;
  }
  extrapolationOut.flags = W_ESTIMATE_UNRELIABLE;
  return err * extrapolationGrowth(prep, p, t);
}
