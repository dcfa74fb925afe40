import { EstimateCaution } from "~/components/estimate-caution";
import type { Condition, ParsedConditions } from "~/utils/conditions";
import { ConditionsInput } from "./conditions-input";
import { DifferenceOptions } from "./difference-options";
import type { CompareLookups, ComparedSample, CompareUnits } from "./types";
import type { DifferenceOptionsState } from "./use-difference-options";
import { ValuesTable } from "./values-table";

/**
 * "<property> at chosen conditions": the conditions box, the difference options and the values table, with
 * the lookup API's values.
 */
export function ValuesSection({
  samples,
  propertyName,
  units,
  conditionsText,
  onConditionsTextChange,
  parsed,
  conditions,
  options,
  lookups,
}: {
  samples: ComparedSample[];
  propertyName: string;
  units: CompareUnits;
  conditionsText: string;
  onConditionsTextChange: (text: string) => void;
  parsed: ParsedConditions;
  conditions: Condition[];
  options: DifferenceOptionsState;
  lookups: CompareLookups;
}) {
  const reference =
    samples.find((s) => s.id === options.referenceId) ?? samples[0];
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
          threshold={options.threshold}
          onThresholdChange={options.setThreshold}
          thresholdOk={options.thresholdPercent !== null}
          samples={samples}
          referenceId={reference?.id}
          onReferenceChange={options.setReferenceId}
          extrapolate={options.extrapolate}
          onExtrapolateChange={options.setExtrapolate}
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
          threshold={options.thresholdPercent}
        />
        <EstimateCaution className="mt-3 rounded border border-caution/30 bg-caution-soft px-3 py-2 text-sm text-caution" />
      </div>
    </section>
  );
}
