import { formatChange, formatMeasured } from "~/core/format";
import { PROPERTIES } from "~/core/units";
import type { DiffRow, DisplayRevisionDiff } from "./types";

/** Tables longer than this start folded, behind the summary by property. */
const OPEN_LIMIT = 60;

function propertyName(property: DiffRow["property"]): string {
  return property === "bubble_point"
    ? "Bubble point"
    : `${PROPERTIES[property].name} (${PROPERTIES[property].symbol})`;
}

function unitText(unit: string) {
  return unit === "–" || unit === "-" || unit === "" ? "" : unit;
}

/** How many cells changed, were added and removed, per property (shown when the diff spans several). */
export function DiffByPropertyTable({
  byProperty,
}: {
  byProperty: DisplayRevisionDiff["byProperty"];
}) {
  return (
    <div className="relative mt-3 inline-block overflow-x-auto rounded-lg border border-line bg-panel">
      <table className="text-sm" data-testid="diff-summary">
        <caption className="sr-only">Differences by property</caption>
        <thead className="bg-surface text-left text-ink-muted">
          <tr>
            <th scope="col" className="px-3 py-1.5 font-semibold">
              Property
            </th>
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">
              Changed
            </th>
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">
              Added
            </th>
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">
              Removed
            </th>
          </tr>
        </thead>
        <tbody>
          {byProperty.map((p) => (
            <tr key={p.property} className="border-t border-line">
              <th scope="row" className="px-3 py-1 text-left font-normal">
                {propertyName(p.property)}
              </th>
              <td className="px-3 py-1 text-right tabular-nums">{p.changed}</td>
              <td className="px-3 py-1 text-right tabular-nums">{p.added}</td>
              <td className="px-3 py-1 text-right tabular-nums">{p.removed}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/**
 * The changed, added or removed cells of a diff: property, temperature, pressure, the value(s) with their unit
 * and, for changed cells, the change. Folded when long; says when only the first rows are listed.
 */
export function DiffCellTable({
  id,
  title,
  rows,
  total,
  kind,
  units,
}: {
  id: string;
  title: string;
  rows: DiffRow[];
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
          <div className="relative mt-2 overflow-x-auto rounded-lg border border-line bg-panel">
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
