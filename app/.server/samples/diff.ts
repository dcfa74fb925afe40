import {
  getRevisionsForDiff,
  listRevisionsOfSample,
  type StoredGrid,
} from "~/.server/db/queries/revisions";
import type { DiffRow, DisplayRevisionDiff } from "~/components/samples/types";
import { roundSignificant } from "~/core/format";
import {
  type OutputSystem,
  type PropertyKey,
  toOutputPressure,
  toOutputTemperature,
  toOutputValue,
  unitLabel,
} from "~/core/units";
import { revisionNumberFrom } from "./params";

/*
 * Cell-by-cell comparison of two revisions (canonical units). A cell is a property at one pressure and one
 * temperature; it is "changed" when both revisions hold a value and the values differ, "added" when only the
 * newer one holds it, "removed" when only the older one does. Bubble points are compared per temperature.
 * The diff page (getRevisionDiffPage) shows it in the reader's unit system (presentDiff).
 */

type CellDiff = {
  property: PropertyKey | "bubble_point";
  pressurePsia: number | null;
  temperatureF: number;
  from: number | null;
  to: number | null;
};

type RevisionDiff = {
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

/** Most rows listed per kind; the counts are always complete. */
const DIFF_ROW_LIMIT = 2000;

/** A diff in the reader's unit system (rounded to 10 significant digits to drop conversion noise), counted by property. */
export function presentDiff(
  diff: RevisionDiff,
  system: OutputSystem,
  rowLimit = DIFF_ROW_LIMIT,
): DisplayRevisionDiff {
  const round = (v: number) => roundSignificant(v, 10);
  const value = (c: CellDiff, v: number | null) =>
    v === null
      ? null
      : round(
          c.property === "bubble_point"
            ? toOutputPressure(v, system)
            : toOutputValue(v, c.property, system),
        );
  const row = (c: CellDiff): DiffRow => ({
    property: c.property,
    unit:
      c.property === "bubble_point"
        ? unitLabel(system, "pressure")
        : unitLabel(system, c.property),
    pressure:
      c.pressurePsia === null
        ? null
        : round(toOutputPressure(c.pressurePsia, system)),
    temperature: round(toOutputTemperature(c.temperatureF, system)),
    from: value(c, c.from),
    to: value(c, c.to),
  });
  const byProperty = new Map<
    DiffRow["property"],
    { changed: number; added: number; removed: number }
  >();
  for (const kind of ["changed", "added", "removed"] as const) {
    for (const c of diff[kind]) {
      const entry = byProperty.get(c.property) ?? {
        changed: 0,
        added: 0,
        removed: 0,
      };
      entry[kind]++;
      byProperty.set(c.property, entry);
    }
  }
  return {
    byProperty: [...byProperty.entries()].map(([property, counts]) => ({
      property,
      ...counts,
    })),
    counts: {
      changed: diff.changed.length,
      added: diff.added.length,
      removed: diff.removed.length,
      unchanged: diff.unchanged,
    },
    changed: diff.changed.slice(0, rowLimit).map(row),
    added: diff.added.slice(0, rowLimit).map(row),
    removed: diff.removed.slice(0, rowLimit).map(row),
  };
}

/**
 * The diff page of a sample: the revisions to choose from, the pair compared (from the query string `from` and
 * `to`; by default the latest revision against the approved one before it, or the one before it) and their
 * diff, or the numbers of the sample's that do not exist.
 */
export async function getRevisionDiffPage(
  sample: { id: number; label: string },
  system: OutputSystem,
  query: URLSearchParams,
) {
  const revisions = await listRevisionsOfSample(sample.id);
  const approved = revisions.filter(
    (r) => r.status === "approved" || r.status === "superseded",
  );
  const toDefault = revisions[0]?.number ?? null;
  const fromDefault =
    approved.find((r) => toDefault !== null && r.number < toDefault)?.number ??
    revisions[1]?.number ??
    toDefault;
  const from = revisionNumberFrom(query.get("from")) ?? fromDefault;
  const to = revisionNumberFrom(query.get("to")) ?? toDefault;

  let result: null | { missing: number[] } | { diff: DisplayRevisionDiff } =
    null;
  if (from !== null && to !== null) {
    const pair = await getRevisionsForDiff(sample.id, from, to);
    result =
      !pair.from || !pair.to
        ? {
            missing: [pair.from ? null : from, pair.to ? null : to].filter(
              (n): n is number => n !== null,
            ),
          }
        : { diff: presentDiff(diffRevisions(pair.from, pair.to), system) };
  }

  return {
    sample: { id: sample.id, label: sample.label },
    revisions: revisions.map((r) => ({ number: r.number, status: r.status })),
    from,
    to,
    units: {
      pressure: unitLabel(system, "pressure"),
      temperature: unitLabel(system, "temperature"),
    },
    result,
  };
}
