import type { Grid } from "~/core/interpolation";
import type { PropertyKey } from "~/core/units";
import {
  getCurrentApprovedRevision,
  getRevisionByNumber,
  getRevisionGrids,
  listRevisionBubblePoints,
} from "~/.server/db/queries/revisions";

/** A revision's measured grids in canonical units, ready for the engine (oil grids carry their bubble points). */
export type RevisionData = {
  revisionId: number;
  number: number;
  status: string;
  bubblePoints: { temperatureF: number; bubblePointPsia: number }[];
  grids: Partial<
    Record<PropertyKey, Grid & { unit: string; sourceUnit: string | null }>
  >;
};

const OIL_PROPERTIES: ReadonlySet<PropertyKey> = new Set([
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
  "oil_density",
]);

/*
 * Revisions are immutable, so their data can be cached in memory for as long as we like. A small LRU keeps the
 * most recently used revisions of this process.
 */
const CACHE_LIMIT = 64;
const cache = new Map<
  number,
  Promise<Omit<RevisionData, "number" | "status">>
>();

async function loadGrids(revisionId: number) {
  const [stored, bubblePoints] = await Promise.all([
    getRevisionGrids(revisionId),
    listRevisionBubblePoints(revisionId),
  ]);
  const grids: RevisionData["grids"] = {};
  for (const g of stored) {
    const bp = OIL_PROPERTIES.has(g.property)
      ? g.temperatures.map(
          (t) =>
            bubblePoints.find((b) => b.temperatureF === t)?.bubblePointPsia ??
            null,
        )
      : undefined;
    grids[g.property] = {
      pressures: g.pressures,
      temperatures: g.temperatures,
      values: g.values,
      ...(bp && bp.some((v) => v !== null) ? { bubblePoints: bp } : {}),
      unit: g.unit,
      sourceUnit: g.sourceUnit,
    };
  }
  return { revisionId, bubblePoints, grids };
}

export async function getRevisionData(revision: {
  id: number;
  number: number;
  status: string;
}): Promise<RevisionData> {
  let entry = cache.get(revision.id);
  if (entry) {
    cache.delete(revision.id);
  } else {
    entry = loadGrids(revision.id);
    entry.catch(() => cache.delete(revision.id));
  }
  cache.set(revision.id, entry);
  if (cache.size > CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  return { ...(await entry), number: revision.number, status: revision.status };
}

/** The sample's latest approved revision, or revision `number` when given (any status); null when none. */
export async function resolveRevision(sampleId: number, number?: number) {
  if (number !== undefined) return getRevisionByNumber(sampleId, number);
  const current = await getCurrentApprovedRevision(sampleId);
  return current ? { ...current, status: "approved" as const } : null;
}
