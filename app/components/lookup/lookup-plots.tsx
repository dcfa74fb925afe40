import { useEffect, useState } from "react";
import { PropertySlices, PropertySurface } from "~/components/plots";
import { PROPERTIES, type PropertyKey } from "~/core/units";
import type { ApiGrid, SampleDetail } from "~/utils/api/client";
import type { Condition } from "~/utils/conditions";

const MAX_MARKED = 200;

/**
 * The surface and pressure slices of one looked-up property, with the conditions marked. The grid comes from the
 * samples API (`load`), in the units on screen; Plotly itself loads only here, lazily, after the table is shown.
 */
export function LookupPlots({
  properties,
  load,
  conditions,
  units,
  unitOf,
  method,
  degree,
  sampleLabel,
  sampleId,
}: {
  properties: PropertyKey[];
  load: () => Promise<Pick<SampleDetail, "grids">>;
  conditions: Condition[];
  units: { pressure: string; temperature: string };
  unitOf: (property: PropertyKey) => string;
  method: "auto" | "newton" | "pchip" | "linear";
  degree: [number, number] | null;
  sampleLabel: string;
  sampleId: number;
}) {
  const [property, setProperty] = useState<PropertyKey>(properties[0]!);
  const [grids, setGrids] = useState<ApiGrid[] | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    let live = true;
    load()
      .then((d) => live && setGrids(d.grids))
      .catch(() => live && setFailed(true));
    return () => {
      live = false;
    };
  }, [load]);
  const grid = grids?.find((g) => g.property === property) ?? null;
  // Labels (Q1, Q2, …) help with a few points and clutter a path: beyond eight, points are marked without them.
  const marked = conditions
    .slice(0, MAX_MARKED)
    .map((c) => (conditions.length > 8 ? { ...c, label: "" } : c));
  const queryTemperatures = [
    ...new Set(marked.map((c) => c.temperature)),
  ].slice(0, 4);
  return (
    <section
      className="mt-6 rounded-lg border border-line bg-panel p-5"
      aria-labelledby="plots-title"
    >
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="plots-title" className="text-lg font-semibold">
          Plots
        </h2>
        <label className="flex items-center gap-2 text-sm">
          <span className="font-semibold">Property</span>
          <select
            value={property}
            onChange={(e) => setProperty(e.target.value as PropertyKey)}
            className="rounded border border-line px-2 py-1"
          >
            {properties.map((p) => (
              <option key={p} value={p}>
                {PROPERTIES[p].phrase}
              </option>
            ))}
          </select>
        </label>
      </div>
      {conditions.length > MAX_MARKED ? (
        <p className="text-xs text-ink-muted">
          The first {MAX_MARKED} conditions are marked.
        </p>
      ) : null}
      {failed ? (
        <p className="mt-2 text-danger">
          The measured grid could not be loaded for plotting.
        </p>
      ) : null}
      {grid ? (
        <div className="mt-3 grid gap-4">
          <PropertySurface
            key={`s-${property}`}
            series={[{ id: sampleId, label: sampleLabel, grid }]}
            valueLabel={PROPERTIES[property].phrase}
            units={{ ...units, value: unitOf(property) }}
            method={method}
            degree={degree ?? undefined}
            queryPoints={marked}
          />
          <PropertySlices
            key={`c-${property}`}
            series={[{ id: sampleId, label: sampleLabel, grid }]}
            valueLabel={PROPERTIES[property].phrase}
            units={{ ...units, value: unitOf(property) }}
            method={method}
            degree={degree ?? undefined}
            temperatures={[
              ...new Set([...queryTemperatures, ...grid.temperatures]),
            ]
              .sort((a, b) => a - b)
              .slice(0, 6)}
            queryPoints={marked}
          />
        </div>
      ) : !failed ? (
        <p role="status" className="mt-3 text-sm text-ink-muted">
          Loading the measured grid…
        </p>
      ) : null}
    </section>
  );
}
