import { formatMeasured, roundSignificant } from "~/core/format";
import { PROPERTIES } from "~/core/units";
import type { DisplayGrid, Severity } from "./types";

/*
 * A small SVG plot of one property against pressure, one line per temperature (isothermal slices), with the
 * bubble point marked on each line and flagged cells ringed by severity. Plain SVG, no plotting library.
 */

const W = 340;
const H = 220;
const PAD = { left: 52, right: 12, top: 12, bottom: 34 };
const COLORS = [
  "#0f6e6a",
  "#b4571e",
  "#4a5bb5",
  "#8a5a00",
  "#7a3e8c",
  "#3d7d2f",
  "#a3262a",
  "#2f6f8f",
];
const RING: Record<Severity, string> = {
  error: "#a3262a",
  warning: "#c07d00",
  info: "#0f6e6a",
};

/** About `count` round tick values covering [min, max]. */
function niceTicks(min: number, max: number, count = 4): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [];
  if (min === max) return [min];
  const raw = (max - min) / count;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step =
    [1, 2, 2.5, 5, 10].map((m) => m * magnitude).find((s) => s >= raw) ??
    10 * magnitude;
  const ticks: number[] = [];
  for (let v = Math.ceil(min / step) * step; v <= max + step * 1e-9; v += step)
    ticks.push(roundSignificant(v, 12));
  return ticks;
}

/** Ticks at 1, 2 and 5 times powers of ten within [min, max] (fewer when the range is wide). */
function logTicks(min: number, max: number): number[] {
  const ticks: number[] = [];
  const decades = Math.log10(max / min);
  const steps = decades > 3 ? [1] : decades > 1.5 ? [1, 3] : [1, 2, 5];
  for (
    let e = Math.floor(Math.log10(min));
    e <= Math.ceil(Math.log10(max));
    e++
  ) {
    for (const m of steps) {
      const v = roundSignificant(m * 10 ** e, 6);
      if (v >= min && v <= max) ticks.push(v);
    }
  }
  return ticks;
}

export function SlicePlot({ grid }: { grid: DisplayGrid }) {
  const label = PROPERTIES[grid.property];
  const values = grid.values.flat().filter((v): v is number => v !== null);
  if (values.length === 0 || grid.pressures.length === 0) return null;
  const pMin = Math.min(...grid.pressures);
  const pMax = Math.max(...grid.pressures);
  // Bg spans orders of magnitude (roughly 1/p): a logarithmic axis shows every pressure.
  const log =
    grid.property === "gas_fvf" &&
    values.every((v) => v > 0) &&
    Math.max(...values) / Math.min(...values) > 20;
  const scale = (v: number) => (log ? Math.log10(v) : v);
  let vMin = Math.min(...values.map(scale));
  let vMax = Math.max(...values.map(scale));
  if (vMin === vMax) {
    vMin -= Math.abs(vMin) * 0.05 || 1;
    vMax += Math.abs(vMax) * 0.05 || 1;
  }
  const vPad = (vMax - vMin) * 0.06;
  vMin -= vPad;
  vMax += vPad;
  const x = (p: number) =>
    PAD.left + ((p - pMin) / (pMax - pMin || 1)) * (W - PAD.left - PAD.right);
  const y = (v: number) =>
    H -
    PAD.bottom -
    ((scale(v) - vMin) / (vMax - vMin)) * (H - PAD.top - PAD.bottom);
  const yTicks = log ? logTicks(10 ** vMin, 10 ** vMax) : niceTicks(vMin, vMax);
  const unit = grid.unit === "–" || grid.unit === "-" ? "" : ` (${grid.unit})`;
  const description = `${label.name} against pressure, one line per temperature: ${grid.temperatures.map((t) => `${formatMeasured(t)} ${grid.temperatureUnit}`).join(", ")}.`;
  return (
    <figure className="rounded-lg border border-line bg-panel p-3">
      <figcaption className="text-sm font-semibold">
        {label.symbol}
        {unit} against pressure
        {log ? (
          <span className="font-normal text-ink-muted">
            {" "}
            (logarithmic scale)
          </span>
        ) : null}
      </figcaption>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="mt-1 h-auto w-full"
        role="img"
        aria-label={description}
      >
        {yTicks.map((t) => (
          <g key={`y${t}`}>
            <line
              x1={PAD.left}
              x2={W - PAD.right}
              y1={y(t)}
              y2={y(t)}
              stroke="#d9dedb"
              strokeWidth={0.6}
            />
            <text
              x={PAD.left - 4}
              y={y(t) + 3}
              textAnchor="end"
              fontSize={9}
              fill="#55636f"
            >
              {formatMeasured(t)}
            </text>
          </g>
        ))}
        {niceTicks(pMin, pMax).map((t) => (
          <g key={`x${t}`}>
            <line
              x1={x(t)}
              x2={x(t)}
              y1={H - PAD.bottom}
              y2={H - PAD.bottom + 3}
              stroke="#55636f"
              strokeWidth={0.6}
            />
            <text
              x={x(t)}
              y={H - PAD.bottom + 13}
              textAnchor="middle"
              fontSize={9}
              fill="#55636f"
            >
              {formatMeasured(t)}
            </text>
          </g>
        ))}
        <line
          x1={PAD.left}
          x2={W - PAD.right}
          y1={H - PAD.bottom}
          y2={H - PAD.bottom}
          stroke="#55636f"
          strokeWidth={0.8}
        />
        <line
          x1={PAD.left}
          x2={PAD.left}
          y1={PAD.top}
          y2={H - PAD.bottom}
          stroke="#55636f"
          strokeWidth={0.8}
        />
        <text
          x={(PAD.left + W - PAD.right) / 2}
          y={H - 4}
          textAnchor="middle"
          fontSize={10}
          fill="#1c2733"
        >
          Pressure ({grid.pressureUnit})
        </text>
        {grid.temperatures.map((_, j) => {
          const color = COLORS[j % COLORS.length]!;
          const points = grid.pressures
            .map((p, i) => ({ p, v: grid.values[i]?.[j] ?? null, i }))
            .filter(
              (pt): pt is { p: number; v: number; i: number } => pt.v !== null,
            );
          const pb = grid.bubblePoints[j];
          return (
            <g key={j}>
              <polyline
                fill="none"
                stroke={color}
                strokeWidth={1.4}
                points={points
                  .map((pt) => `${x(pt.p).toFixed(1)},${y(pt.v).toFixed(1)}`)
                  .join(" ")}
              />
              {pb !== null && pb !== undefined && pb >= pMin && pb <= pMax ? (
                <line
                  x1={x(pb)}
                  x2={x(pb)}
                  y1={PAD.top}
                  y2={H - PAD.bottom}
                  stroke={color}
                  strokeWidth={0.8}
                  strokeDasharray="3 3"
                  opacity={0.6}
                />
              ) : null}
              {points.map((pt) => {
                const mark = grid.marks[`${pt.i}:${j}`];
                return (
                  <g key={pt.i}>
                    <circle cx={x(pt.p)} cy={y(pt.v)} r={1.8} fill={color} />
                    {mark ? (
                      <circle
                        cx={x(pt.p)}
                        cy={y(pt.v)}
                        r={5}
                        fill="none"
                        stroke={RING[mark.severity]}
                        strokeWidth={1.6}
                      />
                    ) : null}
                  </g>
                );
              })}
            </g>
          );
        })}
      </svg>
      <ul
        className="mt-1 flex flex-wrap gap-x-3 gap-y-1 text-xs text-ink-muted"
        aria-label="Temperatures"
      >
        {grid.temperatures.map((t, j) => (
          <li key={j} className="flex items-center gap-1">
            <span
              aria-hidden="true"
              className="inline-block h-0.5 w-4"
              style={{ background: COLORS[j % COLORS.length] }}
            />
            {formatMeasured(t)} {grid.temperatureUnit}
          </li>
        ))}
        {grid.bubblePoints.some((b) => b !== null) ? (
          <li>dashed: bubble point</li>
        ) : null}
        {Object.keys(grid.marks).length > 0 ? (
          <li>ringed: flagged cell</li>
        ) : null}
      </ul>
    </figure>
  );
}
