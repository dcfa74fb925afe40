import { Form, href, Link } from "react-router";
import {
  PROPERTIES,
  type PropertyKey,
  toOutputPressure,
  toOutputTemperature,
  toOutputValue,
  unitLabel,
} from "~/core/units";
import { requirePermission } from "~/.server/auth/guards";
import {
  getRevisionsForDiff,
  listRevisionsOfSample,
} from "~/.server/db/queries/revisions";
import { diffRevisions, type CellDiff } from "~/.server/samples/diff";
import { requireSample, revisionNumberFrom } from "~/.server/samples/params";
import { Button } from "~/components/form";
import { formatChange, formatMeasured, roundSignificant } from "~/core/format";
import { REVISION_STATUS_LABELS } from "~/components/samples/labels";
import type { Route } from "./+types/diff";

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `Changes · ${data?.sample.label ?? "Sample"} · Isopleth` },
];

/** Most rows listed per table; the counts are always complete. */
const ROW_LIMIT = 2000;
/** Tables longer than this start folded, behind the summary by property. */
const OPEN_LIMIT = 60;

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const sample = await requireSample(args.params);
  const system = user.unitSystem;
  const url = new URL(args.request.url);
  const revisions = await listRevisionsOfSample(sample.id);
  const approved = revisions.filter(
    (r) => r.status === "approved" || r.status === "superseded",
  );
  // Defaults: the latest revision against the approved one before it (or the one before it).
  const toDefault = revisions[0]?.number ?? null;
  const fromDefault =
    approved.find((r) => toDefault !== null && r.number < toDefault)?.number ??
    revisions[1]?.number ??
    toDefault;
  const from = revisionNumberFrom(url.searchParams.get("from")) ?? fromDefault;
  const to = revisionNumberFrom(url.searchParams.get("to")) ?? toDefault;

  let result:
    null | { missing: number[] } | { diff: ReturnType<typeof present> } = null;
  if (from !== null && to !== null) {
    const pair = await getRevisionsForDiff(sample.id, from, to);
    const missing = [pair.from ? null : from, pair.to ? null : to].filter(
      (n): n is number => n !== null,
    );
    result =
      missing.length > 0 || !pair.from || !pair.to
        ? { missing }
        : { diff: present(diffRevisions(pair.from, pair.to)) };
  }

  function present(diff: ReturnType<typeof diffRevisions>) {
    const p = (v: number | null) =>
      v === null ? null : roundSignificant(toOutputPressure(v, system), 10);
    const value = (c: CellDiff, v: number | null) =>
      v === null
        ? null
        : roundSignificant(
            c.property === "bubble_point"
              ? toOutputPressure(v, system)
              : toOutputValue(v, c.property, system),
            10,
          );
    const row = (c: CellDiff) => ({
      property: c.property,
      unit:
        c.property === "bubble_point"
          ? unitLabel(system, "pressure")
          : unitLabel(system, c.property),
      pressure: p(c.pressurePsia),
      temperature: roundSignificant(
        toOutputTemperature(c.temperatureF, system),
        10,
      ),
      from: value(c, c.from),
      to: value(c, c.to),
    });
    const byProperty = new Map<
      string,
      { changed: number; added: number; removed: number }
    >();
    for (const kind of ["changed", "added", "removed"] as const) {
      for (const c of diff[kind]) {
        const entry = byProperty.get(c.property) ?? {
          changed: 0,
          added: 0,
          removed: 0,
        };
        entry[kind]++;
        byProperty.set(c.property, entry);
      }
    }
    return {
      byProperty: [...byProperty.entries()].map(([property, counts]) => ({
        property: property as Row["property"],
        ...counts,
      })),
      counts: {
        changed: diff.changed.length,
        added: diff.added.length,
        removed: diff.removed.length,
        unchanged: diff.unchanged,
      },
      changed: diff.changed.slice(0, ROW_LIMIT).map(row),
      added: diff.added.slice(0, ROW_LIMIT).map(row),
      removed: diff.removed.slice(0, ROW_LIMIT).map(row),
    };
  }

  return {
    sample: { id: sample.id, label: sample.label },
    revisions: revisions.map((r) => ({ number: r.number, status: r.status })),
    from,
    to,
    units: {
      pressure: unitLabel(system, "pressure"),
      temperature: unitLabel(system, "temperature"),
    },
    result,
  };
}

type Row = {
  property: PropertyKey | "bubble_point";
  unit: string;
  pressure: number | null;
  temperature: number;
  from: number | null;
  to: number | null;
};

function propertyName(property: Row["property"]): string {
  return property === "bubble_point"
    ? "Bubble point"
    : `${PROPERTIES[property].name} (${PROPERTIES[property].symbol})`;
}

function unitText(unit: string) {
  return unit === "–" || unit === "-" || unit === "" ? "" : unit;
}

function CellTable({
  id,
  title,
  rows,
  total,
  kind,
  units,
}: {
  id: string;
  title: string;
  rows: Row[];
  total: number;
  kind: "changed" | "added" | "removed";
  units: { pressure: string; temperature: string };
}) {
  return (
    <section aria-labelledby={id} className="mt-6">
      <h2 id={id} className="text-lg font-semibold">
        {title}{" "}
        <span className="text-base font-normal text-ink-muted">({total})</span>
      </h2>
      {rows.length === 0 ? (
        <p className="mt-1 text-sm text-ink-muted">None.</p>
      ) : (
        <details open={total <= OPEN_LIMIT} className="mt-2">
          <summary className="cursor-pointer text-sm text-accent">
            {total <= OPEN_LIMIT ? "Cells" : `Show all ${total} cells`}
          </summary>
          <div className="mt-2 overflow-x-auto rounded-lg border border-line bg-panel">
            <table className="w-full text-sm" data-testid={`diff-${kind}`}>
              <thead className="bg-surface text-left text-ink-muted">
                <tr>
                  <th scope="col" className="px-3 py-2 font-semibold">
                    Property
                  </th>
                  <th
                    scope="col"
                    className="px-3 py-2 text-right font-semibold"
                  >
                    Temperature ({units.temperature})
                  </th>
                  <th
                    scope="col"
                    className="px-3 py-2 text-right font-semibold"
                  >
                    Pressure ({units.pressure})
                  </th>
                  {kind !== "added" ? (
                    <th
                      scope="col"
                      className="px-3 py-2 text-right font-semibold"
                    >
                      {kind === "changed" ? "Before" : "Value"}
                    </th>
                  ) : null}
                  {kind !== "removed" ? (
                    <th
                      scope="col"
                      className="px-3 py-2 text-right font-semibold"
                    >
                      {kind === "changed" ? "After" : "Value"}
                    </th>
                  ) : null}
                  <th scope="col" className="px-3 py-2 font-semibold">
                    Unit
                  </th>
                  {kind === "changed" ? (
                    <th
                      scope="col"
                      className="px-3 py-2 text-right font-semibold"
                    >
                      Change
                    </th>
                  ) : null}
                </tr>
              </thead>
              <tbody>
                {rows.map((r, k) => (
                  <tr key={k} className="border-t border-line">
                    <td className="px-3 py-1.5">{propertyName(r.property)}</td>
                    <td className="px-3 py-1.5 text-right tabular-nums">
                      {formatMeasured(r.temperature)}
                    </td>
                    <td className="px-3 py-1.5 text-right tabular-nums">
                      {r.pressure === null ? "—" : formatMeasured(r.pressure)}
                    </td>
                    {kind !== "added" ? (
                      <td className="px-3 py-1.5 text-right tabular-nums">
                        {formatMeasured(r.from)}
                      </td>
                    ) : null}
                    {kind !== "removed" ? (
                      <td className="px-3 py-1.5 text-right tabular-nums">
                        {formatMeasured(r.to)}
                      </td>
                    ) : null}
                    <td className="px-3 py-1.5 text-ink-muted">
                      {unitText(r.unit)}
                    </td>
                    {kind === "changed" ? (
                      <td className="px-3 py-1.5 text-right tabular-nums">
                        {formatChange(r.from, r.to)}
                      </td>
                    ) : null}
                  </tr>
                ))}
              </tbody>
            </table>
            {total > rows.length ? (
              <p className="px-3 py-2 text-xs text-ink-muted">
                The first {rows.length} of {total} are listed.
              </p>
            ) : null}
          </div>
        </details>
      )}
    </section>
  );
}

export default function DiffPage({ loaderData }: Route.ComponentProps) {
  const { sample, revisions, from, to, result, units } = loaderData;
  const sampleUrl = href("/samples/:sampleId", { sampleId: String(sample.id) });
  const option = (r: { number: number; status: string }) => (
    <option key={r.number} value={r.number}>
      Revision {r.number} (
      {REVISION_STATUS_LABELS[r.status]?.toLowerCase() ?? r.status})
    </option>
  );
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link to={href("/samples")} className="hover:underline">
          Samples
        </Link>{" "}
        ›{" "}
        <Link to={sampleUrl} className="hover:underline">
          {sample.label}
        </Link>{" "}
        › Changes
      </nav>
      <h1 className="text-2xl font-bold tracking-tight">
        {from !== null && to !== null
          ? `Changes from revision ${from} to revision ${to}`
          : "Compare revisions"}
      </h1>
      <p className="mt-1 max-w-3xl text-ink-muted">
        Measured cells of {sample.label} compared one by one: a cell is a
        property at one pressure and one temperature. Values in your unit
        system.
      </p>
      {revisions.length === 0 ? (
        <p className="mt-4 text-sm text-ink-muted">
          This sample has no revisions yet.
        </p>
      ) : (
        <Form
          method="get"
          className="mt-4 flex flex-wrap items-end gap-3 rounded-lg border border-line bg-panel p-4 text-sm"
        >
          <label className="flex flex-col gap-1">
            <span className="font-semibold">From</span>
            <select
              name="from"
              defaultValue={from ?? undefined}
              className="rounded border border-line px-2 py-1.5"
            >
              {revisions.map(option)}
            </select>
          </label>
          <label className="flex flex-col gap-1">
            <span className="font-semibold">To</span>
            <select
              name="to"
              defaultValue={to ?? undefined}
              className="rounded border border-line px-2 py-1.5"
            >
              {revisions.map(option)}
            </select>
          </label>
          <Button type="submit">Compare</Button>
        </Form>
      )}
      {result && "missing" in result ? (
        <p
          role="alert"
          className="mt-4 rounded border border-danger/40 bg-red-50 px-3 py-2 text-sm text-danger"
        >
          {sample.label} has no revision {result.missing.join(" or ")}. Choose
          revisions from the lists.
        </p>
      ) : null}
      {result && "diff" in result ? (
        <>
          <p className="mt-4 text-sm" aria-live="polite">
            {result.diff.counts.changed} changed, {result.diff.counts.added}{" "}
            added, {result.diff.counts.removed} removed,{" "}
            {result.diff.counts.unchanged} unchanged.
            {from === to ? " (The same revision on both sides.)" : ""}
          </p>
          {result.diff.byProperty.length > 1 ? (
            <div className="mt-3 inline-block overflow-x-auto rounded-lg border border-line bg-panel">
              <table className="text-sm" data-testid="diff-summary">
                <caption className="sr-only">Differences by property</caption>
                <thead className="bg-surface text-left text-ink-muted">
                  <tr>
                    <th scope="col" className="px-3 py-1.5 font-semibold">
                      Property
                    </th>
                    <th
                      scope="col"
                      className="px-3 py-1.5 text-right font-semibold"
                    >
                      Changed
                    </th>
                    <th
                      scope="col"
                      className="px-3 py-1.5 text-right font-semibold"
                    >
                      Added
                    </th>
                    <th
                      scope="col"
                      className="px-3 py-1.5 text-right font-semibold"
                    >
                      Removed
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {result.diff.byProperty.map((p) => (
                    <tr key={p.property} className="border-t border-line">
                      <th
                        scope="row"
                        className="px-3 py-1 text-left font-normal"
                      >
                        {propertyName(p.property)}
                      </th>
                      <td className="px-3 py-1 text-right tabular-nums">
                        {p.changed}
                      </td>
                      <td className="px-3 py-1 text-right tabular-nums">
                        {p.added}
                      </td>
                      <td className="px-3 py-1 text-right tabular-nums">
                        {p.removed}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
          <CellTable
            id="changed"
            title="Changed cells"
            rows={result.diff.changed}
            total={result.diff.counts.changed}
            kind="changed"
            units={units}
          />
          <CellTable
            id="added"
            title={`Added in revision ${to}`}
            rows={result.diff.added}
            total={result.diff.counts.added}
            kind="added"
            units={units}
          />
          <CellTable
            id="removed"
            title={`Removed since revision ${from}`}
            rows={result.diff.removed}
            total={result.diff.counts.removed}
            kind="removed"
            units={units}
          />
        </>
      ) : null}
    </>
  );
}
