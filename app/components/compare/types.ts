/*
 * Plain, JSON-serialisable shapes the compare page's loader (app/.server/samples/compare.ts) hands to the
 * compare components. Numbers are already in the page's unit system; unit symbols travel beside them.
 */
import type { OutputSystem, PropertyKey } from "~/core/units";
import type { ApiGrid } from "~/utils/api/client";
import type { SurfaceArrangement } from "~/utils/compare";

/** A sample the person may choose, with what the picker says about it. */
export type CompareSampleOption = {
  id: number;
  label: string;
  field: string;
  well: string;
  approvedRevision: number | null;
  properties: PropertyKey[];
  reservoirPressure: number | null;
  reservoirTemperature: number | null;
};

/** A chosen sample: its approved revision and grid of the property, null when it has none. */
export type CompareSelection = {
  id: number;
  label: string;
  revision: number | null;
  grid: ApiGrid | null;
};

/** A chosen sample that has a grid of the property, so it takes part in the table and the plots. */
export type ComparedSample = CompareSelection & {
  revision: number;
  grid: ApiGrid;
};

/** The unit system and its symbols; `value` is "" for a dimensionless property (z). */
export type CompareUnits = {
  system: OutputSystem;
  pressure: string;
  temperature: string;
  value: string;
};

/** Everything the compare page shows before any lookup. */
export type CompareView = {
  units: CompareUnits;
  property: PropertyKey;
  view: SurfaceArrangement;
  samples: CompareSampleOption[];
  selected: CompareSelection[];
};

/** One cell of the values table: a value from the lookup API, or why there is none. */
export type CompareCell =
  | {
      kind: "value";
      value: number;
      /** null where the table says nothing about the error (warning estimate-unavailable). */
      errorEstimate: number | null;
      warnings: string[];
      method: string;
      outsideRange: boolean;
    }
  | {
      kind: "none";
      /** The service's refusal code (e.g. outside-measured-range), when it refused the point. */
      code?: string;
      /** The service's message, in plain words. */
      reason: string;
    };

/** The lookups of the table: cells per sample id, in the order of the conditions. */
export type CompareLookups = {
  status: "idle" | "loading" | "done" | "error";
  cells: Record<number, CompareCell[]>;
  error: string | null;
  /** The revision each sample's answer came from, by sample id. */
  revision: Record<number, number>;
};

/** Whether a chosen sample has a grid of the property (and so takes part in the table and the plots). */
export function isCompared(s: CompareSelection): s is ComparedSample {
  return s.grid !== null && s.revision !== null;
}
