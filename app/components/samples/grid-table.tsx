import { formatMeasured } from "~/core/format";
import { PROPERTIES } from "~/core/units";
import { SEVERITY_LABELS } from "./labels";
import type {
  CellMark,
  DisplayBubblePoints,
  DisplayGrid,
  Severity,
} from "./types";

/*
 * A measured grid as a table: pressures down, temperatures across, the value unit in the header, numbers
 * right-aligned in tabular figures. Cells that QC findings point at are tinted by severity and carry the
 * finding numbers, linked to the list of findings (#finding-n).
 */

const MARK_STYLES: Record<Severity, string> = {
  error:
    "bg-red-100 text-danger ring-1 ring-inset ring-danger/50 font-semibold",
  warning:
    "bg-caution-soft text-caution ring-1 ring-inset ring-caution/40 font-semibold",
  info: "bg-accent-soft text-accent-strong",
};

function Marker({
  mark,
  linkFindings,
}: {
  mark: CellMark;
  linkFindings: boolean;
}) {
  return (
    <sup className="ml-0.5 text-[0.65rem] font-semibold">
      <span className="sr-only">
        {" "}
        ({SEVERITY_LABELS[mark.severity].toLowerCase()}, finding{" "}
        {mark.findings.join(", ")})
      </span>
      <span aria-hidden="true">
        {mark.findings.map((n, k) => (
          <span key={n}>
            {k > 0 ? "," : ""}
            {linkFindings ? (
              <a href={`#finding-${n}`} className="underline decoration-dotted">
                {n}
              </a>
            ) : (
              n
            )}
          </span>
        ))}
      </span>
    </sup>
  );
}

export function GridTable({
  grid,
  linkFindings = true,
  caption,
}: {
  grid: DisplayGrid;
  linkFindings?: boolean;
  caption?: React.ReactNode;
}) {
  const label = PROPERTIES[grid.property];
  const unit =
    grid.unit === "–" || grid.unit === "-" || grid.unit === ""
      ? ""
      : ` (${grid.unit})`;
  const flagged = Object.keys(grid.marks).length;
  return (
    <div
      className="relative overflow-x-auto rounded-lg border border-line bg-panel"
      data-testid={`grid-${grid.property}`}
    >
      <table className="w-full text-sm">
        <caption className="px-3 pt-3 pb-2 text-left">
          <span className="font-semibold">
            {label.name}, {label.symbol}
            {unit}
          </span>
          {grid.sourceUnit ? (
            <span className="ml-2 text-xs text-ink-muted">
              reported by the laboratory in {grid.sourceUnit}
            </span>
          ) : null}
          {flagged > 0 ? (
            <span className="ml-2 text-xs text-ink-muted">
              {flagged} flagged {flagged === 1 ? "cell" : "cells"}
            </span>
          ) : null}
          {caption}
        </caption>
        <thead className="bg-surface text-ink-muted">
          <tr>
            <th
              scope="col"
              rowSpan={2}
              className="px-3 py-1.5 text-right align-bottom font-semibold"
            >
              Pressure ({grid.pressureUnit})
            </th>
            <th
              scope="colgroup"
              colSpan={grid.temperatures.length}
              className="px-3 py-1.5 text-center font-semibold"
            >
              {label.symbol}
              {unit} at temperature ({grid.temperatureUnit})
            </th>
          </tr>
          <tr>
            {grid.temperatures.map((t, j) => (
              <th
                key={j}
                scope="col"
                className="px-3 py-1.5 text-right font-semibold tabular-nums"
              >
                {formatMeasured(t)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {grid.pressures.map((p, i) => (
            <tr key={i} className="border-t border-line">
              <th
                scope="row"
                className="px-3 py-1 text-right font-normal text-ink-muted tabular-nums"
              >
                {formatMeasured(p)}
              </th>
              {grid.temperatures.map((_, j) => {
                const v = grid.values[i]?.[j] ?? null;
                const mark = grid.marks[`${i}:${j}`];
                const pb = grid.bubblePoints[j];
                const atBubble =
                  pb !== null &&
                  pb !== undefined &&
                  Math.abs(pb - p) <= 1e-6 * Math.max(pb, 1);
                return (
                  <td
                    key={j}
                    className={`px-3 py-1 text-right tabular-nums ${mark ? MARK_STYLES[mark.severity] : ""} ${atBubble ? "border-b-2 border-dotted border-accent" : ""}`}
                    title={atBubble ? "At the bubble point" : undefined}
                    data-flag={mark?.severity}
                  >
                    {v === null ? (
                      <span className="text-ink-muted">–</span>
                    ) : (
                      formatMeasured(v)
                    )}
                    {atBubble ? (
                      <span className="sr-only"> (at the bubble point)</span>
                    ) : null}
                    {mark ? (
                      <Marker mark={mark} linkFindings={linkFindings} />
                    ) : null}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function BubblePointTable({
  bubblePoints,
  linkFindings = true,
}: {
  bubblePoints: DisplayBubblePoints;
  linkFindings?: boolean;
}) {
  if (bubblePoints.rows.length === 0) {
    return (
      <p className="text-sm text-ink-muted">
        No bubble points were stated with this data.
      </p>
    );
  }
  return (
    <div
      className="relative inline-block overflow-x-auto rounded-lg border border-line bg-panel"
      data-testid="bubble-points"
    >
      <table className="text-sm">
        <caption className="px-3 pt-3 pb-2 text-left font-semibold">
          Bubble-point pressure per temperature
        </caption>
        <thead className="bg-surface text-ink-muted">
          <tr>
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">
              Temperature ({bubblePoints.temperatureUnit})
            </th>
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">
              Bubble point ({bubblePoints.pressureUnit})
            </th>
          </tr>
        </thead>
        <tbody>
          {bubblePoints.rows.map((r, k) => (
            <tr key={k} className="border-t border-line">
              <th
                scope="row"
                className="px-3 py-1 text-right font-normal text-ink-muted tabular-nums"
              >
                {formatMeasured(r.temperature)}
              </th>
              <td
                className={`px-3 py-1 text-right tabular-nums ${r.mark ? MARK_STYLES[r.mark.severity] : ""}`}
                data-flag={r.mark?.severity}
              >
                {formatMeasured(r.pressure)}
                {r.mark ? (
                  <Marker mark={r.mark} linkFindings={linkFindings} />
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
