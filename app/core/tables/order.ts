/**
 * Putting a column in the order simulators need, changing as little as possible: the least-squares fit
 * whose every step rises by at least a minimum slope times the pressure step,
 *
 *   minimise Σ (fᵢ − yᵢ)²  subject to  fᵢ₊₁ − fᵢ ≥ s·(xᵢ₊₁ − xᵢ),
 *
 * solved exactly as an isotonic regression of zᵢ = yᵢ − s·xᵢ by pool-adjacent-violators (each run that
 * breaks the order is replaced by its mean, then the slope s is added back). s is 10⁻³ of the column's
 * overall trend (never less than 10⁻⁹ of its values over the whole range, so rounding cannot hide it):
 * enough to make the order strict, far below any slope real data show, so values already in order are
 * left exactly as they were. An anchored end (the bubble-point row) keeps its value and the others are
 * clipped to it, which is the least-squares answer with that end fixed.
 *
 * Decreasing columns are handled as increasing ones with the signs turned. Pure numerics: plain arrays in,
 * changed in place.
 */

export type OrderOptions = {
  /** Index (0 or length − 1) whose value is kept; null for none. */
  anchor: number | null;
  /** Exclusive bounds the values must stay within (e.g. 0 for a positive property). */
  lower?: number;
  upper?: number;
};

/** Minimum slope of a corrected run, as a fraction of the column's overall trend. */
export const MIN_SLOPE_FRACTION = 1e-3;

type Fit = { fit: number[]; pooled: boolean[] };

/** Pool-adjacent-violators: the least-squares non-decreasing fit of y, unweighted, and which values were pooled. */
function pava(y: readonly number[]): Fit {
  const sums: number[] = [];
  const counts: number[] = [];
  for (let i = 0; i < y.length; i++) {
    sums.push(y[i]!);
    counts.push(1);
    while (sums.length > 1) {
      const k = sums.length - 1;
      if (sums[k - 1]! / counts[k - 1]! <= sums[k]! / counts[k]!) break;
      sums[k - 1]! += sums[k]!;
      counts[k - 1]! += counts[k]!;
      sums.pop();
      counts.pop();
    }
  }
  const fit: number[] = [];
  const pooled: boolean[] = [];
  for (let b = 0; b < sums.length; b++) {
    const v = sums[b]! / counts[b]!;
    for (let c = 0; c < counts[b]!; c++) {
      fit.push(v);
      pooled.push(counts[b]! > 1);
    }
  }
  return { fit, pooled };
}

/** The least-squares non-decreasing fit of y (pool adjacent violators). */
export function isotonicIncreasing(y: readonly number[]): number[] {
  return pava(y).fit;
}

/** Least-squares fit with steps ≥ s·Δx and the anchor kept; values not pooled or clipped come back unchanged. */
function solve(
  x: readonly number[],
  y: readonly number[],
  anchor: number | null,
  s: number,
): number[] {
  const n = y.length;
  const z = y.map((v, i) => v - s * x[i]!);
  const out = y.slice();
  if (anchor === n - 1 || anchor === 0) {
    const za = z[anchor]!;
    const from = anchor === 0 ? 1 : 0;
    const { fit, pooled } = pava(z.slice(from, from + n - 1));
    for (let k = 0; k < n - 1; k++) {
      const i = k + from;
      const clipped = anchor === 0 ? fit[k]! < za : fit[k]! > za;
      if (clipped) out[i] = za + s * x[i]!;
      else if (pooled[k]) out[i] = fit[k]! + s * x[i]!;
    }
  } else {
    const { fit, pooled } = pava(z);
    for (let i = 0; i < n; i++) if (pooled[i]) out[i] = fit[i]! + s * x[i]!;
  }
  return out;
}

/** Makes y strictly increasing in x, in place (see the file comment). x strictly increasing. */
export function enforceIncreasing(
  x: readonly number[],
  y: number[],
  options: OrderOptions,
): void {
  const n = y.length;
  if (n < 2) return;
  const lower = options.lower ?? -Infinity;
  const upper = options.upper ?? Infinity;
  const span = x[n - 1]! - x[0]!;
  const plain = solve(x, y, options.anchor, 0);
  const trend = (plain[n - 1]! - plain[0]!) / span;
  const floor =
    (1e-9 * Math.max(Math.abs(plain[0]!), Math.abs(plain[n - 1]!), 1e-300)) /
    span;
  let s = Math.max(MIN_SLOPE_FRACTION * trend, floor);
  let out = solve(x, y, options.anchor, s);
  // a bound crossed (only conceivable for values right at a bound): a smaller slope, then none
  for (
    let attempt = 0;
    attempt < 12 && out.some((v) => !(v > lower && v < upper));
    attempt++
  ) {
    s = attempt < 11 ? s / 10 : 0;
    out = solve(x, y, options.anchor, s);
  }
  for (let i = 0; i < n; i++) y[i] = out[i]!;
}

/** Makes y strictly decreasing in x, in place; bounds as in OrderOptions. */
export function enforceDecreasing(
  x: readonly number[],
  y: number[],
  options: OrderOptions,
): void {
  for (let i = 0; i < y.length; i++) y[i] = -y[i]!;
  enforceIncreasing(x, y, {
    anchor: options.anchor,
    lower: options.upper === undefined ? undefined : -options.upper,
    upper: options.lower === undefined ? undefined : -options.lower,
  });
  for (let i = 0; i < y.length; i++) y[i] = -y[i]!;
}

/**
 * Replaces values ≤ 0 by interpolating linearly in x between the nearest positive values (or copying the
 * nearest one at an end). Returns false when no value is positive (nothing can be done).
 */
export function makePositive(x: readonly number[], y: number[]): boolean {
  const good: number[] = [];
  for (let i = 0; i < y.length; i++) if (y[i]! > 0) good.push(i);
  if (good.length === 0) return y.length === 0;
  if (good.length === y.length) return true;
  // g: index in `good` of the first positive value after i
  let g = 0;
  for (let i = 0; i < y.length; i++) {
    while (g < good.length && good[g]! < i) g++;
    if (y[i]! > 0) continue;
    const left = g > 0 ? good[g - 1]! : -1;
    const right = g < good.length ? good[g]! : -1;
    if (left >= 0 && right >= 0) {
      const w = (x[i]! - x[left]!) / (x[right]! - x[left]!);
      y[i] = y[left]! + w * (y[right]! - y[left]!);
    } else y[i] = y[left >= 0 ? left : right]!;
  }
  return true;
}
