import { useState } from "react";
import { describeWarningCode, isLookupWarning } from "~/core/lookup";
import { PROPERTIES, type PropertyKey } from "~/core/units";
import type { LookupResult } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import { answeredRuns, type PropertyRun } from "./property-run";
import { LookupExportButtons } from "./export-buttons";
import { lookupResultsDelimited } from "./results-csv";
import type { LookupQuery } from "./use-lookup-run";
import { SERIOUS_WARNINGS, warningLabel } from "~/utils/warning-labels";
import { formatMilliseconds, formatPlain } from "~/core/format";

/** Warnings of one result, as the server computed them (near-bubble-point included). */
function warningsOf(r: LookupResult): string[] {
  return [...r.warnings];
}

function describe(code: string): string {
  return isLookupWarning(code) ? describeWarningCode(code) : code;
}

export function LookupResultsTable({
  conditions,
  runs,
  units,
  method,
  sampleLabel,
  onExplain,
  elapsedMs,
  exportQuery,
}: {
  conditions: Condition[];
  runs: PropertyRun[];
  units: { pressure: string; temperature: string };
  method: string;
  sampleLabel: string;
  onExplain: (conditionIndex: number, property: PropertyKey) => void;
  elapsedMs: number;
  /** The lookup as asked, for the server's export (CSV, XLSX). */
  exportQuery?: LookupQuery;
}) {
  const [copied, setCopied] = useState(false);
  const ok = answeredRuns(runs);
  const revisions = [...new Set(ok.map((r) => r.revision))];
  const serverMs = ok.reduce(
    (m, r) => Math.max(m, Number.isFinite(r.serverMs) ? r.serverMs : 0),
    0,
  );
  const flagged = ok.reduce(
    (n, r) => n + r.results.filter((x) => x.warnings.length > 0).length,
    0,
  );
  // values the server refused (one per property and point)
  const refused = ok.reduce((n, r) => n + r.summary.refusedCount, 0);

  async function copy() {
    await navigator.clipboard.writeText(
      lookupResultsDelimited(conditions, runs, units, "\t", [], warningsOf),
    );
    setCopied(true);
  }

  return (
    <section className="mt-6" aria-labelledby="results-title">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="results-title" className="text-lg font-semibold">
            Results
          </h2>
          <p className="text-sm text-ink-muted" data-testid="results-meta">
            {sampleLabel} ·{" "}
            {revisions.length
              ? `revision ${revisions.join(", ")}`
              : "no values"}{" "}
            · {ok[0]?.methodDescription ?? method} · {conditions.length}{" "}
            condition
            {conditions.length === 1 ? "" : "s"} · answered in{" "}
            {Math.round(elapsedMs)} ms
            {ok.length ? ` (server ${formatMilliseconds(serverMs)} ms)` : ""}
            {flagged
              ? ` · ${flagged} value${flagged === 1 ? "" : "s"} flagged`
              : ""}
            {refused
              ? ` · ${refused} value${refused === 1 ? "" : "s"} refused`
              : ""}
          </p>
        </div>
        <div className="flex gap-2">
          {exportQuery ? <LookupExportButtons query={exportQuery} /> : null}
          <button
            type="button"
            onClick={() => void copy()}
            className="rounded border border-line bg-panel px-3 py-1.5 text-sm font-semibold hover:border-accent"
          >
            {copied ? "Copied" : "Copy to clipboard"}
          </button>
        </div>
      </div>
      {ok.length > 0 ? (
        <div className="relative mt-3 max-h-[32rem] overflow-auto rounded-lg border border-line bg-panel">
          <table className="w-full text-sm" data-testid="results-table">
            <thead className="sticky top-0 bg-surface text-ink-muted">
              <tr>
                <th className="px-3 py-2 text-right font-semibold">
                  Pressure ({units.pressure})
                </th>
                <th className="px-3 py-2 text-right font-semibold">
                  Temperature ({units.temperature})
                </th>
                {ok.map((r) => (
                  <th
                    key={r.property}
                    className="px-3 py-2 text-right font-semibold"
                  >
                    {PROPERTIES[r.property].phrase} ({r.unit})
                  </th>
                ))}
                <th className="px-3 py-2 text-left font-semibold">Warnings</th>
              </tr>
            </thead>
            <tbody>
              {conditions.map((c, i) => {
                const codes = new Set<string>();
                for (const r of ok)
                  for (const w of warningsOf(r.results[i]!)) codes.add(w);
                return (
                  <tr key={i} className="border-t border-line align-top">
                    <td className="px-3 py-1.5 text-right tabular-nums">
                      {c.pressure}
                    </td>
                    <td className="px-3 py-1.5 text-right tabular-nums">
                      {c.temperature}
                    </td>
                    {ok.map((r) => {
                      const x = r.results[i]!;
                      const serious = x.warnings.some((w) =>
                        SERIOUS_WARNINGS.has(w),
                      );
                      if (x.value === null || x.refused) {
                        return (
                          <td
                            key={r.property}
                            className="max-w-64 px-3 py-1.5 text-right"
                            data-testid={`value-${r.property}-${i}`}
                            data-refused={x.refused?.code ?? "no-value"}
                          >
                            <span className="font-semibold text-danger">
                              refused
                            </span>
                            <div className="text-xs text-danger">
                              {x.refused?.message ??
                                "The server gave no value for this point."}
                            </div>
                          </td>
                        );
                      }
                      return (
                        <td
                          key={r.property}
                          className="px-3 py-1.5 text-right tabular-nums"
                        >
                          <button
                            type="button"
                            onClick={() => onExplain(i, r.property)}
                            className={`rounded px-1 font-semibold underline decoration-dotted underline-offset-2 hover:bg-accent-soft ${serious ? "text-caution" : ""}`}
                            aria-label={`How ${PROPERTIES[r.property].phrase} ${formatPlain(x.value)} at ${c.pressure} ${units.pressure}, ${c.temperature} ${units.temperature} was obtained`}
                            data-testid={`value-${r.property}-${i}`}
                            data-value={x.value}
                          >
                            {formatPlain(x.value)}
                          </button>
                          <div className="text-xs text-ink-muted">
                            {x.errorEstimate === null
                              ? "± not available"
                              : `± ${formatPlain(x.errorEstimate)}`}{" "}
                            · {x.method}
                            {x.branch ? ` · ${x.branch}` : ""}
                          </div>
                        </td>
                      );
                    })}
                    <td className="px-3 py-1.5 text-xs">
                      {[...codes].map((code) => (
                        <span
                          key={code}
                          title={describe(code)}
                          className={`mr-1 mb-1 inline-block rounded px-1.5 py-0.5 ${SERIOUS_WARNINGS.has(code) ? "bg-caution-soft text-caution" : "bg-surface text-ink-muted"}`}
                        >
                          {warningLabel(code)}
                        </span>
                      ))}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
      <p className="mt-2 text-xs text-ink-muted">
        Select a value to see how it was obtained. Hover a warning for its
        explanation.
      </p>
    </section>
  );
}
