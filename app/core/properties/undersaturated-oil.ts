/**
 * Undersaturated oil FVF from compressibility (p ≥ pb):
 *
 *   co = −(1/V)(∂V/∂p)_T
 *   constant (or averaged) co:   Bo(p) = Bob · exp[ −co (p − pb) ]
 *   pressure-dependent co(p):    Bo(p) = Bob · exp[ −∫_pb^p co dp ]   (integrated numerically; the V–B form
 *                                co = A/p gives Bob (pb/p)^A in closed form)
 *   from CCE relative volume:    Bo(p) = Bob · (V/Vb)(p)
 *   average co between two CCE points: co = −ln(V₂/V₁)/(p₂ − p₁)
 *
 * Units: psia, 1/psi, rb/STB. Standard definitions (e.g. McCain 1990 ch. 10; Dake 1978 ch. 2).
 */
import { PropertyInputError } from "./errors";
import {
  requireFinite,
  requirePositive,
  requirePressure,
  type Estimate,
  type PropertyWarning,
} from "./estimate";

const METHOD = "undersaturated-oil-fvf-from-compressibility";

/** Adaptive Simpson quadrature of a smooth function on [a, b]. */
export function integrate(
  f: (x: number) => number,
  a: number,
  b: number,
  tolerance = 1e-13,
): number {
  const simpson = (fa: number, fm: number, fb: number, h: number) =>
    (h / 6) * (fa + 4 * fm + fb);
  const recurse = (
    lo: number,
    hi: number,
    flo: number,
    fmid: number,
    fhi: number,
    whole: number,
    tol: number,
    depth: number,
  ): number => {
    const mid = (lo + hi) / 2;
    const lm = (lo + mid) / 2;
    const rm = (mid + hi) / 2;
    const flm = f(lm);
    const frm = f(rm);
    const left = simpson(flo, flm, fmid, mid - lo);
    const right = simpson(fmid, frm, fhi, hi - mid);
    const delta = left + right - whole;
    if (depth <= 0 || Math.abs(delta) <= 15 * tol)
      return left + right + delta / 15;
    return (
      recurse(lo, mid, flo, flm, fmid, left, tol / 2, depth - 1) +
      recurse(mid, hi, fmid, frm, fhi, right, tol / 2, depth - 1)
    );
  };
  if (a === b) return 0;
  const fa = f(a);
  const fb = f(b);
  const fm = f((a + b) / 2);
  return recurse(a, b, fa, fm, fb, simpson(fa, fm, fb, b - a), tolerance, 40);
}

/** Undersaturated Bo (rb/STB) at `pressure` ≥ `bubblePoint` from a constant or pressure-dependent co (1/psi). */
export function undersaturatedOilFvf(input: {
  readonly pressure: number;
  readonly bubblePoint: number;
  readonly oilFvfAtBubblePoint: number;
  readonly compressibility: number | ((pressure: number) => number);
}): Estimate {
  const p = requirePressure("pressure", input.pressure);
  const pb = requirePressure("bubblePoint", input.bubblePoint);
  const bob = requirePositive("oilFvfAtBubblePoint", input.oilFvfAtBubblePoint);
  if (p < pb) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "pressure",
      p,
      `pressure ${p} psia is below the bubble point ${pb} psia: this is an undersaturated-branch method.`,
    );
  }
  const warnings: PropertyWarning[] = [];
  let integral: number;
  const co = input.compressibility;
  if (typeof co === "number") {
    requireFinite("compressibility", co);
    if (co <= 0) warnings.push(nonPositive(co));
    integral = co * (p - pb);
  } else {
    let minCo = Number.POSITIVE_INFINITY;
    const checked = (x: number): number => {
      const v = co(x);
      requireFinite("compressibility(p)", v);
      minCo = Math.min(minCo, v);
      return v;
    };
    integral = integrate(checked, pb, p);
    if (minCo <= 0) warnings.push(nonPositive(minCo));
  }
  return { value: bob * Math.exp(-integral), warnings };
}

function nonPositive(value: number): PropertyWarning {
  return {
    code: "NONPHYSICAL_RESULT",
    method: METHOD,
    input: "compressibility",
    value,
    message:
      "Oil compressibility is not positive: Bo would rise with pressure above the bubble point.",
  };
}

/** Undersaturated Bo (rb/STB) from a CCE relative volume V/Vb. */
export function oilFvfFromRelativeVolume(input: {
  readonly oilFvfAtBubblePoint: number;
  readonly relativeVolume: number;
}): Estimate {
  const bob = requirePositive("oilFvfAtBubblePoint", input.oilFvfAtBubblePoint);
  const v = requirePositive("relativeVolume", input.relativeVolume);
  return { value: bob * v, warnings: [] };
}

/** Average compressibility (1/psi) between two CCE points (pressure psia, relative volume). */
export function averageCompressibility(
  a: { readonly pressure: number; readonly relativeVolume: number },
  b: { readonly pressure: number; readonly relativeVolume: number },
): Estimate {
  requirePressure("pressure", a.pressure);
  requirePressure("pressure", b.pressure);
  requirePositive("relativeVolume", a.relativeVolume);
  requirePositive("relativeVolume", b.relativeVolume);
  if (a.pressure === b.pressure) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "pressure",
      a.pressure,
      "The two points have the same pressure.",
    );
  }
  const co =
    -Math.log(b.relativeVolume / a.relativeVolume) / (b.pressure - a.pressure);
  return { value: co, warnings: co <= 0 ? [nonPositive(co)] : [] };
}
