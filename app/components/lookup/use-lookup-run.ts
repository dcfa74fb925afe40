import { useState } from "react";
import type { Method } from "~/core/interpolation";
import {
  fromInputPressureOn,
  toOutputPressure,
  type OutputSystem,
  type PressureBasis,
  type PropertyKey,
} from "~/core/units";
import { postLookups, serverTimingMs } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import { answeredRuns, type LookupRun, type PropertyRun } from "./property-run";

/** What "Look up" asks: one sample, its properties, the conditions and the method, in the units on screen. */
export type LookupQuery = {
  sampleId: number;
  properties: PropertyKey[];
  conditions: Condition[];
  method: "auto" | Method;
  degree: [number, number];
  units: OutputSystem;
  /** Pressures of the conditions (and of everything returned) absolute or gauge. */
  pressureBasis: PressureBasis;
  extrapolate: boolean;
  /** A named revision (?revision=N); default the approved one. */
  revision: number | undefined;
};

/**
 * The lookup run on screen: `start` asks the lookup API once for all the properties (`properties`) and keeps
 * the answer of each; the service answers every point or refuses it in place, so one point never voids a
 * property. The run shown stays until the next one has answered; a request refused whole (or a form the page
 * could not send, `fail`) shows a message instead.
 */
export function useLookupRun() {
  const [run, setRun] = useState<LookupRun | null>(null);
  const [running, setRunning] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function start(query: LookupQuery) {
    setError(null);
    setRunning(true);
    const started = performance.now();
    try {
      const { data, error, response } = await postLookups(query.sampleId, {
        properties: query.properties,
        points: query.conditions,
        method: query.method,
        degree: query.method === "newton" ? query.degree : undefined,
        units: query.units,
        pressureBasis: query.pressureBasis,
        extrapolate: query.extrapolate,
        revision: query.revision,
      });
      if (!data) {
        setRun(null);
        setError(
          (typeof error === "object" && error !== null && "detail" in error
            ? String(error.detail)
            : "") ||
            `The lookup failed (the server answered ${response.status}).`,
        );
        return;
      }
      const serverMs = serverTimingMs(response);
      const runs: PropertyRun[] = data.lookups.map((block) => ({
        property: block.property,
        ok: true,
        revision: data.revision,
        revisionStatus: data.revisionStatus,
        approved: data.approved,
        unit: block.units.value,
        bases: {
          standardConditions: block.units.standardConditions,
          reportStandardConditions: block.units.reportStandardConditions,
          pressureBasis: block.units.pressureBasis,
          barometricPressurePsia: block.units.barometricPressurePsia,
        },
        methodDescription: block.methodDescription,
        degree: pairOrNull(block.degree),
        results: block.results,
        summary: block.summary,
        serverMs,
      }));
      setRun({
        conditions: query.conditions,
        absoluteConditions: absoluteConditions(query, runs),
        runs,
        sampleId: query.sampleId,
        units: query.units,
        method: query.method,
        elapsedMs: performance.now() - started,
        query,
      });
    } catch {
      setError("The server could not be reached. Try again.");
    } finally {
      setRunning(false);
    }
  }

  return {
    run,
    running,
    error,
    start,
    fail: setError,
    clear: () => setRun(null),
  };
}

/** Gauge conditions made absolute with the barometric pressure the server used (the sample's). */
function absoluteConditions(
  query: LookupQuery,
  runs: readonly PropertyRun[],
): Condition[] {
  const barometricPressurePsia =
    answeredRuns(runs)[0]?.bases.barometricPressurePsia;
  if (query.pressureBasis !== "gauge" || barometricPressurePsia === undefined)
    return query.conditions;
  const basis = { pressureBasis: "gauge", barometricPressurePsia } as const;
  return query.conditions.map((c) => ({
    ...c,
    pressure: toOutputPressure(
      fromInputPressureOn(c.pressure, query.units, basis),
      query.units,
    ),
  }));
}

/** The response's degree, a pair in the schema, reaches us typed number[] (openapi-fetch reads tuples as arrays). */
function pairOrNull(degree: readonly number[] | null): [number, number] | null {
  const [p, t] = degree ?? [];
  return degree?.length === 2 && p !== undefined && t !== undefined
    ? [p, t]
    : null;
}
