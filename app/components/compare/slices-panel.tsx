import {
  PlotPlaceholder,
  PropertySlices,
  type PlotSeries,
  type PlotUnits,
  type QueryPoint,
} from "~/components/plots";

/**
 * "<property> against pressure": curves at fixed temperatures the person may type, drawn once `mayDraw` (after
 * the surface), a placeholder until then.
 */
export function SlicesPanel({
  series,
  propertyName,
  units,
  queryPoints,
  sliceInput,
  onSliceInputChange,
  temperatures,
  mayDraw,
}: {
  series: PlotSeries[];
  propertyName: string;
  units: PlotUnits;
  queryPoints: QueryPoint[];
  sliceInput: string;
  onSliceInputChange: (text: string) => void;
  temperatures: number[];
  mayDraw: boolean;
}) {
  return (
    <section aria-labelledby="slices-heading" className="mb-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="slices-heading" className="text-lg font-bold">
            {propertyName} against pressure
          </h2>
          <p className="text-sm text-ink-muted">
            Curves interpolated at fixed temperatures; markers are measured
            values where the temperature was measured.
          </p>
        </div>
        <label className="block">
          <span className="block text-sm font-semibold">
            Slice temperatures ({units.temperature})
          </span>
          <input
            value={sliceInput}
            onChange={(e) => onSliceInputChange(e.target.value)}
            className="mt-1 block w-56 rounded border border-line bg-panel px-3 py-2 text-sm tabular-nums"
          />
        </label>
      </div>
      {mayDraw ? (
        <PropertySlices
          className="mt-3"
          series={series}
          valueLabel={propertyName}
          units={units}
          method="auto"
          queryPoints={queryPoints}
          temperatures={temperatures}
        />
      ) : (
        <PlotPlaceholder
          className="mt-3"
          text="Loading the pressure slices…"
          height={420}
        />
      )}
    </section>
  );
}
