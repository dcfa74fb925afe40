import type { StoredGrid } from "~/.server/db/queries/revisions";
import type { PropertyKey } from "~/core/units";

/*
 * Cell-by-cell comparison of two revisions (canonical units). A cell is a property at one pressure and one
 * temperature; it is "changed" when both revisions hold a value and the values differ, "added" when only the
 * newer one holds it, "removed" when only the older one does. Bubble points are compared per temperature.
 */

export type CellDiff = {
  property: PropertyKey | "bubble_point";
  pressurePsia: number | null;
  temperatureF: number;
  from: number | null;
  to: number | null;
};

export type RevisionDiff = {
  changed: CellDiff[];
  added: CellDiff[];
  removed: CellDiff[];
  unchanged: number;
};

/** Values equal to 12 significant digits are the same measurement (doubles read back from the database). */
function same(a: number, b: number): boolean {
  return (
    a === b || Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b))
  );
}

function cells(grids: readonly StoredGrid[]): Map<string, CellDiff> {
  const out = new Map<string, CellDiff>();
  for (const g of grids) {
    g.pressures.forEach((p, i) => {
      g.temperatures.forEach((t, j) => {
        const v = g.values[i]?.[j];
        if (v === null || v === undefined) return;
        out.set(`${g.property}|${p}|${t}`, {
          property: g.property,
          pressurePsia: p,
          temperatureF: t,
          from: v,
          to: v,
        });
      });
    });
  }
  return out;
}

const ORDER: Record<string, number> = {
  bubble_point: 0,
  oil_fvf: 1,
  solution_gor: 2,
  oil_viscosity: 3,
  oil_density: 4,
  gas_fvf: 5,
  gas_viscosity: 6,
  z_factor: 7,
};

function byPlace(a: CellDiff, b: CellDiff): number {
  return (
    (ORDER[a.property] ?? 99) - (ORDER[b.property] ?? 99) ||
    a.temperatureF - b.temperatureF ||
    (a.pressurePsia ?? 0) - (b.pressurePsia ?? 0)
  );
}

export function diffRevisions(
  older: {
    grids: readonly StoredGrid[];
    bubblePoints: readonly { temperatureF: number; bubblePointPsia: number }[];
  },
  newer: {
    grids: readonly StoredGrid[];
    bubblePoints: readonly { temperatureF: number; bubblePointPsia: number }[];
  },
): RevisionDiff {
  const before = cells(older.grids);
  const after = cells(newer.grids);
  for (const b of older.bubblePoints) {
    before.set(`bubble_point|${b.temperatureF}`, {
      property: "bubble_point",
      pressurePsia: null,
      temperatureF: b.temperatureF,
      from: b.bubblePointPsia,
      to: b.bubblePointPsia,
    });
  }
  for (const b of newer.bubblePoints) {
    after.set(`bubble_point|${b.temperatureF}`, {
      property: "bubble_point",
      pressurePsia: null,
      temperatureF: b.temperatureF,
      from: b.bubblePointPsia,
      to: b.bubblePointPsia,
    });
  }
  const result: RevisionDiff = {
    changed: [],
    added: [],
    removed: [],
    unchanged: 0,
  };
  for (const [key, cell] of after) {
    const old = before.get(key);
    if (!old) result.added.push({ ...cell, from: null });
    else if (!same(old.from!, cell.to!))
      result.changed.push({ ...cell, from: old.from });
    else result.unchanged++;
  }
  for (const [key, cell] of before)
    if (!after.has(key)) result.removed.push({ ...cell, to: null });
  result.changed.sort(byPlace);
  result.added.sort(byPlace);
  result.removed.sort(byPlace);
  return result;
}
