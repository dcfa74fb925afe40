import { QC_STATUS_LABELS, SEVERITY_LABELS } from "./labels";
import type { DisplayFinding, QcSummary, Severity } from "./types";

/* QC findings as a numbered list (the numbers match the markers in the grid tables), and a status badge. */

const BADGE: Record<Severity, string> = {
  error: "border-danger/40 bg-red-50 text-danger",
  warning: "border-caution/40 bg-caution-soft text-caution",
  info: "border-accent/30 bg-accent-soft text-accent-strong",
};

function SeverityBadge({ severity }: { severity: Severity }) {
  return (
    <span
      className={`inline-block rounded border px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap ${BADGE[severity]}`}
    >
      {SEVERITY_LABELS[severity]}
    </span>
  );
}

const STATUS_STYLE: Record<QcSummary["status"], string> = {
  pass: "border-accent/30 bg-accent-soft text-accent-strong",
  warn: "border-caution/40 bg-caution-soft text-caution",
  fail: "border-danger/40 bg-red-50 text-danger",
};

export function QcStatusBadge({
  status,
  label,
}: {
  status: QcSummary["status"] | null;
  label?: string;
}) {
  if (!status) return <span className="text-ink-muted">not recorded</span>;
  return (
    <span
      className={`inline-block rounded border px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap ${STATUS_STYLE[status]}`}
    >
      {label ?? `QC: ${QC_STATUS_LABELS[status]}`}
    </span>
  );
}

export function QcSummaryLine({ summary }: { summary: QcSummary }) {
  const parts = [
    `${summary.errors} ${summary.errors === 1 ? "error" : "errors"}`,
    `${summary.warnings} ${summary.warnings === 1 ? "warning" : "warnings"}`,
    `${summary.notes} ${summary.notes === 1 ? "note" : "notes"}`,
  ];
  return (
    <p className="flex flex-wrap items-center gap-2 text-sm">
      <QcStatusBadge status={summary.status} />
      <span className="text-ink-muted">{parts.join(", ")}</span>
    </p>
  );
}

function Place({ f }: { f: DisplayFinding }) {
  const l = f.location;
  if (!l) return null;
  const parts: [string, string][] = [["File", l.file]];
  if (l.sheet !== undefined) parts.push(["Sheet", l.sheet]);
  if (l.row !== undefined) parts.push(["Row", String(l.row)]);
  if (l.columnLetter !== undefined) parts.push(["Column", l.columnLetter]);
  if (l.value !== undefined) parts.push(["Value", JSON.stringify(l.value)]);
  return (
    <dl className="mt-1 flex flex-wrap gap-x-4 gap-y-0.5 text-xs text-ink-muted">
      {parts.map(([k, v]) => (
        <div key={k} className="flex gap-1">
          <dt className="font-semibold">{k}</dt>
          <dd className="font-mono">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

export function FindingList({
  findings,
  title,
  empty,
}: {
  findings: DisplayFinding[];
  title?: string;
  empty?: string;
}) {
  if (findings.length === 0)
    return empty ? <p className="text-sm text-ink-muted">{empty}</p> : null;
  return (
    <section aria-label={title ?? "Findings"}>
      {title ? <h3 className="mb-2 font-semibold">{title}</h3> : null}
      <ol
        className="divide-y divide-line rounded-lg border border-line bg-panel"
        data-testid="findings"
      >
        {findings.map((f) => (
          <li
            key={f.n}
            id={`finding-${f.n}`}
            className="flex gap-3 px-4 py-3 text-sm target:bg-accent-soft"
            data-severity={f.severity}
          >
            <span className="w-6 shrink-0 pt-0.5 text-right font-semibold text-ink-muted tabular-nums">
              {f.n}.
            </span>
            <div className="min-w-0 flex-1">
              <div className="flex flex-wrap items-start gap-2">
                <SeverityBadge severity={f.severity} />
                <p className="min-w-0 flex-1">{f.message}</p>
              </div>
              <Place f={f} />
              {f.cells.length > 0 ? (
                <p className="mt-1 text-xs text-ink-muted">
                  <span className="font-semibold">Cells: </span>
                  {f.cells.slice(0, 8).join("; ")}
                  {f.cells.length > 8 ? `; and ${f.cells.length - 8} more` : ""}
                </p>
              ) : null}
              {f.ruleTitle || f.source ? (
                <details className="mt-1 text-xs text-ink-muted">
                  <summary className="cursor-pointer">
                    Rule{f.ruleTitle ? `: ${f.ruleTitle}` : ""}
                  </summary>
                  {f.source ? <p className="mt-1">Basis: {f.source}</p> : null}
                </details>
              ) : null}
            </div>
          </li>
        ))}
      </ol>
    </section>
  );
}
