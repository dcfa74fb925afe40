/**
 * Rule smooth-fit-outlier: a value that stands off a smooth curve through its neighbours on the same
 * branch. For each interior point, a quadratic is fitted by least squares to up to two neighbours on each
 * side (three or four points, the point itself left out) in a transformed coordinate (1/Bg, ln μ, or the
 * value), and its prediction at the point is compared with the value. A point is flagged when
 *   - it is off the prediction by more than the property's tolerance, and
 *   - it is a local spike: the curvature (second divided difference) at the point has the opposite sign to
 *     the curvature at each neighbouring point, in the direction of the departure.
 * The second condition keeps coarse but smooth, strongly curved data — such as the last step of a
 * differential liberation down to atmospheric pressure — from being flagged. The worst point is flagged
 * first and left out before looking again. */

interface FitPoint {
  readonly x: number;
  readonly y: number;
}

/** Least-squares quadratic through the points, evaluated at x0 (x scaled about x0); null if degenerate. */
export function quadraticAt(
  points: readonly FitPoint[],
  x0: number,
): number | null {
  if (points.length < 3) return null;
  const scale = Math.max(...points.map((p) => Math.abs(p.x - x0))) || 1;
  // Normal equations for a + b u + c u², u = (x − x0)/scale; the prediction is a.
  const s = [0, 0, 0, 0, 0];
  const r = [0, 0, 0];
  for (const p of points) {
    const u = (p.x - x0) / scale;
    let uk = 1;
    for (let k = 0; k < 5; k++) {
      s[k] = (s[k] ?? 0) + uk;
      if (k < 3) r[k] = (r[k] ?? 0) + uk * p.y;
      uk *= u;
    }
  }
  const m = [
    [s[0] ?? 0, s[1] ?? 0, s[2] ?? 0, r[0] ?? 0],
    [s[1] ?? 0, s[2] ?? 0, s[3] ?? 0, r[1] ?? 0],
    [s[2] ?? 0, s[3] ?? 0, s[4] ?? 0, r[2] ?? 0],
  ];
  // Gaussian elimination with partial pivoting.
  for (let col = 0; col < 3; col++) {
    let pivot = col;
    for (let row = col + 1; row < 3; row++) {
      if (Math.abs(m[row]?.[col] ?? 0) > Math.abs(m[pivot]?.[col] ?? 0))
        pivot = row;
    }
    const pr = m[pivot];
    const cr = m[col];
    if (!pr || !cr || Math.abs(pr[col] ?? 0) < 1e-12) return null;
    m[pivot] = cr;
    m[col] = pr;
    for (let row = 0; row < 3; row++) {
      if (row === col) continue;
      const target = m[row];
      if (!target) continue;
      const f = (target[col] ?? 0) / (pr[col] ?? 1);
      for (let k = col; k < 4; k++)
        target[k] = (target[k] ?? 0) - f * (pr[k] ?? 0);
    }
  }
  const a = (m[0]?.[3] ?? 0) / (m[0]?.[0] ?? 1);
  return Number.isFinite(a) ? a : null;
}

export interface Transform {
  readonly forward: (v: number) => number;
  readonly inverse: (y: number) => number;
}

export const IDENTITY: Transform = { forward: (v) => v, inverse: (y) => y };
export const LOG: Transform = {
  forward: (v) => Math.log(v),
  inverse: (y) => Math.exp(y),
};
export const RECIPROCAL: Transform = {
  forward: (v) => 1 / v,
  inverse: (y) => 1 / y,
};

/** At most this many points are flagged per series; the rest would only repeat the message. */
const MAX_FLAGS = 10;

interface Outlier {
  readonly index: number;
  /** The smooth value expected at the point, in value units. */
  readonly expected: number;
  /** (value − expected) / expected */
  readonly deviation: number;
}

/** Neighbours of index i among the kept indices: up to two each side, topped up to four from the longer side. */
function neighbours(kept: readonly number[], position: number): number[] {
  const left = kept.slice(Math.max(0, position - 3), position);
  const right = kept.slice(position + 1, position + 4);
  let l = left.slice(-2);
  let r = right.slice(0, 2);
  while (
    l.length + r.length < 4 &&
    (left.length > l.length || right.length > r.length)
  ) {
    if (right.length > r.length) r = right.slice(0, r.length + 1);
    else l = left.slice(-(l.length + 1));
  }
  return [...l, ...r];
}

/** Second divided difference of y at kept position pos (needs a neighbour each side). */
function curvature(
  kept: readonly number[],
  pos: number,
  xs: readonly number[],
  ys: readonly number[],
): number | null {
  const a = kept[pos - 1];
  const b = kept[pos];
  const c = kept[pos + 1];
  if (a === undefined || b === undefined || c === undefined) return null;
  const [xa, xb, xc] = [xs[a] ?? 0, xs[b] ?? 0, xs[c] ?? 0];
  const [ya, yb, yc] = [ys[a] ?? 0, ys[b] ?? 0, ys[c] ?? 0];
  const left = (yb - ya) / (xb - xa || 1);
  const right = (yc - yb) / (xc - xb || 1);
  return (right - left) / (xc - xa || 1);
}

/**
 * A spike of sign s (+1 above the curve, −1 below): curvature at the point of sign −s, and at every
 * neighbouring point that has a curvature, of sign s.
 */
function isSpike(
  kept: readonly number[],
  pos: number,
  xs: readonly number[],
  ys: readonly number[],
  s: number,
): boolean {
  if (s === 0) return false;
  const here = curvature(kept, pos, xs, ys);
  if (here === null || Math.sign(here) !== -s) return false;
  const around = [
    curvature(kept, pos - 1, xs, ys),
    curvature(kept, pos + 1, xs, ys),
  ].filter((c): c is number => c !== null);
  return around.length > 0 && around.every((c) => Math.sign(c) === s);
}

/**
 * Flag outliers in a series sorted by x (values must be valid for the transform: > 0 for LOG/RECIPROCAL).
 * `tolerance(value)` is the largest acceptable |value − expected| in value units.
 */
export function findOutliers(
  xs: readonly number[],
  values: readonly number[],
  transform: Transform,
  tolerance: (expected: number) => number,
): Outlier[] {
  const n = xs.length;
  if (n < 4) return [];
  const ys = values.map(transform.forward);
  if (!ys.every(Number.isFinite)) return [];
  let kept = xs.map((_, i) => i);
  const flagged: Outlier[] = [];
  const maxFlags = Math.min(MAX_FLAGS, Math.floor(n / 3));
  while (flagged.length < maxFlags && kept.length >= 4) {
    let worst: (Outlier & { score: number; position: number }) | null = null;
    for (let pos = 1; pos < kept.length - 1; pos++) {
      const i = kept[pos] ?? 0;
      const around = neighbours(kept, pos);
      if (around.length < 3) continue;
      const x0 = xs[i] ?? 0;
      const fit = quadraticAt(
        around.map((k) => ({ x: xs[k] ?? 0, y: ys[k] ?? 0 })),
        x0,
      );
      if (fit === null) continue;
      const expected = transform.inverse(fit);
      const value = values[i] ?? 0;
      const off = Math.abs(value - expected);
      const allowed = tolerance(expected);
      if (!(off > allowed)) continue;
      if (
        !isSpike(kept, pos, xs, ys, Math.sign(transform.forward(value) - fit))
      )
        continue;
      const score = off / allowed;
      if (!worst || score > worst.score) {
        worst = {
          index: i,
          expected,
          deviation:
            expected !== 0 ? (value - expected) / Math.abs(expected) : 0,
          score,
          position: pos,
        };
      }
    }
    if (!worst) break;
    flagged.push({
      index: worst.index,
      expected: worst.expected,
      deviation: worst.deviation,
    });
    const drop = worst.position;
    kept = kept.filter((_, pos) => pos !== drop);
  }
  return flagged;
}
