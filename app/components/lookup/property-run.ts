import type { Method } from "~/core/interpolation";
import type { OutputSystem, PropertyKey } from "~/core/units";
import type { LookupResponse } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import type { LookupQuery } from "./use-lookup-run";

/**
 * What the lookup page keeps of one property's answer: the fields of the lookup API's response (its generated
 * type), the value unit, and the server's own time from its Server-Timing header; or the reason it failed.
 */
type AnsweredRun = Pick<
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
  runs.filter((r): r is AnsweredRun => r.ok);
export const failedRuns = (runs: readonly PropertyRun[]) =>
  runs.filter((r): r is FailedRun => !r.ok);
