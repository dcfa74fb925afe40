import type { ComparedSample } from "./types";

/**
 * How the table shows differences: the threshold beyond which a difference is highlighted, the sample the
 * others are compared with, and whether values outside a sample's measured range are extrapolated.
 */
export function DifferenceOptions({
  threshold,
  onThresholdChange,
  thresholdOk,
  samples,
  referenceId,
  onReferenceChange,
  extrapolate,
  onExtrapolateChange,
}: {
  threshold: string;
  onThresholdChange: (threshold: string) => void;
  thresholdOk: boolean;
  samples: ComparedSample[];
  referenceId: number | undefined;
  onReferenceChange: (id: number) => void;
  extrapolate: boolean;
  onExtrapolateChange: (extrapolate: boolean) => void;
}) {
  return (
    <div className="flex flex-col gap-4">
      <label className="block">
        <span className="block text-sm font-semibold">
          Highlight differences beyond (%)
        </span>
        <input
          type="number"
          min={0}
          step="any"
          inputMode="decimal"
          value={threshold}
          onChange={(e) => onThresholdChange(e.target.value)}
          aria-invalid={thresholdOk ? undefined : true}
          className="mt-1 block w-32 rounded border border-line bg-panel px-3 py-2 text-sm tabular-nums aria-invalid:border-danger"
        />
      </label>
      {samples.length > 1 ? (
        <label className="block">
          <span className="block text-sm font-semibold">
            Differences relative to
          </span>
          <select
            value={referenceId ?? ""}
            onChange={(e) => onReferenceChange(Number(e.target.value))}
            className="mt-1 block w-full max-w-xs rounded border border-line bg-panel px-3 py-2 text-sm"
          >
            {samples.map((s) => (
              <option key={s.id} value={s.id}>
                {s.label}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      <label className="flex items-start gap-2 text-sm">
        <input
          type="checkbox"
          checked={extrapolate}
          onChange={(e) => onExtrapolateChange(e.target.checked)}
          className="mt-0.5 h-4 w-4 accent-accent"
        />
        <span>
          Extrapolate outside a sample&apos;s measured range (values are
          flagged)
        </span>
      </label>
    </div>
  );
}
