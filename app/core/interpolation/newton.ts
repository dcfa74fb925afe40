// Newton divided differences on small zones. Indices are in range by construction.

/**
 * Turns c[co .. co+q-1] (values at the nodes x[xo .. xo+q-1], in the zone's order) into the Newton
 * coefficients f[x0], f[x0,x1], ..., f[x0..x_{q-1}], in place.
 */
export function dividedDifferences(
  x: Float64Array,
  xo: number,
  c: Float64Array,
  co: number,
  q: number,
): void {
  for (let l = 1; l < q; l++) {
    for (let i = q - 1; i >= l; i--) {
      c[co + i] = (c[co + i]! - c[co + i - 1]!) / (x[xo + i]! - x[xo + i - l]!);
    }
  }
}

/** Where `newtonTerms` leaves its two answers (reused; no allocation per call). */
export const newtonOut = { value: 0, last: 0 };

/**
 * Evaluates the Newton form with coefficients c[co ..] on nodes x[xo ..] at t:
 * `value` = sum of the first v terms, `last` = the last of the q terms (0 when q = 1). With q = v + 1 the
 * last term is the change when the degree is raised by one; with q = v it is the last correction already
 * inside `value` (see `orderedZone`).
 */
export function newtonTerms(
  x: Float64Array,
  xo: number,
  c: Float64Array,
  co: number,
  q: number,
  v: number,
  t: number,
): void {
  let w = 1;
  let sum = c[co]!;
  let last = 0;
  for (let i = 1; i < q; i++) {
    w *= t - x[xo + i - 1]!;
    const term = c[co + i]! * w;
    if (i < v) sum += term;
    if (i === q - 1) last = term;
  }
  newtonOut.value = sum;
  newtonOut.last = last;
}

/** The full divided-difference table for display: table[l][i] = f[x_i .. x_{i+l}]. */
export function dividedDifferenceTable(
  xs: readonly number[],
  ys: readonly number[],
): number[][] {
  const table: number[][] = [ys.slice()];
  for (let l = 1; l < xs.length; l++) {
    const prev = table[l - 1]!;
    const row: number[] = [];
    for (let i = 0; i + l < xs.length; i++) {
      row.push((prev[i + 1]! - prev[i]!) / (xs[i + l]! - xs[i]!));
    }
    table.push(row);
  }
  return table;
}
