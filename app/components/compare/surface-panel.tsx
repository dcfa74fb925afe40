import {
  PropertySurface,
  type PlotSeries,
  type PlotUnits,
  type QueryPoint,
} from "~/components/plots";
import { SURFACE_ARRANGEMENTS, type SurfaceArrangement } from "~/utils/compare";

/**
 * "<property> over pressure and temperature": the samples' interpolated 3D surfaces, overlaid in one scene or
 * side by side, with the conditions marked.
 */
export function SurfacePanel({
  series,
  propertyName,
  units,
  queryPoints,
  arrangement,
  onArrangementChange,
  onReady,
}: {
  series: PlotSeries[];
  propertyName: string;
  units: PlotUnits;
  queryPoints: QueryPoint[];
  arrangement: SurfaceArrangement;
  onArrangementChange: (arrangement: SurfaceArrangement) => void;
  onReady: () => void;
}) {
  return (
    <section aria-labelledby="surfaces-heading" className="mb-10">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="surfaces-heading" className="text-lg font-bold">
            {propertyName} over pressure and temperature
          </h2>
          <p className="text-sm text-ink-muted">
            Interpolated (automatic method) over each sample&apos;s measured
            range; dots are measured values, diamonds your conditions
            {series.length > 1 ? "; drag to turn, scroll to zoom" : ""}.
          </p>
        </div>
        {series.length > 1 ? (
          <fieldset
            className="flex rounded border border-line bg-panel p-0.5 text-sm"
            aria-label="Surface arrangement"
          >
            {SURFACE_ARRANGEMENTS.map((a) => (
              <label
                key={a}
                className={`cursor-pointer rounded px-3 py-1.5 font-semibold ${arrangement === a ? "bg-accent-soft text-accent-strong" : "text-ink-muted hover:text-ink"}`}
              >
                <input
                  type="radio"
                  name="arrangement"
                  value={a}
                  checked={arrangement === a}
                  onChange={() => onArrangementChange(a)}
                  className="sr-only"
                />
                {a === "side-by-side" ? "Side by side" : "Overlaid"}
              </label>
            ))}
          </fieldset>
        ) : null}
      </div>
      <PropertySurface
        className="mt-3"
        series={series}
        valueLabel={propertyName}
        units={units}
        method="auto"
        queryPoints={queryPoints}
        arrangement={arrangement}
        onReady={onReady}
      />
    </section>
  );
}
