import { useEffect, useMemo, useRef } from "react";
import {
  explainInterpolation,
  type Explanation,
  type ExplanationStep,
  type Grid,
  type Method,
} from "~/core/interpolation";
import { describeWarningCode, type LookupWarning } from "~/core/lookup";
import { formatDetail } from "~/core/format";

export type ExplainTarget = {
  propertyName: string;
  grid: Grid;
  point: { pressure: number; temperature: number };
  method: Method;
  degree: [number, number] | null;
  extrapolate: boolean;
  serverValue: number;
  revision: number;
  units: { pressure: string; temperature: string; value: string };
};

/**
 * "How this number was obtained": the measured grid with the zone highlighted and the bubble points marked, then
 * step one (a new row at the target pressure, one value per temperature column of the zone, with the divided
 * differences) and step two (along temperature on that row). Computed in the browser by the same engine the
 * server runs, on the grid in the units on screen, so every figure can be checked by hand.
 */
export function ExplanationPanel({
  target,
  onClose,
}: {
  target: ExplainTarget;
  onClose: () => void;
}) {
  const result = useMemo(() => {
    try {
      return {
        ok: true as const,
        explanation: explainInterpolation(target.grid, target.point, {
          method: target.method,
          degree: target.degree ?? undefined,
          extrapolate: target.extrapolate,
        }),
      };
    } catch (error) {
      return { ok: false as const, message: (error as Error).message };
    }
  }, [target]);
  // Brought into view when it opens and whenever it explains another value.
  const title = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    title.current?.scrollIntoView({ behavior: "smooth", block: "start" });
  }, [target]);
  const { units } = target;
  return (
    <section
      aria-labelledby="explanation-title"
      className="mt-6 rounded-lg border border-accent bg-panel p-5"
    >
      <div className="flex items-start justify-between gap-4">
        <div>
          <h2
            ref={title}
            id="explanation-title"
            className="text-lg font-semibold"
          >
            How this number was obtained
          </h2>
          <p className="text-sm text-ink-muted">
            {target.propertyName} at {formatDetail(target.point.pressure)}{" "}
            {units.pressure} and {formatDetail(target.point.temperature)}{" "}
            {units.temperature}, revision {target.revision}, method{" "}
            {target.method}
            {target.degree && target.method !== "pchip"
              ? ` [${target.degree.join(", ")}]`
              : ""}
            .
          </p>
        </div>
        <button
          type="button"
          onClick={onClose}
          className="rounded border border-line px-3 py-1 text-sm font-semibold hover:border-accent"
        >
          Close
        </button>
      </div>
      {result.ok ? (
        <ExplanationBody explanation={result.explanation} target={target} />
      ) : (
        <p className="mt-3 text-danger">{result.message}</p>
      )}
    </section>
  );
}

function ExplanationBody({
  explanation: e,
  target,
}: {
  explanation: Explanation;
  target: ExplainTarget;
}) {
  const { grid, units } = target;
  const zoneRows = new Set(e.stencil.pressure);
  const zoneCols = new Set(e.stencil.temperature);
  const agrees =
    Math.abs(e.value - target.serverValue) <=
    1e-9 * Math.max(1, Math.abs(target.serverValue));
  return (
    <div className="mt-4 space-y-6 text-sm">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-4">
        <Figure
          label={`Value (${units.value})`}
          value={formatDetail(e.value)}
        />
        <Figure
          label={`Error estimate (${units.value})`}
          value={`± ${formatDetail(e.errorEstimate)}`}
        />
        <Figure
          label="Branch"
          value={
            e.branch
              ? `${e.branch.side}, bubble point ${formatDetail(e.branch.bubblePointPressure)} ${units.pressure}`
              : "no bubble point (gas table)"
          }
        />
        <Figure
          label="Same as the server?"
          value={
            agrees ? "yes" : `server gave ${formatDetail(target.serverValue)}`
          }
        />
      </div>
      {e.warnings.length ? (
        <ul className="list-disc pl-5 text-caution">
          {e.warnings.map((w) => (
            <li key={w}>{describeWarningCode(w as LookupWarning)}</li>
          ))}
        </ul>
      ) : null}

      <div>
        <h3 className="font-semibold">Measured grid, data zone highlighted</h3>
        <div className="mt-2 max-h-96 overflow-auto rounded border border-line">
          <table
            className="text-xs tabular-nums"
            data-testid="explanation-grid"
          >
            <thead className="sticky top-0 bg-surface">
              <tr>
                <th className="px-2 py-1 text-left">
                  p ({units.pressure}) \ T ({units.temperature})
                </th>
                {grid.temperatures.map((t, j) => (
                  <th
                    key={j}
                    className={`px-2 py-1 text-right ${zoneCols.has(j) ? "text-accent-strong" : ""}`}
                  >
                    {formatDetail(t)}
                  </th>
                ))}
              </tr>
              {grid.bubblePoints ? (
                <tr>
                  <th className="px-2 py-1 text-left font-normal text-caution">
                    bubble point
                  </th>
                  {grid.bubblePoints.map((b, j) => (
                    <th
                      key={j}
                      className="px-2 py-1 text-right font-normal text-caution"
                    >
                      {b === null ? "—" : formatDetail(b)}
                    </th>
                  ))}
                </tr>
              ) : null}
            </thead>
            <tbody>
              {grid.pressures.map((p, i) => (
                <tr key={i} className="border-t border-line">
                  <th className="px-2 py-1 text-left font-normal">
                    {formatDetail(p)}
                  </th>
                  {grid.temperatures.map((_, j) => {
                    const inZone = zoneRows.has(i) && zoneCols.has(j);
                    const v = grid.values[i]?.[j];
                    return (
                      <td
                        key={j}
                        data-zone={inZone ? "yes" : undefined}
                        className={`px-2 py-1 text-right ${inZone ? "bg-accent-soft font-semibold text-accent-strong" : ""}`}
                      >
                        {v === null || v === undefined ? "—" : formatDetail(v)}
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>

      <div>
        <h3 className="font-semibold">
          Step one — along pressure to {formatDetail(e.point.pressure)}{" "}
          {units.pressure}, one value per temperature of the zone
        </h3>
        <div className="mt-2 grid grid-cols-1 gap-3 lg:grid-cols-2">
          {e.stepOne
            .filter((s) => s.role === "zone")
            .map((s) => (
              <StepCard
                key={s.column ?? -1}
                step={s}
                title={`T = ${formatDetail(s.temperature ?? NaN)} ${units.temperature}`}
                axisUnit={units.pressure}
              />
            ))}
        </div>
      </div>

      <div>
        <h3 className="font-semibold">
          Step two — along temperature to {formatDetail(e.point.temperature)}{" "}
          {units.temperature}, on the new row
        </h3>
        <div className="mt-2 max-w-xl">
          <StepCard
            step={e.stepTwo}
            title="New row"
            axisUnit={units.temperature}
          />
        </div>
      </div>

      <p className="text-ink-muted">
        Error estimate: {formatDetail(e.errorParts.pressure)} from the pressure
        direction, {formatDetail(e.errorParts.temperature)} from temperature and{" "}
        {formatDetail(e.errorParts.rounding)} for rounding (see the engine
        documentation). Newton form: value = f[x₀] + f[x₀,x₁](x−x₀) +
        f[x₀,x₁,x₂](x−x₀)(x−x₁) + …, with the divided differences in the tables
        above (first row of each column).
      </p>
    </div>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded border border-line p-3">
      <div className="text-xs text-ink-muted">{label}</div>
      <div className="font-semibold tabular-nums">{value}</div>
    </div>
  );
}

function StepCard({
  step,
  title,
  axisUnit,
}: {
  step: ExplanationStep;
  title: string;
  axisUnit: string;
}) {
  const dd = step.dividedDifferences;
  return (
    <div
      className="relative overflow-x-auto rounded border border-line p-3"
      data-testid="explanation-step"
    >
      <div className="flex justify-between">
        <span className="font-semibold">{title}</span>
        <span className="tabular-nums">
          → <strong>{formatDetail(step.value)}</strong>
          {step.status !== "inside" ? (
            <span className="ml-2 text-caution">
              ({step.status.replace("-", " ")})
            </span>
          ) : null}
        </span>
      </div>
      <table className="mt-2 w-full text-xs tabular-nums">
        <thead className="text-ink-muted">
          <tr>
            <th className="pr-2 text-right font-normal">x ({axisUnit})</th>
            <th className="pr-2 text-right font-normal">f[x]</th>
            {dd
              ? dd.slice(1).map((_, l) => (
                  <th key={l} className="pr-2 text-right font-normal">
                    order {l + 1}
                  </th>
                ))
              : null}
          </tr>
        </thead>
        <tbody>
          {step.nodes.map((n, i) => (
            <tr
              key={i}
              className={
                n.role === "error-check" ? "text-ink-muted italic" : ""
              }
            >
              <td className="pr-2 text-right">
                {formatDetail(n.at)}
                {n.index === null ? "*" : ""}
              </td>
              <td className="pr-2 text-right">{formatDetail(n.value)}</td>
              {dd
                ? dd.slice(1).map((level, l) => (
                    <td key={l} className="pr-2 text-right">
                      {level[i] === undefined ? "" : formatDetail(level[i]!)}
                    </td>
                  ))
                : null}
            </tr>
          ))}
        </tbody>
      </table>
      {step.pchip ? (
        <p className="mt-1 text-xs text-ink-muted">
          pchip cell {formatDetail(step.pchip.cell[0])}–
          {formatDetail(step.pchip.cell[1])}, end slopes{" "}
          {formatDetail(step.pchip.derivatives[0])} and{" "}
          {formatDetail(step.pchip.derivatives[1])} (shape-preserving).
        </p>
      ) : null}
      {step.nodes.some((n) => n.index === null) ? (
        <p className="mt-1 text-xs text-ink-muted">
          * the bubble point of this column, shared by both branches.
        </p>
      ) : null}
      {step.nodes.some((n) => n.role === "error-check") ? (
        <p className="mt-1 text-xs text-ink-muted">
          Italic: the extra node used only for the error estimate.
        </p>
      ) : null}
    </div>
  );
}
