/**
 * The pressures of a table when the caller names none: the measured pressures of the grids the table is
 * made of (canonical psia). Without extrapolation only those inside every grid's measured pressure range are
 * taken, so that no row is refused (nodes that differ by less than 10⁻⁹ of their value are one row); the bubble point is added by buildBlackOilTable as always.
 */
import type { Grid } from "../interpolation";
import { TABLE_COLUMNS } from "./columns";

export function measuredTablePressures(
  grids: Partial<Record<string, Grid>>,
  extrapolate = false,
): number[] {
  const used = TABLE_COLUMNS.map((k) => grids[k]).filter(
    (g): g is Grid => g !== undefined && g.pressures.length > 0,
  );
  if (used.length === 0) return [];
  const low = extrapolate
    ? -Infinity
    : Math.max(...used.map((g) => g.pressures[0]!));
  const high = extrapolate
    ? Infinity
    : Math.min(...used.map((g) => g.pressures[g.pressures.length - 1]!));
  const all = new Set<number>();
  for (const g of used)
    for (const p of g.pressures) if (p >= low && p <= high && p > 0) all.add(p);
  // Nodes of two grids that differ only by a unit conversion's round-off are one row.
  const out: number[] = [];
  for (const p of [...all].sort((a, b) => a - b))
    if (out.length === 0 || p - out[out.length - 1]! > 1e-9 * p) out.push(p);
  return out;
}
