// Per grid and method: the tables the fast kernels read, scratch space for the general evaluator, and
// one-point buffers, all allocated once and reused for every point. Indices are in range by construction.
import { orderedZone } from "./axis";
import { dividedDifferences } from "./newton";
import { pchipEndDerivative, pchipInteriorDerivative } from "./pchip";
import type { PreparedGrid } from "./prepare";
import type { BatchResult, Method } from "./types";
import { MAX_DEGREE } from "./validate";
import {
  W_BUBBLE_POINT_UNKNOWN,
  W_DEGREE_REDUCED,
  W_OVERSHOOT,
} from "./warnings";

/**
 * The zone of every cell of one axis, for a fixed degree. A cell k has two variants, v = 2k + h, where
 * h = 1 when the point is closer to node k+1 than to node k (the even-degree tie-break of the zone rule).
 * order[v*q + i] lists the q nodes in Newton order (see `orderedZone`); the first `valueTerms` of them are
 * the zone, and `start[v]` is its smallest node index.
 */
type AxisVariants = {
  n: number;
  degree: number;
  q: number;
  valueTerms: number;
  order: Int32Array;
  x: Float64Array;
  start: Int32Array;
  /** Zone nodes of each variant in ascending order, for monotonicity checks: asc[v*valueTerms + i]. */
  asc: Int32Array;
};

function buildVariants(nodes: Float64Array, degree: number): AxisVariants {
  const n = nodes.length;
  const m = Math.min(degree, n - 1);
  const cells = Math.max(1, n - 1);
  const tmp = new Int32Array(MAX_DEGREE + 2);
  const q = orderedZone(nodes, 0, n, nodes[0]!, m, 0, tmp, 0);
  const valueTerms = m + 1;
  const order = new Int32Array(2 * cells * q);
  const x = new Float64Array(2 * cells * q);
  const start = new Int32Array(2 * cells);
  const asc = new Int32Array(2 * cells * valueTerms);
  for (let k = 0; k < cells; k++) {
    for (let h = 0; h < 2; h++) {
      const v = 2 * k + h;
      // a representative point of the half-cell: node k (closer to k) or node k+1 (closer to k+1)
      const t = n < 2 ? nodes[0]! : nodes[k + h]!;
      orderedZone(nodes, 0, n, t, m, k, order, v * q);
      let lo = Infinity;
      for (let i = 0; i < q; i++) {
        const idx = order[v * q + i]!;
        x[v * q + i] = nodes[idx]!;
        if (i < valueTerms) lo = Math.min(lo, idx);
      }
      start[v] = lo;
      // the zone is contiguous: lo .. lo + m
      for (let i = 0; i < valueTerms; i++) asc[v * valueTerms + i] = lo + i;
    }
  }
  return { n, degree: m, q, valueTerms, order, x, start, asc };
}

/** Complete grid, no bubble points: Newton coefficients of every column on every pressure zone. */
type NewtonTables = {
  p: AxisVariants;
  t: AxisVariants;
  /** coef[(vp*M + j)*q + i]: Newton coefficients of column j on pressure variant vp. */
  coef: Float64Array;
  /**
   * Range of each zone's values widened by a rounding tolerance, for the overshoot check; −∞/+∞ when the
   * zone's values do not rise or fall steadily (no overshoot is possible then).
   */
  zoneLo: Float64Array;
  zoneHi: Float64Array;
  /** invT[(vt*q + l)*q + i] = 1 / (x_i − x_{i−l}) on the ordered temperature nodes of variant vt. */
  invT: Float64Array;
  /**
   * For cubic pressure zones only (else empty): 1 at [vp * (number of temperature variants) + vt] when no
   * column of that temperature zone can overshoot anywhere on pressure variant vp's half-cell, so the
   * step-one check can be skipped. Worked out from each cubic's extremes on the half-cell, with margin.
   */
  zoneSafe: Uint8Array;
  /**
   * Degree-[3,3] zones with an extra node on both axes only (else empty): at ((vp * VT + vt) * 4 + i), the
   * Newton coefficients along temperature of the four zone columns' last pressure coefficients, so that
   * the pressure part of the error estimate is one short Newton sum per point.
   */
  topT: Float64Array;
  wp: Float64Array;
  wt: Float64Array;
  r: Float64Array;
  e: Float64Array;
  d: Float64Array;
};

/** Complete grid, no bubble points: pchip and three-point derivatives of every column along pressure. */
type PchipTables = {
  d: Float64Array;
  b: Float64Array;
  /**
   * Per column j and pressure cell k (N ≥ 3), at ((j*(N−1) + k) * 7): the cell's cubic in powers of
   * (p − P[k]) — y0, d0, c1, c0 — and the cubic of the difference from the three-point-slope cubic
   * — g1, g2, g3 (no constant term).
   */
  cells: Float64Array;
  /** Temperature spacings, their reciprocals, and 1/(h[k−1] + h[k]) at node k. */
  hT: Float64Array;
  invHT: Float64Array;
  invSumT: Float64Array;
  r: Float64Array;
  e: Float64Array;
};

/** Scratch for the general evaluator (missing cells, bubble points), sized for the grid. */
type Scratch = {
  usable: Int32Array;
  ux: Float64Array;
  status: Uint8Array;
  tOrd: Int32Array;
  tx: Float64Array;
  r: Float64Array;
  e: Float64Array;
  d: Float64Array;
  xs: Float64Array;
  cs: Float64Array;
  pOrd: Int32Array;
  /** For the last point: the columns whose values make up the result and their zone in the branch list. */
  nCols: number;
  cols: Int32Array;
  colOff: Int32Array;
  vFrom: Int32Array;
  vTo: Int32Array;
  branch: number;
  pbStar: number;
  idealX: Float64Array;
  idealCol: Int32Array;
};

/**
 * A fast evaluator of points [from, to) into `out` from index outOffset (see kernels.ts). `reach` as in
 * range.ts `checkRange`; `batch`: the typed batch path, where a point that cannot be served is refused
 * (see `refusePoint`) instead of throwing.
 */
export type Kernel = (
  plan: Plan,
  ps: Float64Array,
  ts: Float64Array,
  from: number,
  to: number,
  reach: number,
  out: BatchResult,
  outOffset: number,
  batch: boolean,
) => void;

export type Plan = {
  readonly prep: PreparedGrid;
  readonly method: Method;
  /** Requested degrees (1 for linear, unused for pchip). */
  readonly m: number;
  readonly n: number;
  readonly newton: NewtonTables | null;
  readonly pchip: PchipTables | null;
  readonly scratch: Scratch;
  /** Warnings every point gets (the degree had to be lowered for the whole table, ...). */
  readonly constFlags: number;
  readonly single: BatchResult;
  readonly singleP: Float64Array;
  readonly singleT: Float64Array;
  /** pchip plan on the same grid, for the value given alongside an overshoot. */
  pchipPlan: Plan | null;
  /** The fast kernel, or null for the general evaluator; chosen on first use. */
  kernel: Kernel | null | undefined;
};

export const STRIDE = MAX_DEGREE + 2;

/**
 * Evaluation plans of each prepared grid by method and degree, built on first use. Kept here rather than on
 * the prepared grid so that prepare.ts need not know about plans; the WeakMap lets a plan go with its grid.
 */
const plansByGrid = new WeakMap<PreparedGrid, (Plan | undefined)[]>();
/** The last grid's plans, so that point after point on one grid skips the WeakMap lookup. */
let lastPrep: PreparedGrid | null = null;
let lastPlans: (Plan | undefined)[] = [];

function plansOf(prep: PreparedGrid): (Plan | undefined)[] {
  if (prep === lastPrep) return lastPlans;
  let plans = plansByGrid.get(prep);
  if (plans === undefined) {
    plans = [];
    plansByGrid.set(prep, plans);
  }
  lastPrep = prep;
  lastPlans = plans;
  return plans;
}

export function getPlan(
  prep: PreparedGrid,
  method: Method,
  m: number,
  n: number,
): Plan {
  // degrees are 1..MAX_DEGREE (validated), so this is a small dense index
  const key =
    method === "pchip" ? 0 : method === "linear" ? 1 : 2 + m * STRIDE + n;
  const plans = plansOf(prep);
  let plan = plans[key];
  if (plan === undefined) {
    plan = buildPlan(prep, method, m, n);
    plans[key] = plan;
  }
  return plan;
}

/** The alternatives array of a batch, created on the first overshoot (see `finishAlternatives`). */
export function alternativesOf(out: BatchResult): Float64Array {
  return (out.alternatives ??= new Float64Array(out.count));
}

/** After a range was evaluated: points without an overshoot get their own value as the alternative. */
export function finishAlternatives(
  out: BatchResult,
  from: number,
  to: number,
): void {
  const alt = out.alternatives;
  if (!alt) return;
  for (let k = from; k < to; k++)
    if ((out.warnings[k]! & W_OVERSHOOT) === 0) alt[k] = out.values[k]!;
}

/**
 * Marks entry o of a batch as refused with `code` (range.ts REFUSAL_CODES, 1-based); the refusals array
 * is created on the first refusal, so a batch where every point is served never allocates it.
 */
export function refusePoint(out: BatchResult, o: number, code: number): void {
  (out.refusals ??= new Uint8Array(out.count))[o] = code;
  out.values[o] = NaN;
  out.errorEstimates[o] = NaN;
  out.warnings[o] = 0;
  out.pressureStart[o] = 0;
  out.pressureCount[o] = 0;
  out.temperatureStart[o] = 0;
  out.temperatureCount[o] = 0;
  if (out.branches && code !== 2) out.branches[o] = 0;
}

export function allocateBatch(
  count: number,
  withBranches: boolean,
): BatchResult {
  return {
    count,
    values: new Float64Array(count),
    errorEstimates: new Float64Array(count),
    warnings: new Uint16Array(count),
    alternatives: null,
    pressureStart: new Int32Array(count),
    pressureCount: new Uint8Array(count),
    temperatureStart: new Int32Array(count),
    temperatureCount: new Uint8Array(count),
    branches: withBranches ? new Uint8Array(count) : null,
    refusals: null,
  };
}

function buildPlan(
  prep: PreparedGrid,
  method: Method,
  m: number,
  n: number,
): Plan {
  const { N, M } = prep;
  const fastEligible = prep.complete && prep.bubble === null;
  let constFlags = prep.bubbleUnknown ? W_BUBBLE_POINT_UNKNOWN : 0;
  let newton: NewtonTables | null = null;
  let pchip: PchipTables | null = null;
  if (fastEligible && method !== "pchip") {
    newton = buildNewtonTables(prep, m, n);
    if ((m > N - 1 && N > 1) || (n > M - 1 && M > 1))
      constFlags |= W_DEGREE_REDUCED;
  } else if (fastEligible) {
    pchip = buildPchipTables(prep);
  }
  const K = M + 2;
  const L = Math.max(N, M) + 2;
  const scratch: Scratch = {
    usable: new Int32Array(M),
    ux: new Float64Array(M),
    status: new Uint8Array(M),
    tOrd: new Int32Array(K),
    tx: new Float64Array(K),
    r: new Float64Array(K),
    e: new Float64Array(K),
    d: new Float64Array(K),
    xs: new Float64Array(L),
    cs: new Float64Array(L),
    pOrd: new Int32Array(K * STRIDE),
    nCols: 0,
    cols: new Int32Array(K),
    colOff: new Int32Array(K),
    vFrom: new Int32Array(K),
    vTo: new Int32Array(K),
    branch: 0,
    pbStar: NaN,
    idealX: new Float64Array(M),
    idealCol: new Int32Array(M),
  };
  return {
    prep,
    method,
    m,
    n,
    newton,
    pchip,
    scratch,
    constFlags,
    single: allocateBatch(1, prep.bubble !== null),
    singleP: new Float64Array(1),
    singleT: new Float64Array(1),
    pchipPlan: null,
    kernel: undefined,
  };
}

function buildNewtonTables(
  prep: PreparedGrid,
  m: number,
  n: number,
): NewtonTables {
  const { N, M, P, T, V } = prep;
  const p = buildVariants(P, m);
  const t = buildVariants(T, n);
  const vpCount = p.order.length / p.q;
  const coef = new Float64Array(vpCount * M * p.q);
  const zoneLo = new Float64Array(vpCount * M);
  const zoneHi = new Float64Array(vpCount * M);
  for (let vp = 0; vp < vpCount; vp++) {
    for (let j = 0; j < M; j++) {
      const cb = (vp * M + j) * p.q;
      for (let i = 0; i < p.q; i++)
        coef[cb + i] = V[j * N + p.order[vp * p.q + i]!]!;
      dividedDifferences(p.x, vp * p.q, coef, cb, p.q);
      let lo = Infinity;
      let hi = -Infinity;
      let up = true;
      let down = true;
      for (let i = 0; i < p.valueTerms; i++) {
        const y = V[j * N + p.asc[vp * p.valueTerms + i]!]!;
        lo = Math.min(lo, y);
        hi = Math.max(hi, y);
        if (i > 0) {
          const prev = V[j * N + p.asc[vp * p.valueTerms + i - 1]!]!;
          if (y < prev) up = false;
          if (y > prev) down = false;
        }
      }
      const tol = overshootTolerance(lo, hi);
      zoneLo[vp * M + j] = up || down ? lo - tol : -Infinity;
      zoneHi[vp * M + j] = up || down ? hi + tol : Infinity;
    }
  }
  const vtCount = t.order.length / t.q;
  const invT = new Float64Array(vtCount * t.q * t.q);
  for (let vt = 0; vt < vtCount; vt++) {
    const xo = vt * t.q;
    for (let l = 1; l < t.q; l++) {
      for (let i = l; i < t.q; i++)
        invT[(vt * t.q + l) * t.q + i] = 1 / (t.x[xo + i]! - t.x[xo + i - l]!);
    }
  }
  const zoneSafe =
    p.valueTerms === 4 && N >= 2
      ? buildZoneSafe(P, p, t, coef, zoneLo, zoneHi, M)
      : new Uint8Array(0);
  let topT = new Float64Array(0);
  if (p.q === 5 && p.valueTerms === 4 && t.q === 5 && t.valueTerms === 4) {
    const vtCount = t.order.length / 5;
    topT = new Float64Array(vpCount * vtCount * 4);
    for (let vp = 0; vp < vpCount; vp++) {
      for (let vt = 0; vt < vtCount; vt++) {
        const o = (vp * vtCount + vt) * 4;
        for (let c = 0; c < 4; c++)
          topT[o + c] = coef[(vp * M + t.order[vt * 5 + c]!) * 5 + 4]!;
        dividedDifferences(t.x, vt * 5, topT, o, 4);
      }
    }
  }
  return {
    p,
    t,
    coef,
    zoneSafe,
    topT,
    zoneLo,
    zoneHi,
    invT,
    wp: new Float64Array(p.q),
    wt: new Float64Array(t.q),
    r: new Float64Array(t.q),
    e: new Float64Array(t.q),
    d: new Float64Array(t.q),
  };
}

/** See NewtonTables.zoneSafe. */
function buildZoneSafe(
  P: Float64Array,
  p: AxisVariants,
  t: AxisVariants,
  coef: Float64Array,
  zoneLo: Float64Array,
  zoneHi: Float64Array,
  M: number,
): Uint8Array {
  const vpCount = p.order.length / p.q;
  const vtCount = t.order.length / t.q;
  const colSafe = new Uint8Array(vpCount * M);
  for (let vp = 0; vp < vpCount; vp++) {
    const k = vp >> 1;
    const mid = (P[k]! + P[k + 1]!) / 2;
    const a = vp & 1 ? mid : P[k]!;
    const b = vp & 1 ? P[k + 1]! : mid;
    const x0 = p.x[vp * p.q]!;
    const x1 = p.x[vp * p.q + 1]!;
    const x2 = p.x[vp * p.q + 2]!;
    for (let j = 0; j < M; j++) {
      const zi = vp * M + j;
      const lo = zoneLo[zi]!;
      const hi = zoneHi[zi]!;
      if (lo === -Infinity) {
        colSafe[zi] = 1; // not monotone: never checked
        continue;
      }
      const cb = zi * p.q;
      const c0 = coef[cb]!;
      const c1 = coef[cb + 1]!;
      const c2 = coef[cb + 2]!;
      const c3 = coef[cb + 3]!;
      const q = (x: number): number =>
        c0 +
        c1 * (x - x0) +
        c2 * (x - x0) * (x - x1) +
        c3 * (x - x0) * (x - x1) * (x - x2);
      // q in powers of u = x − x0: A u³ + B u² + C u + c0; extremes at the ends and where q' = 0
      const d1 = x1 - x0;
      const d2 = x2 - x0;
      const A = c3;
      const B = c2 - c3 * (d1 + d2);
      const C = c1 - c2 * d1 + c3 * d1 * d2;
      const candidates = [a, b];
      const disc = 4 * B * B - 12 * A * C;
      if (A !== 0 && disc >= 0) {
        const r = Math.sqrt(disc);
        candidates.push(
          x0 + (-2 * B + r) / (6 * A),
          x0 + (-2 * B - r) / (6 * A),
        );
      } else if (A === 0 && B !== 0) candidates.push(x0 - C / (2 * B));
      let min = Infinity;
      let max = -Infinity;
      for (const x of candidates) {
        if (!(x >= a && x <= b)) continue;
        const y = q(x);
        min = Math.min(min, y);
        max = Math.max(max, y);
      }
      // half the tolerance is kept back for the rounding of the evaluation itself
      const slack =
        (hi - lo) * 1e-10 +
        64 * Number.EPSILON * Math.max(Math.abs(lo), Math.abs(hi));
      colSafe[zi] = min >= lo + slack && max <= hi - slack ? 1 : 0;
    }
  }
  const zoneSafe = new Uint8Array(vpCount * vtCount);
  for (let vp = 0; vp < vpCount; vp++) {
    for (let vt = 0; vt < vtCount; vt++) {
      let safe = 1;
      for (let c = 0; c < t.valueTerms; c++)
        safe &= colSafe[vp * M + t.order[vt * t.q + c]!]!;
      zoneSafe[vp * vtCount + vt] = safe;
    }
  }
  return zoneSafe;
}

/**
 * How far a value may sit outside the range of monotone data before it counts as an overshoot: far below
 * any overshoot that matters, far above the rounding of evaluating a polynomial at its own nodes.
 */
export function overshootTolerance(lo: number, hi: number): number {
  return (
    1e-9 * (hi - lo) +
    64 * Number.EPSILON * Math.max(Math.abs(lo), Math.abs(hi))
  );
}

function buildPchipTables(prep: PreparedGrid): PchipTables {
  const { N, M, P, V } = prep;
  const d = new Float64Array(N * M);
  const b = new Float64Array(N * M);
  if (N >= 3) {
    for (let j = 0; j < M; j++) {
      const o = j * N;
      for (let i = 0; i < N; i++) {
        if (i === 0 || i === N - 1) {
          const a = i === 0 ? 0 : N - 1;
          const s = i === 0 ? 1 : -1;
          const h0 = Math.abs(P[a + s]! - P[a]!);
          const h1 = Math.abs(P[a + 2 * s]! - P[a + s]!);
          const m0 = (V[o + a + s]! - V[o + a]!) / (P[a + s]! - P[a]!);
          const m1 =
            (V[o + a + 2 * s]! - V[o + a + s]!) / (P[a + 2 * s]! - P[a + s]!);
          d[o + i] = pchipEndDerivative(h0, h1, m0, m1);
          b[o + i] = ((2 * h0 + h1) * m0 - h0 * m1) / (h0 + h1);
        } else {
          const hl = P[i]! - P[i - 1]!;
          const hr = P[i + 1]! - P[i]!;
          const ml = (V[o + i]! - V[o + i - 1]!) / hl;
          const mr = (V[o + i + 1]! - V[o + i]!) / hr;
          d[o + i] = pchipInteriorDerivative(hl, hr, ml, mr);
          b[o + i] = (hr * ml + hl * mr) / (hl + hr);
        }
      }
    }
  }
  const cells = new Float64Array(N >= 3 ? M * (N - 1) * 7 : 0);
  if (N >= 3) {
    for (let j = 0; j < M; j++) {
      for (let k = 0; k < N - 1; k++) {
        const o = j * N + k;
        const h = P[k + 1]! - P[k]!;
        const y0 = V[o]!;
        const slope = (V[o + 1]! - y0) / h;
        const d0 = d[o]!;
        const d1 = d[o + 1]!;
        const e0 = d0 - b[o]!;
        const e1 = d1 - b[o + 1]!;
        const c = (j * (N - 1) + k) * 7;
        cells[c] = y0;
        cells[c + 1] = d0;
        cells[c + 2] = (3 * slope - 2 * d0 - d1) / h;
        cells[c + 3] = (d0 + d1 - 2 * slope) / (h * h);
        cells[c + 4] = e0;
        cells[c + 5] = (-2 * e0 - e1) / h;
        cells[c + 6] = (e0 + e1) / (h * h);
      }
    }
  }
  const T = prep.T;
  const hT = new Float64Array(Math.max(1, M - 1));
  const invHT = new Float64Array(Math.max(1, M - 1));
  const invSumT = new Float64Array(M);
  for (let k = 0; k + 1 < M; k++) {
    hT[k] = T[k + 1]! - T[k]!;
    invHT[k] = 1 / hT[k]!;
  }
  for (let k = 1; k + 1 < M; k++) invSumT[k] = 1 / (hT[k - 1]! + hT[k]!);
  return {
    d,
    b,
    cells,
    hT,
    invHT,
    invSumT,
    r: new Float64Array(M),
    e: new Float64Array(M),
  };
}
