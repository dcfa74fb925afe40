// Axis search and the zone rule. Indices in this file are in range by construction (loops are bounded by
// the lengths passed in), hence the non-null assertions on typed-array reads.

/**
 * Cell of `t` on the sorted nodes x[off .. off+n-1]: the largest k with x[k] <= t, clamped to 0..n-2
 * (so a point on the last node uses the last cell, and a point below the first node uses cell 0).
 * Returns a local index (0-based from `off`). With one node the cell is 0.
 */
export function cellOf(
  x: Float64Array,
  off: number,
  n: number,
  t: number,
): number {
  if (n < 2) return 0;
  let lo = 0;
  let hi = n - 2;
  if (t < x[off + 1]!) return 0;
  if (t >= x[off + n - 2]!) return n - 2;
  // Here x[1] <= t < x[n-2]: binary search for the largest k with x[k] <= t, keeping x[lo] <= t.
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (x[off + mid]! <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/**
 * Precomputed search on one fixed axis: a uniform lookup table over the axis range gives a cell index that
 * is at most a step away, then a small correction makes it exact. Built once per grid, used for every
 * point, so a search costs a multiply, a table read and one or two comparisons.
 */
export class AxisIndex {
  readonly nodes: Float64Array;
  readonly n: number;
  /** lut[b]: the cell at the start of bucket b; buckets of width 1/scale from `lo`, `last` = lut.length − 1. */
  readonly lut: Int32Array;
  readonly lo: number;
  readonly scale: number;
  readonly last: number;

  constructor(nodes: Float64Array) {
    this.nodes = nodes;
    this.n = nodes.length;
    this.lo = nodes[0]!;
    const n = this.n;
    if (n < 2) {
      this.lut = new Int32Array(1);
      this.scale = 0;
      this.last = 0;
      return;
    }
    const span = nodes[n - 1]! - nodes[0]!;
    let minGap = Infinity;
    for (let i = 1; i < n; i++)
      minGap = Math.min(minGap, nodes[i]! - nodes[i - 1]!);
    // Buckets no wider than half the smallest gap: each bucket holds at most one node, so the correction
    // below takes at most one step. Capped to keep the table small on very uneven axes.
    const buckets = Math.max(n, Math.min(4096, Math.ceil((2 * span) / minGap)));
    this.scale = buckets / span;
    this.last = buckets - 1;
    this.lut = new Int32Array(buckets);
    for (let b = 0; b < buckets; b++) {
      this.lut[b] = cellOf(nodes, 0, n, this.lo + b / this.scale);
    }
  }

  /** Same answer as `cellOf(nodes, 0, n, t)`. */
  cell(t: number): number {
    const n = this.n;
    if (n < 2) return 0;
    let b = Math.floor((t - this.lo) * this.scale);
    if (b < 0) b = 0;
    else if (b > this.last) b = this.last;
    let k = this.lut[b]!;
    const x = this.nodes;
    while (k > 0 && t < x[k]!) k--;
    while (k < n - 2 && t >= x[k + 1]!) k++;
    return k;
  }
}

/**
 * The zone rule of issue 3 for degree m on nodes x[off .. off+n-1] (requires m <= n-1) and the cell k of t:
 * odd m: s = k − (m−1)/2; even m: s = k − m/2 when t is closer to x[k] than to x[k+1] or exactly midway,
 * else k − m/2 + 1; then s is clamped to 0..n−1−m. The zone is x[s .. s+m]. Returns s (local index).
 */
export function zoneStart(
  x: Float64Array,
  off: number,
  n: number,
  t: number,
  m: number,
  k: number,
): number {
  let s: number;
  if (m % 2 === 1) s = k - (m - 1) / 2;
  else if (n < 2 || t - x[off + k]! <= x[off + k + 1]! - t) s = k - m / 2;
  else s = k - m / 2 + 1;
  const max = n - 1 - m;
  return s < 0 ? 0 : s > max ? max : s;
}

/**
 * Nodes of the zone for degree m, ordered for the Newton form with the error estimate in mind, written to
 * out[outOff ..] as local indices. Returns how many (q):
 *
 * - m+2 when the axis allows raising the degree: the m-zone (ascending), then the one extra node of the
 *   (m+1)-zone, which always contains the m-zone. The first m+1 Newton terms are the value; the last term
 *   is the change when the degree is raised by one.
 * - m+1 when m = n−1 (the zone is the whole axis): the (m−1)-zone, then the remaining node. All terms are
 *   the value; the last term is the change from degree m−1 to m (the last correction of Neville's scheme).
 * - 1 when there is a single node (m = 0).
 */
export function orderedZone(
  x: Float64Array,
  off: number,
  n: number,
  t: number,
  m: number,
  k: number,
  out: Int32Array,
  outOff: number,
): number {
  if (n === 1 || m === 0) {
    // m = 0 only happens on a single-node axis (the degree is at least 1 otherwise).
    out[outOff] = n === 1 ? 0 : zoneStart(x, off, n, t, 0, k);
    return 1;
  }
  if (m + 2 <= n) {
    const s = zoneStart(x, off, n, t, m, k);
    for (let i = 0; i <= m; i++) out[outOff + i] = s + i;
    const s2 = zoneStart(x, off, n, t, m + 1, k);
    out[outOff + m + 1] = s2 < s ? s2 : s2 + m + 1;
    return m + 2;
  }
  const s1 = zoneStart(x, off, n, t, m - 1, k);
  for (let i = 0; i < m; i++) out[outOff + i] = s1 + i;
  out[outOff + m] = s1 === 0 ? n - 1 : 0;
  return m + 1;
}
