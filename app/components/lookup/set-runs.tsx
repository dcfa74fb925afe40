import type { ReactNode } from "react";
import { Form } from "react-router";
import {
  formatDecimals,
  formatErrorEstimate,
  formatPlain,
} from "~/core/format";
import type { OutputSystem, PropertyKey } from "~/core/units";
import { SERIOUS_WARNINGS, warningLabel } from "~/utils/warning-labels";

/*
 * The runs of a saved lookup set: the list of runs, one run's table (per value its flags, error estimate and
 * method, refused points with their reason) and the comparison of any two runs. The shapes are built by the
 * set service (app/.server/lookup/sets.ts).
 */

export type SetSettingsView = {
  method: string;
  degree: [number, number] | null;
  extrapolate: boolean;
  units: OutputSystem;
  /** In words: "auto (…) · extrapolation off · field units". */
  text: string;
};

export type SetRunSummary = {
  id: number;
  /** "2026-01-02 03:04:05 UTC". */
  createdAt: string;
  revisionNumber: number;
  settings: SetSettingsView;
  refused: number;
  flagged: number;
};

export type SetRunView = SetRunSummary & {
  pressureUnit: string;
  temperatureUnit: string;
  properties: { property: PropertyKey; name: string; unit: string }[];
  rows: {
    pressure: number;
    temperature: number;
    cells: {
      property: PropertyKey;
      value: number | null;
      errorEstimate: number | null;
      method: string | null;
      warnings: string[];
      /** Why there is no value, or null. */
      refused: string | null;
    }[];
  }[];
};

export type SetRunCompareView = {
  a: SetRunSummary;
  b: SetRunSummary;
  sameUnits: boolean;
  pressureUnit: string;
  temperatureUnit: string;
  properties: {
    property: PropertyKey;
    name: string;
    unitA: string;
    unitB: string;
  }[];
  rows: {
    pressure: number;
    temperature: number;
    cells: {
      property: PropertyKey;
      a: number | null;
      b: number | null;
      /** b − a, in the unit of both (null when the runs' units differ or a value is missing). */
      difference: number | null;
      relativePercent: number | null;
      /** The change exceeds the two error estimates together (null: not known). */
      beyondEstimates: boolean | null;
      aNote: string | null;
      bNote: string | null;
    }[];
  }[];
  changedCount: number;
};

const TH = "px-3 py-2 text-right font-semibold";
const TD = "px-3 py-1 text-right align-top";

/** A run's or a comparison's table: one row per condition, the pressure and temperature first. */
function ConditionsTable({
  testId,
  pressureUnit,
  temperatureUnit,
  headers,
  children,
}: {
  testId: string;
  pressureUnit: string;
  temperatureUnit: string;
  headers: ReactNode;
  /** The table's rows. */
  children: ReactNode;
}) {
  return (
    <div className="relative mt-2 max-h-[32rem] overflow-auto rounded-lg border border-line bg-panel">
      <table className="w-full text-sm tabular-nums" data-testid={testId}>
        <thead className="sticky top-0 bg-surface text-ink-muted">
          <tr>
            <th className={TH}>Pressure ({pressureUnit})</th>
            <th className={TH}>Temperature ({temperatureUnit})</th>
            {headers}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}

function unitText(unit: string): string {
  return unit === "–" || unit === "-" || unit === "" ? "" : ` (${unit})`;
}

/** The set's runs, newest first, each with its settings and a link to show it. */
export function RunList({
  runs,
  shownId,
  hrefOf,
}: {
  runs: SetRunSummary[];
  shownId: number | null;
  hrefOf: (id: number) => string;
}) {
  if (runs.length === 0)
    return <p className="mt-2 text-sm text-ink-muted">Not run yet.</p>;
  return (
    <ul className="mt-2 text-sm" data-testid="set-runs">
      {runs.map((r) => (
        <li key={r.id} className="tabular-nums">
          <a
            href={hrefOf(r.id)}
            className={r.id === shownId ? "font-semibold" : "text-accent"}
            aria-current={r.id === shownId ? "true" : undefined}
          >
            {r.createdAt}
          </a>{" "}
          — revision {r.revisionNumber}, method {r.settings.method} ·{" "}
          {r.settings.text}
          {r.refused ? ` · ${r.refused} refused` : ""}
          {r.flagged ? ` · ${r.flagged} flagged` : ""}
        </li>
      ))}
    </ul>
  );
}

/** One run: per condition and property the value with its estimate, method and flags, or why it was refused. */
export function SetRunTable({
  run,
  exportHref,
}: {
  run: SetRunView;
  exportHref: (format: "csv" | "xlsx") => string;
}) {
  return (
    <section className="mt-6" aria-labelledby="run-title">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="run-title" className="font-semibold">
            Run of {run.createdAt} (revision {run.revisionNumber})
          </h2>
          <p className="text-sm text-ink-muted" data-testid="run-settings">
            {run.settings.text}
            {run.refused ? ` · ${run.refused} refused` : ""}
            {run.flagged ? ` · ${run.flagged} flagged` : ""}
          </p>
        </div>
        <div className="flex gap-2">
          {(["csv", "xlsx"] as const).map((f) => (
            <a
              key={f}
              href={exportHref(f)}
              download
              className="rounded border border-line bg-panel px-3 py-1.5 text-sm font-semibold hover:border-accent"
            >
              Export {f.toUpperCase()}
            </a>
          ))}
        </div>
      </div>
      <ConditionsTable
        testId="set-run-table"
        pressureUnit={run.pressureUnit}
        temperatureUnit={run.temperatureUnit}
        headers={run.properties.map((p) => (
          <th key={p.property} className={TH}>
            {p.name}
            {unitText(p.unit)}
          </th>
        ))}
      >
        {run.rows.map((row, i) => (
          <tr key={i} className="border-t border-line">
            <td className={TD}>{formatPlain(row.pressure)}</td>
            <td className={TD}>{formatPlain(row.temperature)}</td>
            {row.cells.map((c) => (
              <td
                key={c.property}
                className={TD}
                data-testid={`run-${c.property}-${i}`}
              >
                {c.refused !== null || c.value === null ? (
                  <>
                    <span className="font-semibold text-danger">refused</span>
                    <div className="max-w-64 text-xs text-danger">
                      {c.refused}
                    </div>
                  </>
                ) : (
                  <>
                    <span
                      className={
                        c.warnings.some((w) => SERIOUS_WARNINGS.has(w))
                          ? "font-semibold text-caution"
                          : "font-semibold"
                      }
                    >
                      {formatPlain(c.value)}
                    </span>
                    <div className="text-xs text-ink-muted">
                      ±{" "}
                      {c.errorEstimate === null
                        ? "not known"
                        : formatErrorEstimate(c.errorEstimate)}
                      {c.method ? ` · ${c.method}` : ""}
                    </div>
                    {c.warnings.length > 0 ? (
                      <div className="text-xs">
                        {c.warnings.map((w) => (
                          <span
                            key={w}
                            className={`mr-1 inline-block rounded px-1.5 py-0.5 ${SERIOUS_WARNINGS.has(w) ? "bg-caution-soft text-caution" : "bg-surface text-ink-muted"}`}
                          >
                            {warningLabel(w)}
                          </span>
                        ))}
                      </div>
                    ) : null}
                  </>
                )}
              </td>
            ))}
          </tr>
        ))}
      </ConditionsTable>
    </section>
  );
}

/** Choose two runs to compare (a plain GET form: the choice is in the URL). */
export function ComparePicker({
  runs,
  a,
  b,
}: {
  runs: SetRunSummary[];
  a: number | null;
  b: number | null;
}) {
  if (runs.length < 2) return null;
  const option = (r: SetRunSummary) => (
    <option key={r.id} value={r.id}>
      {r.createdAt} · revision {r.revisionNumber} · {r.settings.method}
    </option>
  );
  return (
    <Form method="get" className="mt-4 flex flex-wrap items-end gap-3 text-sm">
      <label className="flex flex-col gap-1">
        Compare run
        <select
          name="a"
          defaultValue={a ?? undefined}
          className="rounded border border-line bg-panel px-2 py-1"
        >
          {runs.map(option)}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        with run
        <select
          name="b"
          defaultValue={b ?? undefined}
          className="rounded border border-line bg-panel px-2 py-1"
        >
          {runs.map(option)}
        </select>
      </label>
      <button
        type="submit"
        className="rounded border border-line bg-panel px-3 py-1.5 font-semibold hover:border-accent"
      >
        Compare
      </button>
    </Form>
  );
}

/** Two runs side by side: per condition and property both values, the change and its share. */
export function SetRunCompare({ compare }: { compare: SetRunCompareView }) {
  const { a, b } = compare;
  return (
    <section className="mt-6" aria-labelledby="compare-title">
      <h2 id="compare-title" className="font-semibold">
        What changed: run of {a.createdAt} (revision {a.revisionNumber}) → run
        of {b.createdAt} (revision {b.revisionNumber})
      </h2>
      <p className="text-sm text-ink-muted" data-testid="compare-summary">
        {compare.changedCount} value{compare.changedCount === 1 ? "" : "s"}{" "}
        changed.{" "}
        {a.settings.text === b.settings.text
          ? `Same settings: ${a.settings.text}.`
          : `Settings: ${a.settings.text} → ${b.settings.text}.`}
        {compare.sameUnits
          ? ""
          : " The runs are in different units: the change is given as a share only."}
      </p>
      <ConditionsTable
        testId="set-compare-table"
        pressureUnit={compare.pressureUnit}
        temperatureUnit={compare.temperatureUnit}
        headers={compare.properties.map((p) => (
          <th key={p.property} className={TH}>
            {p.name}
            {unitText(p.unitB)}
            <div className="text-xs font-normal">before → after</div>
          </th>
        ))}
      >
        {compare.rows.map((row, i) => (
          <tr key={i} className="border-t border-line">
            <td className={TD}>{formatPlain(row.pressure)}</td>
            <td className={TD}>{formatPlain(row.temperature)}</td>
            {row.cells.map((c) => (
              <td
                key={c.property}
                className={TD}
                data-testid={`compare-${c.property}-${i}`}
              >
                {c.a === null ? (c.aNote ? "refused" : "—") : formatPlain(c.a)}{" "}
                →{" "}
                {c.b === null ? (c.bNote ? "refused" : "—") : formatPlain(c.b)}
                {c.relativePercent !== null ? (
                  <div
                    className={`text-xs ${c.beyondEstimates || Math.abs(c.relativePercent) > 1 ? "text-caution" : "text-ink-muted"}`}
                  >
                    {c.difference !== null
                      ? `${c.difference >= 0 ? "+" : ""}${formatPlain(c.difference)} · `
                      : ""}
                    {c.relativePercent >= 0 ? "+" : ""}
                    {formatDecimals(c.relativePercent, 2)} %
                    {c.beyondEstimates ? " · beyond the estimates" : ""}
                  </div>
                ) : null}
                {c.aNote || c.bNote ? (
                  <div className="max-w-64 text-xs text-danger">
                    {[
                      c.aNote && `before: ${c.aNote}`,
                      c.bNote && `after: ${c.bNote}`,
                    ]
                      .filter(Boolean)
                      .join(" ")}
                  </div>
                ) : null}
              </td>
            ))}
          </tr>
        ))}
      </ConditionsTable>
    </section>
  );
}
