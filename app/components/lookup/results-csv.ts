import { csvCommentLine, csvRow } from "~/core/csv";
import type { LookupResult } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import { answeredRuns, type PropertyRun } from "./property-run";

/**
 * The lookup results as delimited text (CSV for "Export CSV", tab-separated for the clipboard). Every cell goes
 * through the product's CSV cell writer (app/core/csv): numbers stay numbers, text that a spreadsheet would run
 * as a formula is neutralised, and each "# …" line is one cell, whatever the sample label holds.
 */
export function lookupResultsDelimited(
  conditions: readonly Condition[],
  runs: readonly PropertyRun[],
  units: { pressure: string; temperature: string },
  delimiter: "," | "\t",
  meta: readonly string[],
  warningsOf: (r: LookupResult, pressure: number) => string[],
): string {
  const ok = answeredRuns(runs);
  const header: string[] = [
    `pressure (${units.pressure})`,
    `temperature (${units.temperature})`,
  ];
  for (const r of ok)
    header.push(
      `${r.property} (${r.unit})`,
      `${r.property} error estimate (${r.unit})`,
      `${r.property} method`,
      `${r.property} warnings`,
    );
  const lines = conditions.map((c, i) => {
    const cells: (string | number)[] = [c.pressure, c.temperature];
    for (const r of ok) {
      const x = r.results[i]!;
      // A point the server refused has no value: empty cells and the reason.
      cells.push(
        x.value ?? "",
        x.errorEstimate ?? "",
        x.method ?? "",
        x.refused
          ? `refused: ${x.refused.message}`
          : warningsOf(x, c.pressure).join(" "),
      );
    }
    return csvRow(cells, { delimiter });
  });
  return (
    [
      ...meta.map((m) => csvCommentLine(m, { delimiter })),
      csvRow(header, { delimiter }),
      ...lines,
    ].join("\n") + "\n"
  );
}
