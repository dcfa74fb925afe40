import {
  formatCompared,
  formatDifference,
  formatErrorEstimate,
} from "~/core/format";
import { describeWarningCode, isLookupWarning } from "~/core/lookup";
import { SERIOUS_WARNINGS, warningLabel } from "~/utils/warning-labels";
import type { CompareCell } from "./types";

/** A sample's value at one condition, with its error estimate and its warnings; "…" while it is looked up. */
export function ValueCell({
  cell,
  loading,
}: {
  cell: CompareCell | undefined;
  loading: boolean;
}) {
  if (!cell)
    return (
      <td className="px-3 py-2 text-right text-ink-muted">
        {loading ? "…" : "—"}
      </td>
    );
  if (cell.kind === "none") {
    return (
      <td
        className="px-3 py-2 text-right align-top text-ink-muted"
        title={`No value: ${cell.reason}`}
        data-testid="compare-refused"
      >
        —
        <span className="block text-xs whitespace-nowrap">
          {cell.code === "outside-measured-range"
            ? "outside the range"
            : "refused"}
        </span>
      </td>
    );
  }
  const flags = cell.warnings.filter((w) => w !== "degree-reduced");
  return (
    <td
      className="px-3 py-2 text-right align-top tabular-nums"
      data-testid="compare-value"
    >
      <span className="font-semibold">{formatCompared(cell.value)}</span>
      <span className="block text-xs whitespace-nowrap text-ink-muted">
        {cell.errorEstimate === null
          ? "± not available"
          : `± ${formatErrorEstimate(cell.errorEstimate)}`}
      </span>
      {cell.outsideRange || flags.length > 0 ? (
        <span className="mt-0.5 flex flex-wrap justify-end gap-1">
          {cell.outsideRange ? (
            <span
              className="rounded bg-caution-soft px-1.5 text-xs font-semibold text-caution"
              title="Outside the sample's measured pressure–temperature range: an extrapolation."
            >
              extrapolated
            </span>
          ) : null}
          {flags
            .filter((w) => !(w === "extrapolated" && cell.outsideRange))
            .map((w) => (
              <span
                key={w}
                className={`rounded px-1.5 text-xs ${SERIOUS_WARNINGS.has(w) ? "bg-caution-soft font-semibold text-caution" : "bg-surface text-ink-muted"}`}
                title={isLookupWarning(w) ? describeWarningCode(w) : w}
              >
                {w === "extrapolated"
                  ? "beyond the measured envelope"
                  : warningLabel(w)}
              </span>
            ))}
        </span>
      ) : null}
    </td>
  );
}

/**
 * A sample's relative difference from the reference sample, (sample − reference) / |reference|, highlighted and
 * marked ▲ beyond the threshold (%); "—" when either has no value or the reference is 0.
 */
export function DifferenceCell({
  reference,
  other,
  threshold,
  loading,
}: {
  reference: CompareCell | undefined;
  other: CompareCell | undefined;
  threshold: number | null;
  loading: boolean;
}) {
  if (!reference || !other)
    return (
      <td className="px-3 py-2 text-right text-ink-muted">
        {loading ? "…" : "—"}
      </td>
    );
  if (
    reference.kind !== "value" ||
    other.kind !== "value" ||
    reference.value === null ||
    other.value === null ||
    reference.value === 0
  )
    return <td className="px-3 py-2 text-right text-ink-muted">—</td>;
  const pct =
    ((other.value - reference.value) / Math.abs(reference.value)) * 100;
  const exceeds = threshold !== null && Math.abs(pct) > threshold;
  const flagged =
    reference.outsideRange ||
    other.outsideRange ||
    reference.warnings.includes("extrapolated") ||
    other.warnings.includes("extrapolated");
  return (
    <td
      className={`px-3 py-2 text-right align-top tabular-nums ${exceeds ? "bg-caution-soft font-bold text-caution" : ""}`}
      data-testid="compare-difference"
      data-exceeds={exceeds ? "true" : "false"}
      title={
        flagged ? "At least one of the two values is extrapolated." : undefined
      }
    >
      {exceeds ? (
        <span aria-hidden="true" className="mr-1">
          ▲
        </span>
      ) : null}
      {formatDifference(pct)}
      {exceeds ? (
        <span className="sr-only"> (beyond the threshold)</span>
      ) : null}
      {flagged ? (
        <span className="block text-xs font-normal text-caution">
          from an extrapolated value
        </span>
      ) : null}
    </td>
  );
}
