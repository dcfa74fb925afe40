import { useEffect, useRef, useState } from "react";
import type { OutputSystem, PropertyKey } from "~/core/units";
import { postLookup, type Problem } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import type { CompareCell, CompareLookups, ComparedSample } from "./types";

/** While typing, the lookups wait for a pause this long; the first ones go at once. */
const TYPING_PAUSE_MS = 250;

const IDLE: CompareLookups = {
  status: "idle",
  cells: {},
  error: null,
  revision: {},
};

/** The last answer, with the request it answers (samples, property, units, conditions, extrapolation). */
type Answer = CompareLookups & { status: "done" | "error"; request: string };

/**
 * The table's values: the conditions POSTed to the lookup API for each sample (debounced; stale answers are
 * dropped). Idle while there is nothing to ask; loading from a change until its answer, showing the last
 * answer meanwhile.
 */
export function useCompareLookups(
  samples: ComparedSample[],
  property: PropertyKey,
  system: OutputSystem,
  conditions: Condition[],
  extrapolate: boolean,
): CompareLookups {
  const active = samples.length > 0 && conditions.length > 0;
  const request = JSON.stringify([
    samples.map((s) => s.id),
    property,
    system,
    conditions,
    extrapolate,
  ]);
  const [answer, setAnswer] = useState<Answer | null>(null);
  // with nothing to ask, the last answer is forgotten, so the next conditions start from empty cells
  if (!active && answer !== null) setAnswer(null);

  const first = useRef(true);
  useEffect(() => {
    if (!active) return;
    const controller = new AbortController();
    const delay = first.current ? 0 : TYPING_PAUSE_MS;
    first.current = false;
    const timer = setTimeout(() => {
      Promise.all(
        samples.map((s) =>
          lookupSample(
            s,
            property,
            system,
            conditions,
            extrapolate,
            controller.signal,
          ),
        ),
      )
        .then((answers) => {
          const cells: Record<number, CompareCell[]> = {};
          const revision: Record<number, number> = {};
          answers.forEach((a, i) => {
            cells[samples[i]!.id] = a.cells;
            if (a.revision !== null) revision[samples[i]!.id] = a.revision;
          });
          setAnswer({ request, status: "done", cells, error: null, revision });
        })
        .catch((error: unknown) => {
          if (controller.signal.aborted) return;
          setAnswer({
            request,
            status: "error",
            cells: {},
            error: error instanceof Error ? error.message : String(error),
            revision: {},
          });
        });
    }, delay);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
  }, [active, request, samples, property, system, conditions, extrapolate]);

  if (!active) return IDLE;
  if (answer === null) return { ...IDLE, status: "loading" };
  if (answer.request !== request) return { ...answer, status: "loading" };
  return answer;
}

/**
 * One sample's values: every condition in one request; the service answers each point or refuses it in place
 * (outside the measured range without extrapolation, no measured values around it, …), so one point never
 * blanks the column. A request refused whole (a malformed one) is an error of the table.
 */
async function lookupSample(
  sample: ComparedSample,
  property: PropertyKey,
  system: OutputSystem,
  conditions: Condition[],
  extrapolate: boolean,
  signal: AbortSignal,
): Promise<{ cells: CompareCell[]; revision: number | null }> {
  const P = sample.grid.pressures;
  const T = sample.grid.temperatures;
  const outside = (c: Condition) =>
    c.pressure < P[0]! ||
    c.pressure > P[P.length - 1]! ||
    c.temperature < T[0]! ||
    c.temperature > T[T.length - 1]!;
  const { data, error, response } = await postLookup(
    sample.id,
    {
      property,
      points: conditions,
      method: "auto",
      units: system,
      pressureBasis: "absolute",
      extrapolate,
    },
    signal,
  );
  if (!data)
    throw new Error(
      problemOf(error).detail ?? `the service answered ${response.status}`,
    );
  const cells = data.results.map((r, k): CompareCell => {
    if (r.refused || r.value === null || r.method === null)
      return {
        kind: "none",
        code: r.refused?.code,
        reason: r.refused?.message ?? "The service gave no value here.",
      };
    return {
      kind: "value",
      value: r.value,
      errorEstimate: r.errorEstimate,
      warnings: r.warnings,
      method: r.method,
      outsideRange: outside(conditions[k]!),
    };
  });
  return { cells, revision: data.revision };
}

/** The problem details of a refused request, as far as its body held them (a proxy's error page holds none). */
function problemOf(error: unknown): Partial<Problem> {
  return typeof error === "object" && error !== null
    ? (error as Partial<Problem>)
    : {};
}
