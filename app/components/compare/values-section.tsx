import { useState } from "react";
import { EstimateCaution } from "~/components/estimate-caution";
import type { PropertyKey } from "~/core/units";
import type { Condition, ParsedConditions } from "~/utils/conditions";
import { ConditionsInput } from "./conditions-input";
import { DifferenceOptions } from "./difference-options";
import type { ComparedSample, CompareUnits } from "./types";
import { useCompareLookups } from "./use-compare-lookups";
import { ValuesTable } from "./values-table";

const DEFAULT_THRESHOLD_PERCENT = 5;

/**
 * "<property> at chosen conditions": the conditions box, the difference options and the values table, whose
 * values the lookup API gives.
 */
export function ValuesSection({
  samples,
  property,
  propertyName,
  units,
  conditionsText,
  onConditionsTextChange,
  parsed,
  conditions,
}: {
  samples: ComparedSample[];
  property: PropertyKey;
  propertyName: string;
  units: CompareUnits;
  conditionsText: string;
  onConditionsTextChange: (text: string) => void;
  parsed: ParsedConditions;
  conditions: Condition[];
}) {
  const [threshold, setThreshold] = useState(String(DEFAULT_THRESHOLD_PERCENT));
  const [referenceId, setReferenceId] = useState<number | null>(null);
  const [extrapolate, setExtrapolate] = useState(false);
  const lookups = useCompareLookups(
    samples,
    property,
    units.system,
    conditions,
    extrapolate,
  );
  const thresholdValue = Number(threshold);
  const thresholdOk =
    threshold.trim() !== "" &&
    Number.isFinite(thresholdValue) &&
    thresholdValue >= 0;
  const reference = samples.find((s) => s.id === referenceId) ?? samples[0];
  const others = samples.filter((s) => s !== reference);

  return (
    <section aria-labelledby="values-heading" className="mb-10">
      <h2 id="values-heading" className="text-lg font-bold">
        {propertyName} at chosen conditions
      </h2>
      <div className="mt-3 grid gap-6 rounded-lg border border-line bg-panel p-5 md:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
        <ConditionsInput
          text={conditionsText}
          onTextChange={onConditionsTextChange}
          parsed={parsed}
          units={units}
        />
        <DifferenceOptions
          threshold={threshold}
          onThresholdChange={setThreshold}
          thresholdOk={thresholdOk}
          samples={samples}
          referenceId={reference?.id}
          onReferenceChange={setReferenceId}
          extrapolate={extrapolate}
          onExtrapolateChange={setExtrapolate}
        />
      </div>
      <div className="mt-4">
        <ValuesTable
          conditions={conditions}
          samples={samples}
          reference={reference}
          others={others}
          units={units}
          propertyName={propertyName}
          lookups={lookups}
          threshold={thresholdOk ? thresholdValue : null}
        />
        <EstimateCaution className="mt-3 rounded border border-caution/30 bg-caution-soft px-3 py-2 text-sm text-caution" />
      </div>
    </section>
  );
}
