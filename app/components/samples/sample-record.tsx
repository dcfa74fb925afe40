import { formatMeasured } from "~/core/format";
import { BubblePointTable } from "./grid-table";
import { SAMPLE_TYPE_LABELS } from "./labels";
import type { DisplayBubblePoints } from "./types";

/** A sample's record as the sample page shows it: numbers in the reader's units, beside their symbols. */
export type SampleRecordView = {
  id: number;
  label: string;
  fieldName: string;
  wellName: string;
  sampleType: string;
  samplingDate: string | null;
  depth: number | null;
  reservoirPressure: number | null;
  reservoirTemperature: number | null;
  stockTankApi: number | null;
  gasSpecificGravity: number | null;
  /** The preset's name, or the conditions in °F and psia. */
  standardConditions: string | null;
  /** Makes the report's gauge pressures absolute; in the reader's (absolute) pressure unit. */
  barometricPressure: number | null;
  laboratory: string | null;
  reportReference: string | null;
  notes: string | null;
};

export type SampleUnits = {
  pressure: string;
  temperature: string;
  depth: string;
};

function Meta({
  label,
  children,
}: {
  label: string;
  children: React.ReactNode;
}) {
  return (
    <div>
      <dt className="text-xs font-semibold text-ink-muted">{label}</dt>
      <dd className="mt-0.5">{children ?? "—"}</dd>
    </div>
  );
}

const measured = (v: number | null) =>
  v === null ? null : <span className="tabular-nums">{formatMeasured(v)}</span>;

/** The "Record" panel: where and how the sample was taken, and the bubble points of the approved revision. */
export function SampleRecord({
  sample,
  units,
  bubblePoints,
}: {
  sample: SampleRecordView;
  units: SampleUnits;
  /** From the approved revision, when there is one. */
  bubblePoints: { revisionNumber: number; table: DisplayBubblePoints } | null;
}) {
  return (
    <section
      aria-labelledby="record"
      className="rounded-lg border border-line bg-panel p-5"
    >
      <h2 id="record" className="font-semibold">
        Record
      </h2>
      <dl className="mt-3 grid gap-x-6 gap-y-3 text-sm sm:grid-cols-3 lg:grid-cols-4">
        <Meta label="Field">{sample.fieldName}</Meta>
        <Meta label="Well">{sample.wellName}</Meta>
        <Meta label="Sample type">
          {SAMPLE_TYPE_LABELS[sample.sampleType] ?? sample.sampleType}
        </Meta>
        <Meta label="Sampling date">{sample.samplingDate}</Meta>
        <Meta label={`Sampling depth (${units.depth})`}>
          {measured(sample.depth)}
        </Meta>
        <Meta label={`Reservoir pressure at sampling (${units.pressure})`}>
          {measured(sample.reservoirPressure)}
        </Meta>
        <Meta
          label={`Reservoir temperature at sampling (${units.temperature})`}
        >
          {measured(sample.reservoirTemperature)}
        </Meta>
        <Meta label="Stock-tank oil gravity (°API)">
          {measured(sample.stockTankApi)}
        </Meta>
        <Meta label="Gas specific gravity (air = 1)">
          {measured(sample.gasSpecificGravity)}
        </Meta>
        <Meta label="Standard conditions">{sample.standardConditions}</Meta>
        <Meta label={`Barometric pressure (${units.pressure})`}>
          {measured(sample.barometricPressure)}
        </Meta>
        <Meta label="Laboratory">{sample.laboratory}</Meta>
        <Meta label="Report reference">{sample.reportReference}</Meta>
      </dl>
      {sample.notes ? (
        <p className="mt-3 text-sm whitespace-pre-line">{sample.notes}</p>
      ) : null}
      {bubblePoints && bubblePoints.table.rows.length > 0 ? (
        <div className="mt-4">
          <BubblePointTable bubblePoints={bubblePoints.table} />
          <p className="mt-1 text-xs text-ink-muted">
            From approved revision {bubblePoints.revisionNumber}.
          </p>
        </div>
      ) : null}
    </section>
  );
}
