import { useState } from "react";
import type { Method } from "~/core/interpolation";
import {
  fromInputPressureOn,
  toOutputPressure,
  type OutputSystem,
  type PressureBasis,
  type PropertyKey,
} from "~/core/units";
import { postLookup, serverTimingMs } from "~/utils/api/client";
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
  /** Conditions typed as absolute or gauge pressures (psig, barg). */
  pressureBasis: PressureBasis;
  extrapolate: boolean;
  /** A named revision (?revision=N); default the approved one. */
  revision: number | undefined;
};

/**
 * The lookup run on screen: `start` asks the lookup API once per property (in parallel) and keeps the answers
 * of all of them, a property the server refused carrying its reason. The run shown stays until the next one
 * has answered; `fail` shows a message instead (a form the page could not send).
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
      const runs = await Promise.all(
        query.properties.map((property) => lookUpProperty(query, property)),
      );
      setRun({
        conditions: query.conditions,
        absoluteConditions: absoluteConditions(query, runs),
        runs,
        sampleId: query.sampleId,
        units: query.units,
        method: query.method,
        elapsedMs: performance.now() - started,
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

async function lookUpProperty(
  query: LookupQuery,
  property: PropertyKey,
): Promise<PropertyRun> {
  const { data, error, response } = await postLookup(query.sampleId, {
    property,
    points: query.conditions,
    method: query.method,
    degree: query.method === "newton" ? query.degree : undefined,
    units: query.units,
    pressureBasis: query.pressureBasis,
    extrapolate: query.extrapolate,
    revision: query.revision,
  });
  const serverMs = serverTimingMs(response);
  if (!data)
    return {
      property,
      ok: false,
      error: error?.detail ?? "The lookup failed.",
      serverMs,
    };
  return {
    property,
    ok: true,
    revision: data.revision,
    revisionStatus: data.revisionStatus,
    approved: data.approved,
    unit: data.units.value,
    bases: {
      standardConditions: data.units.standardConditions,
      reportStandardConditions: data.units.reportStandardConditions,
      pressureBasis: data.units.pressureBasis,
      barometricPressurePsia: data.units.barometricPressurePsia,
    },
    methodDescription: data.methodDescription,
    degree: pairOrNull(data.degree),
    results: data.results,
    serverMs,
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
