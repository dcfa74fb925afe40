import { useMemo, useState } from "react";
import type { SampleSummary } from "~/utils/api/client";

/** The sample to look up in: a filter, the list (samples without an approved revision disabled) and its facts. */
export function SamplePicker({
  samples,
  sampleId,
  onChange,
  units,
}: {
  samples: readonly SampleSummary[];
  sampleId: number | null;
  onChange: (sampleId: number) => void;
  units: { pressure: string; temperature: string };
}) {
  const [filter, setFilter] = useState("");
  const sample = samples.find((s) => s.id === sampleId) ?? null;
  const visibleSamples = useMemo(() => {
    const f = filter.trim().toLowerCase();
    return f
      ? samples.filter((s) =>
          `${s.label} ${s.well} ${s.field}`.toLowerCase().includes(f),
        )
      : samples;
  }, [samples, filter]);
  return (
    <fieldset className="space-y-2">
      <legend className="text-sm font-semibold">Sample</legend>
      <label className="sr-only" htmlFor="sample-filter">
        Filter samples
      </label>
      <input
        id="sample-filter"
        type="search"
        placeholder="Filter by sample, well or field"
        value={filter}
        onChange={(e) => setFilter(e.target.value)}
        className="w-full rounded border border-line px-3 py-1.5 text-sm"
      />
      <label className="sr-only" htmlFor="sample">
        Sample
      </label>
      <select
        id="sample"
        size={6}
        value={sampleId ?? ""}
        onChange={(e) => onChange(Number(e.target.value))}
        className="w-full rounded border border-line text-sm"
      >
        {visibleSamples.map((s) => (
          <option
            key={s.id}
            value={s.id}
            disabled={s.approvedRevision === null}
          >
            {s.label} — {s.well}, {s.field}
            {s.approvedRevision === null
              ? " (no approved revision)"
              : ` · rev. ${s.approvedRevision}`}
          </option>
        ))}
      </select>
      {sample ? <SampleFacts sample={sample} units={units} /> : null}
    </fieldset>
  );
}

function SampleFacts({
  sample,
  units,
}: {
  sample: SampleSummary;
  units: { pressure: string; temperature: string };
}) {
  return (
    <dl className="grid grid-cols-2 gap-x-3 text-xs text-ink-muted">
      <dt>Reservoir</dt>
      <dd className="tabular-nums">
        {sample.reservoirPressure ?? "—"} {units.pressure},{" "}
        {sample.reservoirTemperature ?? "—"} {units.temperature}
      </dd>
      <dt>Bubble point</dt>
      <dd className="tabular-nums">
        {sample.bubblePoint === null
          ? "—"
          : `${sample.bubblePoint} ${units.pressure}`}
      </dd>
      <dt>Approved revision</dt>
      <dd>{sample.approvedRevision ?? "none"}</dd>
    </dl>
  );
}
