import type { Method } from "~/core/interpolation";
import { type OutputSystem, PROPERTIES, type PropertyKey } from "~/core/units";
import type { SampleDetail } from "~/utils/api/client";
import type { ExplainTarget } from "./explanation-panel";
import type { LookupRun } from "./property-run";

/**
 * What the explanation panel needs to redo one value of a run in the browser: the property's measured grid of
 * the revision the server used (through `loadGrids`, in the run's units), the point, and the method and degree
 * the server reports for that value. Null for a value that has none (refused, or a property that failed).
 */
export async function explainTargetOf(
  run: LookupRun,
  conditionIndex: number,
  property: PropertyKey,
  context: {
    loadGrids: (
      sampleId: number,
      system: OutputSystem,
      revision: number,
    ) => Promise<SampleDetail>;
    extrapolate: boolean;
    units: { pressure: string; temperature: string };
  },
): Promise<ExplainTarget | null> {
  const propertyRun = run.runs.find((r) => r.property === property);
  if (!propertyRun?.ok) return null;
  const result = propertyRun.results[conditionIndex];
  const condition = run.absoluteConditions[conditionIndex];
  if (!result || !condition || result.value === null) return null;
  const data = await context.loadGrids(
    run.sampleId,
    run.units,
    propertyRun.revision,
  );
  const grid = data.grids.find((g) => g.property === property);
  if (!grid) return null;
  return {
    propertyName: PROPERTIES[property].phrase,
    grid,
    point: condition,
    method: result.method as Method,
    degree:
      result.method === "pchip"
        ? null
        : result.method === "linear"
          ? [1, 1]
          : (propertyRun.degree ?? [3, 3]),
    extrapolate: context.extrapolate,
    serverValue: result.value,
    revision: propertyRun.revision,
    units: { ...context.units, value: propertyRun.unit },
  };
}
