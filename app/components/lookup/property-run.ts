import type { Method } from "~/core/interpolation";
import type { OutputSystem, PropertyKey } from "~/core/units";
import type { LookupBlock, LookupsResponse } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import type { LookupQuery } from "./use-lookup-run";

/**
 * What the lookup page keeps of one property's answer: the fields of the lookup API's response and of the
 * property's block (their generated types), the value unit, and the server's own time from its Server-Timing
 * header (one request answers every property). Points the service refused are in `results`, in place, with
 * `refused`. A request refused whole leaves no run (the page shows its message instead).
 */
export type PropertyRun = Pick<
  LookupsResponse,
  "revision" | "revisionStatus" | "approved"
> &
  Pick<LookupBlock, "methodDescription" | "results" | "summary"> & {
    property: PropertyKey;
    ok: true;
    degree: [number, number] | null;
    /** The value unit (`units.value` of the block). */
    unit: string;
    /**
     * The bases of the numbers (from the response's `units`): the standard conditions of Rs and Bg and the
     * report's own, the pressure basis and the sample's barometric pressure (psia).
     */
    bases: Pick<
      LookupBlock["units"],
      | "standardConditions"
      | "reportStandardConditions"
      | "pressureBasis"
      | "barometricPressurePsia"
    >;
    serverMs: number;
  };

/** One press of "Look up": the conditions, one run per property, and what they were asked with. */
export type LookupRun = {
  conditions: Condition[];
  /**
   * The conditions with absolute pressures (psia, bara), as the grids are drawn and explained: the conditions
   * themselves unless they were typed as gauge pressures.
   */
  absoluteConditions: Condition[];
  runs: PropertyRun[];
  sampleId: number;
  units: OutputSystem;
  method: "auto" | Method;
  /** Time in the browser from the press to the last answer (ms). */
  elapsedMs: number;
  /** What was asked (the export asks the server for the same lookup). */
  query: LookupQuery;
};

export const answeredRuns = (runs: readonly PropertyRun[]) =>
  runs.filter((r) => r.ok);
