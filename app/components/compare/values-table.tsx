import { formatPlain } from "~/core/format";
import type { Condition } from "~/utils/conditions";
import type {
  CompareLookups,
  ComparedSample,
  CompareSelection,
  CompareUnits,
} from "./types";
import { DifferenceCell, ValueCell } from "./value-cells";

/**
 * The values table: one row per condition (Q1, Q2, …), each sample's value, and each other sample's relative
 * difference from the reference sample.
 */
export function ValuesTable({
  conditions,
  samples,
  reference,
  others,
  units,
  propertyName,
  lookups,
  threshold,
}: {
  conditions: Condition[];
  samples: ComparedSample[];
  reference: CompareSelection | undefined;
  others: CompareSelection[];
  units: CompareUnits;
  propertyName: string;
  lookups: CompareLookups;
  threshold: number | null;
}) {
  if (conditions.length === 0) {
    return (
      <p className="rounded border border-dashed border-line bg-panel px-4 py-6 text-sm text-ink-muted">
        Enter at least one pressure and temperature.
      </p>
    );
  }
  const cellOf = (id: number, k: number) => lookups.cells[id]?.[k];
  const loading = lookups.status === "loading";
  return (
    <div>
      <div className="relative w-fit max-w-full overflow-x-auto rounded-lg border border-line bg-panel">
        <table
          className="text-sm"
          aria-label={`${propertyName} by sample`}
          aria-busy={loading}
        >
          <thead className="bg-surface text-ink-muted">
            <tr className="text-xs">
              <td colSpan={3} />
              <th
                scope="colgroup"
                colSpan={samples.length}
                className="border-l border-line px-3 pt-2 text-center font-semibold"
              >
                {propertyName}
              </th>
              {reference && others.length > 0 ? (
                <th
                  scope="colgroup"
                  colSpan={others.length}
                  className="border-l border-line px-3 pt-2 text-center font-semibold"
                >
                  Difference
                </th>
              ) : null}
            </tr>
            <tr>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                Point
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Pressure ({units.pressure})
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Temperature ({units.temperature})
              </th>
              {samples.map((s) => (
                <th
                  key={s.id}
                  scope="col"
                  className="px-3 py-2 text-right font-semibold whitespace-nowrap"
                >
                  <span className="block text-ink">{s.label}</span>
                  <span className="block text-xs font-normal">
                    {units.value ? `${units.value} · ` : ""}rev.{" "}
                    {lookups.revision[s.id] ?? s.revision}
                  </span>
                </th>
              ))}
              {reference
                ? others.map((s) => (
                    <th
                      key={`d${s.id}`}
                      scope="col"
                      className="px-3 py-2 text-right font-semibold whitespace-nowrap"
                    >
                      <span className="block text-ink">{s.label}</span>
                      <span className="block text-xs font-normal">
                        vs {reference.label}, %
                      </span>
                    </th>
                  ))
                : null}
            </tr>
          </thead>
          <tbody>
            {conditions.map((c, k) => {
              const ref = reference ? cellOf(reference.id, k) : undefined;
              return (
                <tr key={k} className="border-t border-line">
                  <th scope="row" className="px-3 py-2 text-left font-semibold">
                    Q{k + 1}
                  </th>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {formatPlain(c.pressure)}
                  </td>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {formatPlain(c.temperature)}
                  </td>
                  {samples.map((s) => (
                    <ValueCell
                      key={s.id}
                      cell={cellOf(s.id, k)}
                      loading={loading}
                    />
                  ))}
                  {reference
                    ? others.map((s) => (
                        <DifferenceCell
                          key={`d${s.id}`}
                          reference={ref}
                          other={cellOf(s.id, k)}
                          threshold={threshold}
                          loading={loading}
                        />
                      ))
                    : null}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {lookups.status === "error" ? (
        <p role="alert" className="mt-2 text-sm text-danger">
          The values could not be looked up: {lookups.error}
        </p>
      ) : null}
      <p className="mt-2 text-xs text-ink-muted">
        Values from the lookup service with the automatic method (Newton, cubic
        in each direction, with the shape-preserving pchip value where Newton
        overshoots); ± is the estimated interpolation error. Differences are
        (sample − reference) / reference.
        {threshold !== null
          ? ` Differences beyond ${formatPlain(threshold)} % are highlighted and marked ▲.`
          : " Enter a threshold of 0 % or more to highlight differences."}
      </p>
    </div>
  );
}
