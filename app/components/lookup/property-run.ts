import type { Method } from "~/core/interpolation";
import type { OutputSystem, PropertyKey } from "~/core/units";
import type { LookupResponse } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";

/**
 * What the lookup page keeps of one property's answer: the fields of the lookup API's response (its generated
 * type), the value unit, and the server's own time from its Server-Timing header; or the reason it failed.
 */
export type AnsweredRun = Pick<
  LookupResponse,
  | "revision"
  | "revisionStatus"
  | "approved"
  | "methodDescription"
  | "degree"
  | "results"
> & {
  property: PropertyKey;
  ok: true;
  /** The value unit (`units.value` of the response). */
  unit: string;
  /**
   * The bases of the numbers (from the response's `units`): the standard conditions of Rs and Bg and the
   * report's own, the pressure basis and the sample's barometric pressure (psia).
   */
  bases: Pick<
    LookupResponse["units"],
    | "standardConditions"
    | "reportStandardConditions"
    | "pressureBasis"
    | "barometricPressurePsia"
  >;
  serverMs: number;
};
type FailedRun = {
  property: PropertyKey;
  ok: false;
  error: string;
  serverMs: number;
};
export type PropertyRun = AnsweredRun | FailedRun;

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
};

export const answeredRuns = (runs: readonly PropertyRun[]) =>
  runs.filter((r): r is AnsweredRun => r.ok);
export const failedRuns = (runs: readonly PropertyRun[]) =>
  runs.filter((r): r is FailedRun => !r.ok);
