import { useMemo, useState } from "react";
import { requirePermission } from "~/.server/auth/guards";
import { buildCompareView, parseCompareQuery } from "~/.server/samples/compare";
import { CompareForm } from "~/components/compare/compare-form";
import { defaultConditionsText } from "~/components/compare/conditions-text";
import {
  ChooseMoreSamples,
  MissingGridNotice,
} from "~/components/compare/selection-notices";
import { SlicesPanel } from "~/components/compare/slices-panel";
import { SurfacePanel } from "~/components/compare/surface-panel";
import { isCompared } from "~/components/compare/types";
import { useCompareConditions } from "~/components/compare/use-compare-conditions";
import { useCompareLookups } from "~/components/compare/use-compare-lookups";
import { useDifferenceOptions } from "~/components/compare/use-difference-options";
import { usePlotSequence } from "~/components/compare/use-plot-sequence";
import { useSliceTemperatures } from "~/components/compare/use-slice-temperatures";
import { ValuesSection } from "~/components/compare/values-section";
import { PageHeader } from "~/components/page-header";
import type { PlotSeries } from "~/components/plots";
import { PROPERTIES } from "~/core/units";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Compare · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const query = parseCompareQuery(new URL(args.request.url).searchParams);
  return buildCompareView(user, query);
}

export default function Compare({ loaderData }: Route.ComponentProps) {
  const { samples, selected, property, units } = loaderData;
  const compared = useMemo(() => selected.filter(isCompared), [selected]);
  const { slicesMayDraw, surfaceDrawn } = usePlotSequence(compared.length);
  const conditions = useCompareConditions(
    defaultConditionsText(loaderData),
    units.system,
  );
  const slices = useSliceTemperatures(
    compared,
    conditions.conditions,
    units.system,
  );
  const options = useDifferenceOptions();
  const lookups = useCompareLookups(
    compared,
    property,
    units.system,
    conditions.conditions,
    options.extrapolate,
  );
  const [arrangement, setArrangement] = useState(loaderData.view);

  const series: PlotSeries[] = useMemo(
    () => compared.map((s) => ({ id: s.id, label: s.label, grid: s.grid })),
    [compared],
  );
  const plotUnits = useMemo(
    () => ({
      pressure: units.pressure,
      temperature: units.temperature,
      value: units.value,
    }),
    [units.pressure, units.temperature, units.value],
  );
  const propertyName = PROPERTIES[property].short;

  return (
    <>
      <PageHeader title="Compare">
        Two to four samples side by side: one property on overlaid pressure
        slices and 3D surfaces, and a table of values at the conditions you
        choose, with their relative differences.
      </PageHeader>

      <CompareForm
        samples={samples}
        chosenIds={selected.map((s) => s.id)}
        property={property}
        system={units.system}
      />
      <MissingGridNotice
        missing={selected.filter((s) => s.grid === null)}
        property={property}
      />
      <ChooseMoreSamples compared={compared.length} />

      {compared.length >= 1 ? (
        <>
          <ValuesSection
            samples={compared}
            propertyName={propertyName}
            units={units}
            conditionsText={conditions.text}
            onConditionsTextChange={conditions.setText}
            parsed={conditions.parsed}
            conditions={conditions.conditions}
            options={options}
            lookups={lookups}
          />
          <SurfacePanel
            series={series}
            propertyName={propertyName}
            units={plotUnits}
            queryPoints={conditions.queryPoints}
            arrangement={arrangement}
            onArrangementChange={setArrangement}
            onReady={surfaceDrawn}
          />
          <SlicesPanel
            series={series}
            propertyName={propertyName}
            units={plotUnits}
            queryPoints={conditions.queryPoints}
            sliceInput={slices.input}
            onSliceInputChange={slices.setInput}
            temperatures={slices.temperatures}
            mayDraw={slicesMayDraw}
          />
        </>
      ) : null}
    </>
  );
}
