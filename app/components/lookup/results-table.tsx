import { useState } from "react";
import { describeWarningCode, type LookupWarning } from "~/core/lookup";
import { PROPERTIES, type PropertyKey } from "~/core/units";
import type { LookupResult } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";
import {
  answeredRuns,
  failedRuns,
  type AnsweredRun,
  type PropertyRun,
} from "./property-run";
import { lookupResultsDelimited } from "./results-csv";
import {
  NEAR_BUBBLE_POINT,
  NEAR_BUBBLE_POINT_FRACTION,
  SERIOUS_WARNINGS,
  warningLabel,
} from "~/utils/warning-labels";
import { formatMilliseconds, formatPlain } from "~/core/format";

const CAUTION =
  "Interpolated and extrapolated properties are estimates. Check them against the laboratory report, and follow local regulations and licensed engineering practice for well control, facility design and reserves.";

/** Warnings of one result, plus "near the bubble point" when the point lies within 2 % of it. */
function warningsOf(r: LookupResult, pressure: number): string[] {
  const list = [...r.warnings];
  if (
    r.bubblePointPressure !== undefined &&
    Math.abs(pressure - r.bubblePointPressure) <=
      NEAR_BUBBLE_POINT_FRACTION * r.bubblePointPressure
  ) {
    list.push(NEAR_BUBBLE_POINT);
  }
  return list;
}

function describe(code: string): string {
  if (code === NEAR_BUBBLE_POINT)
    return "Within 2 % of the bubble point, where the property's slope changes abruptly: check the branch.";
  return describeWarningCode(code as LookupWarning);
}

/** The export's line naming the bases of its numbers. */
function basesLine(bases: AnsweredRun["bases"]): string {
  const rebased =
    bases.reportStandardConditions === bases.standardConditions
      ? ""
      : ` (rebased from the report's ${bases.reportStandardConditions})`;
  const pressures =
    bases.pressureBasis === "gauge"
      ? `gauge pressures: absolute = gauge + ${formatPlain(bases.barometricPressurePsia)} psia (the sample's barometric pressure)`
      : "absolute pressures";
  return `gas volumes (Rs, Bg) at ${bases.standardConditions}${rebased}; ${pressures}`;
}

export function LookupResultsTable({
  conditions,
  runs,
  units,
  method,
  sampleLabel,
  onExplain,
  elapsedMs,
}: {
  conditions: Condition[];
  runs: PropertyRun[];
  units: { pressure: string; temperature: string };
  method: string;
  sampleLabel: string;
  onExplain: (conditionIndex: number, property: PropertyKey) => void;
  elapsedMs: number;
}) {
  const [copied, setCopied] = useState(false);
  const ok = answeredRuns(runs);
  const failed = failedRuns(runs);
  const revisions = [...new Set(ok.map((r) => r.revision))];
  const meta = [
    `Isopleth lookup — sample ${sampleLabel}, revision ${revisions.join(", ")}, method ${ok[0]?.methodDescription ?? method}`,
    `generated ${new Date().toISOString()}`,
    ...(ok[0] ? [basesLine(ok[0].bases)] : []),
    CAUTION,
  ];
  const serverMs = ok.reduce(
    (m, r) => Math.max(m, Number.isFinite(r.serverMs) ? r.serverMs : 0),
    0,
  );
  const flagged = ok.reduce(
    (n, r) =>
      n +
      r.results.filter(
        (x, i) => warningsOf(x, conditions[i]!.pressure).length > 0,
      ).length,
    0,
  );

  function download() {
    const blob = new Blob(
      [lookupResultsDelimited(conditions, runs, units, ",", meta, warningsOf)],
      { type: "text/csv" },
    );
    const url = URL.createObjectURL(blob);
    const a = Object.assign(document.createElement("a"), {
      href: url,
      download: `isopleth-lookup-${sampleLabel.replace(/\W+/g, "-")}.csv`,
    });
    a.click();
    URL.revokeObjectURL(url);
  }
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
          </p>
        </div>
        <div className="flex gap-2">
          <button
            type="button"
            onClick={download}
            className="rounded border border-line bg-panel px-3 py-1.5 text-sm font-semibold hover:border-accent"
          >
            Export CSV
          </button>
          <button
            type="button"
            onClick={() => void copy()}
            className="rounded border border-line bg-panel px-3 py-1.5 text-sm font-semibold hover:border-accent"
          >
            {copied ? "Copied" : "Copy to clipboard"}
          </button>
        </div>
      </div>
      {failed.map((f) => (
        <p
          key={f.property}
          role="alert"
          className="mt-2 rounded border border-danger/40 bg-red-50 px-3 py-2 text-sm text-danger"
        >
          {PROPERTIES[f.property].phrase}: {f.error}
        </p>
      ))}
      {ok.length > 0 ? (
        <div className="mt-3 max-h-[32rem] overflow-auto rounded-lg border border-line bg-panel">
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
                  for (const w of warningsOf(r.results[i]!, c.pressure))
                    codes.add(w);
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
                      if (x.value === null || x.errorEstimate === null) {
                        return (
                          <td
                            key={r.property}
                            className="max-w-64 px-3 py-1.5 text-right"
                            data-testid={`value-${r.property}-${i}`}
                          >
                            <span className="font-semibold text-danger">
                              not computed
                            </span>
                            <div className="text-xs text-danger">
                              {x.refusal?.message ??
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
                            ± {formatPlain(x.errorEstimate)} · {x.method}
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
