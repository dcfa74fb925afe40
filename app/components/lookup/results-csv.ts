import { lookupSheet, sheetToDelimited } from "~/core/tables";
import type { LookupResult } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import { answeredRuns, type PropertyRun } from "./property-run";

/**
 * The lookup results as delimited text: the product's lookup sheet (app/core/tables/sheet.ts: headers in
 * words with units, values to six significant digits or fewer where the estimate says so, estimates to two,
 * flags and refusals per value), CSV with its "# …" lines and a byte-order mark, or tab-separated without
 * either for the clipboard. Every cell goes through the product's CSV cell writer (app/core/csv).
 */
export function lookupResultsDelimited(
  conditions: readonly Condition[],
  runs: readonly PropertyRun[],
  units: { pressure: string; temperature: string },
  delimiter: "," | "\t",
  meta: readonly string[],
  warningsOf: (r: LookupResult, pressure: number) => string[],
): string {
  const sheet = lookupSheet({
    about: meta,
    pressureUnit: units.pressure,
    temperatureUnit: units.temperature,
    conditions,
    properties: answeredRuns(runs).map((r) => ({
      property: r.property,
      unit: r.unit,
      digits: null,
      points: r.results.map((x, i) => ({
        value: x.value,
        errorEstimate: x.errorEstimate,
        method: x.method,
        warnings: warningsOf(x, conditions[i]!.pressure),
        refused: x.refused ?? null,
      })),
    })),
  });
  const clipboard = delimiter === "\t";
  return sheetToDelimited(sheet, {
    delimiter,
    bom: !clipboard,
    about: !clipboard,
  });
}
