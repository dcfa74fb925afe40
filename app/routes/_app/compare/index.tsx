import { useEffect, useMemo, useRef, useState } from "react";
import { Form, useNavigation, useSubmit } from "react-router";
import { requirePermission } from "~/.server/auth/guards";
import { buildCompareView, parseCompareQuery } from "~/.server/samples/compare";
import { PageHeader } from "~/components/page-header";
import { EstimateCaution } from "~/components/estimate-caution";
import { Button } from "~/components/form";
import {
  PlotPlaceholder,
  PropertySlices,
  PropertySurface,
  preloadPlots,
  type PlotSeries,
  type QueryPoint,
} from "~/components/plots";
import {
  formatCompared,
  formatDifference,
  formatErrorEstimate,
  formatPlain,
  formatPressure,
  formatSignificant,
  formatTemperature,
} from "~/core/format";
import { describeWarningCode, isLookupWarning } from "~/core/lookup";
import {
  convertBetweenSystems,
  OUTPUT_SYSTEMS,
  outputUnitSystem,
  PROPERTIES,
  PROPERTY_KEYS,
  type OutputSystem,
} from "~/core/units";
import { parseConditionList, type Condition } from "~/utils/conditions";
import { SERIOUS_WARNINGS, warningLabel } from "~/utils/warning-labels";
import { MAX_COMPARED_SAMPLES as MAX_SAMPLES } from "~/utils/compare";
import type { CompareCell, CompareLookups } from "~/components/compare/types";
import { useCompareLookups } from "~/components/compare/use-compare-lookups";
import type { Route } from "./+types/index";

const MAX_TABLE_CONDITIONS = 50;
const DEFAULT_THRESHOLD_PERCENT = 5;

export const meta: Route.MetaFunction = () => [{ title: "Compare · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const query = parseCompareQuery(new URL(args.request.url).searchParams);
  return buildCompareView(user, query);
}

type LoaderData = Route.ComponentProps["loaderData"];
type Selected = LoaderData["selected"][number];
type Units = LoaderData["units"];

export default function Compare({ loaderData }: Route.ComponentProps) {
  const { samples, selected, property, units } = loaderData;
  const navigation = useNavigation();
  const withGrid = selected.filter(
    (
      s,
    ): s is Selected & {
      grid: NonNullable<Selected["grid"]>;
      revision: number;
    } => s.grid !== null && s.revision !== null,
  );

  // start fetching the plot code at once, in parallel with everything else on the page
  useEffect(() => {
    if (withGrid.length > 0) void preloadPlots().catch(() => {});
  }, [withGrid.length]);

  const [conditionsText, setConditionsText] = useState(() =>
    defaultConditionsText(loaderData),
  );
  const [threshold, setThreshold] = useState(String(DEFAULT_THRESHOLD_PERCENT));
  const [referenceId, setReferenceId] = useState<number | null>(null);
  const [extrapolate, setExtrapolate] = useState(false);
  const [arrangement, setArrangement] = useState<"side-by-side" | "overlaid">(
    loaderData.view,
  );
  const [sliceText, setSliceText] = useState<string | null>(null);
  // the slices wait for the surface's first draw, so that the two do not share the main thread while Plotly
  // starts (the 3D scene is the slow one); a timer draws them anyway if the surface never reports
  const [surfaceReady, setSurfaceReady] = useState(false);
  useEffect(() => {
    const timer = setTimeout(() => setSurfaceReady(true), 30_000);
    return () => clearTimeout(timer);
  }, []);

  // when the unit system changes, convert the conditions the person typed instead of dropping them
  const shownSystem = useRef(units.system);
  useEffect(() => {
    if (shownSystem.current === units.system) return;
    const from = shownSystem.current;
    shownSystem.current = units.system;
    setConditionsText((text) =>
      convertConditionsText(text, from, units.system),
    );
    setSliceText(null);
  }, [units.system]);

  const parsed = useMemo(
    () => parseConditionList(conditionsText),
    [conditionsText],
  );
  const conditions = useMemo(
    () => (parsed.ok ? parsed.conditions.slice(0, MAX_TABLE_CONDITIONS) : []),
    [parsed],
  );
  const conditionsKey = JSON.stringify(conditions);
  const queryPoints: QueryPoint[] = useMemo(
    () => conditions.map((c, k) => ({ ...c, label: `Q${k + 1}` })),
    [conditionsKey],
  );

  const series: PlotSeries[] = useMemo(
    () => withGrid.map((s) => ({ id: s.id, label: s.label, grid: s.grid })),
    [loaderData],
  );
  const plotUnits = useMemo(
    () => ({
      pressure: units.pressure,
      temperature: units.temperature,
      value: units.value,
    }),
    [units.pressure, units.temperature, units.value],
  );

  const defaultSlices = useMemo(() => {
    // a handful of curves stays readable: up to six in all
    const limit = Math.max(1, Math.floor(6 / Math.max(withGrid.length, 1)));
    const fromConditions = [...new Set(conditions.map((c) => c.temperature))]
      .sort((a, b) => a - b)
      .slice(0, limit);
    return fromConditions.length > 0
      ? fromConditions
      : (withGrid[0]?.grid.temperatures.slice(0, limit) ?? []);
  }, [conditionsKey, loaderData]);
  const sliceInput = sliceText ?? defaultSlices.map(formatPlain).join(", ");
  const sliceTemperatures = useMemo(() => {
    const list = sliceInput
      .split(/[,;\s]+/)
      .filter((v) => v !== "")
      .map((v) => Number(v))
      .filter(Number.isFinite);
    return [...new Set(list)].slice(0, 6);
  }, [sliceInput]);

  const lookups = useCompareLookups(
    withGrid,
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
  const reference = withGrid.find((s) => s.id === referenceId) ?? withGrid[0];
  const others = withGrid.filter((s) => s !== reference);

  const submit = useSubmit();
  const busy = navigation.state !== "idle";
  const chosenIds = selected.map((s) => s.id);
  const [search, setSearch] = useState("");
  // text typed before the page became interactive is picked up once it is
  const searchRef = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (searchRef.current?.value) setSearch(searchRef.current.value);
  }, []);
  const needle = search.trim().toLowerCase();
  const matches = (s: (typeof samples)[number]) =>
    !needle || `${s.label} ${s.field} ${s.well}`.toLowerCase().includes(needle);
  const matchCount = samples.filter(matches).length;
  const propertyName = PROPERTIES[property].short;
  const missing = selected.filter((s) => s.grid === null);

  return (
    <>
      <PageHeader title="Compare">
        Two to four samples side by side: one property on overlaid pressure
        slices and 3D surfaces, and a table of values at the conditions you
        choose, with their relative differences.
      </PageHeader>

      <Form
        method="get"
        className="mb-8 grid gap-6 rounded-lg border border-line bg-panel p-5 md:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]"
        onChange={(event) => {
          const target = event.target;
          if (
            (target instanceof HTMLInputElement ||
              target instanceof HTMLSelectElement) &&
            ["samples", "property", "units"].includes(target.name)
          )
            submit(event.currentTarget, {
              preventScrollReset: true,
              replace: true,
            });
        }}
      >
        <fieldset>
          <legend className="text-sm font-semibold">
            Samples (choose two to four)
          </legend>
          <label className="mt-2 block">
            <span className="sr-only">Find samples</span>
            <input
              ref={searchRef}
              type="search"
              value={search}
              onChange={(e) => setSearch(e.target.value)}
              placeholder="Find by sample, field or well"
              aria-label="Find samples"
              className="block w-full rounded border border-line bg-panel px-3 py-2 text-sm focus:border-accent focus:outline-2 focus:outline-accent/30"
            />
          </label>
          <ul
            className="mt-2 max-h-56 divide-y divide-line overflow-y-auto rounded border border-line"
            aria-label="Samples"
          >
            {samples.map((s) => {
              const checked = chosenIds.includes(s.id);
              const disabled =
                s.approvedRevision === null ||
                (!checked && chosenIds.length >= MAX_SAMPLES);
              // samples filtered out by the search stay in the form (hidden), so a choice survives a search
              return (
                <li key={s.id} hidden={!matches(s)}>
                  <label
                    className={`flex items-center gap-3 px-3 py-2 text-sm ${disabled ? "text-ink-muted" : "cursor-pointer hover:bg-surface"}`}
                  >
                    <input
                      type="checkbox"
                      name="samples"
                      value={s.id}
                      defaultChecked={checked}
                      key={`${s.id}-${checked}`}
                      disabled={disabled}
                      className="h-4 w-4 accent-accent"
                    />
                    <span className="font-semibold">{s.label}</span>
                    <span className="text-ink-muted">
                      {s.field} · {s.well}
                    </span>
                    <span className="ml-auto text-xs text-ink-muted">
                      {s.approvedRevision === null
                        ? "no approved revision"
                        : s.properties.includes(property)
                          ? `revision ${s.approvedRevision}`
                          : `no ${propertyName}`}
                    </span>
                  </label>
                </li>
              );
            })}
            {matchCount === 0 ? (
              <li className="px-3 py-3 text-sm text-ink-muted">
                No sample matches “{search}”.
              </li>
            ) : null}
          </ul>
          <p className="mt-1 text-xs text-ink-muted" aria-live="polite">
            {chosenIds.length} of at most {MAX_SAMPLES} chosen
            {chosenIds.length >= MAX_SAMPLES
              ? "; clear one to choose another"
              : ""}
            .
          </p>
        </fieldset>
        <div className="flex flex-col gap-4">
          <label className="block">
            <span className="block text-sm font-semibold">Property</span>
            <select
              name="property"
              defaultValue={property}
              key={property}
              className="mt-1 block w-full rounded border border-line bg-panel px-3 py-2 text-sm"
            >
              {PROPERTY_KEYS.map((key) => (
                <option key={key} value={key}>
                  {capitalise(PROPERTIES[key].phrase)}
                </option>
              ))}
            </select>
          </label>
          <fieldset>
            <legend className="text-sm font-semibold">Units</legend>
            <div className="mt-1 flex gap-4 text-sm">
              {OUTPUT_SYSTEMS.map((system) => (
                <label key={system} className="flex items-center gap-2">
                  <input
                    type="radio"
                    name="units"
                    value={system}
                    defaultChecked={units.system === system}
                    key={`${system}-${units.system}`}
                    className="accent-accent"
                  />
                  {system === "field"
                    ? "Field (psia, °F)"
                    : "Metric (bara, °C)"}
                </label>
              ))}
            </div>
          </fieldset>
          <div className="flex items-center gap-3">
            <Button type="submit" variant="secondary">
              Compare
            </Button>
            {busy ? (
              <span role="status" className="text-sm text-ink-muted">
                Loading the samples…
              </span>
            ) : null}
          </div>
        </div>
      </Form>

      {missing.length > 0 ? (
        <p className="mb-4 rounded border border-caution/30 bg-caution-soft px-3 py-2 text-sm text-caution">
          {missing.map((s) => s.label).join(", ")}:{" "}
          {missing.length === 1 ? "has" : "have"} no approved{" "}
          {PROPERTIES[property].phrase} grid, so{" "}
          {missing.length === 1 ? "it is" : "they are"} left out below.
        </p>
      ) : null}

      {withGrid.length < 2 ? (
        <div className="rounded-lg border border-dashed border-line bg-panel px-6 py-10 text-center text-ink-muted">
          {withGrid.length === 0
            ? "Choose two to four samples to compare."
            : "Choose at least one more sample with this property to compare."}
        </div>
      ) : null}

      {withGrid.length >= 1 ? (
        <>
          <section aria-labelledby="values-heading" className="mb-10">
            <h2 id="values-heading" className="text-lg font-bold">
              {propertyName} at chosen conditions
            </h2>
            <div className="mt-3 grid gap-6 rounded-lg border border-line bg-panel p-5 md:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
              <div>
                <label
                  htmlFor="compare-conditions"
                  className="block text-sm font-semibold"
                >
                  Conditions
                </label>
                <textarea
                  id="compare-conditions"
                  value={conditionsText}
                  onChange={(e) => setConditionsText(e.target.value)}
                  rows={4}
                  spellCheck={false}
                  aria-describedby="conditions-hint conditions-error"
                  aria-invalid={
                    !parsed.ok && conditionsText.trim() !== ""
                      ? true
                      : undefined
                  }
                  className="mt-1 block w-full rounded border border-line bg-panel px-3 py-2 font-mono text-sm tabular-nums focus:border-accent focus:outline-2 focus:outline-accent/30 aria-invalid:border-danger"
                />
                <span
                  id="conditions-hint"
                  className="mt-1 block text-xs text-ink-muted"
                >
                  One per line: pressure ({units.pressure}) and temperature (
                  {units.temperature}), separated by a comma, tab or space.
                  Pasting from a spreadsheet works.
                </span>
                {!parsed.ok && conditionsText.trim() !== "" ? (
                  <span
                    id="conditions-error"
                    role="alert"
                    className="mt-1 block text-sm text-danger"
                  >
                    {parsed.error}
                  </span>
                ) : null}
                {parsed.ok &&
                parsed.conditions.length > MAX_TABLE_CONDITIONS ? (
                  <span className="mt-1 block text-sm text-caution">
                    Only the first {MAX_TABLE_CONDITIONS} conditions are
                    compared.
                  </span>
                ) : null}
              </div>
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
                    onChange={(e) => setThreshold(e.target.value)}
                    aria-invalid={thresholdOk ? undefined : true}
                    className="mt-1 block w-32 rounded border border-line bg-panel px-3 py-2 text-sm tabular-nums aria-invalid:border-danger"
                  />
                </label>
                {withGrid.length > 1 ? (
                  <label className="block">
                    <span className="block text-sm font-semibold">
                      Differences relative to
                    </span>
                    <select
                      value={reference?.id ?? ""}
                      onChange={(e) => setReferenceId(Number(e.target.value))}
                      className="mt-1 block w-full max-w-xs rounded border border-line bg-panel px-3 py-2 text-sm"
                    >
                      {withGrid.map((s) => (
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
                    onChange={(e) => setExtrapolate(e.target.checked)}
                    className="mt-0.5 h-4 w-4 accent-accent"
                  />
                  <span>
                    Extrapolate outside a sample&apos;s measured range (values
                    are flagged)
                  </span>
                </label>
              </div>
            </div>
            <div className="mt-4">
              <ValuesTable
                conditions={conditions}
                samples={withGrid}
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

          <section aria-labelledby="surfaces-heading" className="mb-10">
            <div className="flex flex-wrap items-end justify-between gap-3">
              <div>
                <h2 id="surfaces-heading" className="text-lg font-bold">
                  {propertyName} over pressure and temperature
                </h2>
                <p className="text-sm text-ink-muted">
                  Interpolated (automatic method) over each sample&apos;s
                  measured range; dots are measured values, diamonds your
                  conditions
                  {series.length > 1 ? "; drag to turn, scroll to zoom" : ""}.
                </p>
              </div>
              {series.length > 1 ? (
                <fieldset
                  className="flex rounded border border-line bg-panel p-0.5 text-sm"
                  aria-label="Surface arrangement"
                >
                  {(["overlaid", "side-by-side"] as const).map((a) => (
                    <label
                      key={a}
                      className={`cursor-pointer rounded px-3 py-1.5 font-semibold ${arrangement === a ? "bg-accent-soft text-accent-strong" : "text-ink-muted hover:text-ink"}`}
                    >
                      <input
                        type="radio"
                        name="arrangement"
                        value={a}
                        checked={arrangement === a}
                        onChange={() => setArrangement(a)}
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
              units={plotUnits}
              method="auto"
              queryPoints={queryPoints}
              arrangement={arrangement}
              onReady={() => setSurfaceReady(true)}
            />
          </section>

          <section aria-labelledby="slices-heading" className="mb-4">
            <div className="flex flex-wrap items-end justify-between gap-3">
              <div>
                <h2 id="slices-heading" className="text-lg font-bold">
                  {propertyName} against pressure
                </h2>
                <p className="text-sm text-ink-muted">
                  Curves interpolated at fixed temperatures; markers are
                  measured values where the temperature was measured.
                </p>
              </div>
              <label className="block">
                <span className="block text-sm font-semibold">
                  Slice temperatures ({units.temperature})
                </span>
                <input
                  value={sliceInput}
                  onChange={(e) => setSliceText(e.target.value)}
                  className="mt-1 block w-56 rounded border border-line bg-panel px-3 py-2 text-sm tabular-nums"
                />
              </label>
            </div>
            {surfaceReady ? (
              <PropertySlices
                className="mt-3"
                series={series}
                valueLabel={propertyName}
                units={plotUnits}
                method="auto"
                queryPoints={queryPoints}
                temperatures={sliceTemperatures}
              />
            ) : (
              <PlotPlaceholder
                className="mt-3"
                text="Loading the pressure slices…"
                height={420}
              />
            )}
          </section>
        </>
      ) : null}
    </>
  );
}

function ValuesTable({
  conditions,
  samples,
  reference,
  others,
  units,
  propertyName,
  lookups,
  threshold,
}: {
  conditions: Condition[];
  samples: (Selected & { revision: number })[];
  reference: Selected | undefined;
  others: Selected[];
  units: Units;
  propertyName: string;
  lookups: CompareLookups;
  threshold: number | null;
}) {
  if (conditions.length === 0) {
    return (
      <p className="rounded border border-dashed border-line bg-panel px-4 py-6 text-sm text-ink-muted">
        Enter at least one pressure and temperature.
      </p>
    );
  }
  const cellOf = (id: number, k: number) => lookups.cells[id]?.[k];
  return (
    <div>
      <div className="relative w-fit max-w-full overflow-x-auto rounded-lg border border-line bg-panel">
        <table
          className="text-sm"
          aria-label={`${propertyName} by sample`}
          aria-busy={lookups.status === "loading"}
        >
          <thead className="bg-surface text-ink-muted">
            <tr className="text-xs">
              <td colSpan={3} />
              <th
                scope="colgroup"
                colSpan={samples.length}
                className="border-l border-line px-3 pt-2 text-center font-semibold"
              >
                {propertyName}
              </th>
              {reference && others.length > 0 ? (
                <th
                  scope="colgroup"
                  colSpan={others.length}
                  className="border-l border-line px-3 pt-2 text-center font-semibold"
                >
                  Difference
                </th>
              ) : null}
            </tr>
            <tr>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                Point
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Pressure ({units.pressure})
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Temperature ({units.temperature})
              </th>
              {samples.map((s) => (
                <th
                  key={s.id}
                  scope="col"
                  className="px-3 py-2 text-right font-semibold whitespace-nowrap"
                >
                  <span className="block text-ink">{s.label}</span>
                  <span className="block text-xs font-normal">
                    {units.value ? `${units.value} · ` : ""}rev.{" "}
                    {lookups.revision[s.id] ?? s.revision}
                  </span>
                </th>
              ))}
              {reference
                ? others.map((s) => (
                    <th
                      key={`d${s.id}`}
                      scope="col"
                      className="px-3 py-2 text-right font-semibold whitespace-nowrap"
                    >
                      <span className="block text-ink">{s.label}</span>
                      <span className="block text-xs font-normal">
                        vs {reference.label}, %
                      </span>
                    </th>
                  ))
                : null}
            </tr>
          </thead>
          <tbody>
            {conditions.map((c, k) => {
              const ref = reference ? cellOf(reference.id, k) : undefined;
              return (
                <tr key={k} className="border-t border-line">
                  <th scope="row" className="px-3 py-2 text-left font-semibold">
                    Q{k + 1}
                  </th>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {formatPlain(c.pressure)}
                  </td>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {formatPlain(c.temperature)}
                  </td>
                  {samples.map((s) => (
                    <ValueCell
                      key={s.id}
                      cell={cellOf(s.id, k)}
                      loading={lookups.status === "loading"}
                    />
                  ))}
                  {reference
                    ? others.map((s) => (
                        <DifferenceCell
                          key={`d${s.id}`}
                          reference={ref}
                          other={cellOf(s.id, k)}
                          threshold={threshold}
                          loading={lookups.status === "loading"}
                        />
                      ))
                    : null}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {lookups.status === "error" ? (
        <p role="alert" className="mt-2 text-sm text-danger">
          The values could not be looked up: {lookups.error}
        </p>
      ) : null}
      <p className="mt-2 text-xs text-ink-muted">
        Values from the lookup service with the automatic method (Newton, cubic
        in each direction, with the shape-preserving pchip value where Newton
        overshoots); ± is the estimated interpolation error. Differences are
        (sample − reference) / reference.
        {threshold !== null
          ? ` Differences beyond ${formatPlain(threshold)} % are highlighted and marked ▲.`
          : " Enter a threshold of 0 % or more to highlight differences."}
      </p>
    </div>
  );
}

function ValueCell({
  cell,
  loading,
}: {
  cell: CompareCell | undefined;
  loading: boolean;
}) {
  if (!cell)
    return (
      <td className="px-3 py-2 text-right text-ink-muted">
        {loading ? "…" : "—"}
      </td>
    );
  if (cell.kind === "none") {
    return (
      <td
        className="px-3 py-2 text-right align-top text-ink-muted"
        title={`No value: ${cell.reason}.`}
      >
        —
        <span className="block text-xs whitespace-nowrap">
          {cell.reason === "outside the measured range"
            ? "outside the range"
            : "no value"}
        </span>
      </td>
    );
  }
  const flags = cell.warnings.filter((w) => w !== "degree-reduced");
  return (
    <td
      className="px-3 py-2 text-right align-top tabular-nums"
      data-testid="compare-value"
    >
      <span className="font-semibold">{formatCompared(cell.value ?? NaN)}</span>
      <span className="block text-xs whitespace-nowrap text-ink-muted">
        ± {formatErrorEstimate(cell.errorEstimate ?? NaN)}
      </span>
      {cell.outsideRange || flags.length > 0 ? (
        <span className="mt-0.5 flex flex-wrap justify-end gap-1">
          {cell.outsideRange ? (
            <span
              className="rounded bg-caution-soft px-1.5 text-xs font-semibold text-caution"
              title="Outside the sample's measured pressure–temperature range: an extrapolation."
            >
              extrapolated
            </span>
          ) : null}
          {flags
            .filter((w) => !(w === "extrapolated" && cell.outsideRange))
            .map((w) => (
              <span
                key={w}
                className={`rounded px-1.5 text-xs ${SERIOUS_WARNINGS.has(w) ? "bg-caution-soft font-semibold text-caution" : "bg-surface text-ink-muted"}`}
                title={isLookupWarning(w) ? describeWarningCode(w) : w}
              >
                {w === "extrapolated"
                  ? "beyond the measured envelope"
                  : warningLabel(w)}
              </span>
            ))}
        </span>
      ) : null}
    </td>
  );
}

function DifferenceCell({
  reference,
  other,
  threshold,
  loading,
}: {
  reference: CompareCell | undefined;
  other: CompareCell | undefined;
  threshold: number | null;
  loading: boolean;
}) {
  if (!reference || !other)
    return (
      <td className="px-3 py-2 text-right text-ink-muted">
        {loading ? "…" : "—"}
      </td>
    );
  if (
    reference.kind !== "value" ||
    other.kind !== "value" ||
    reference.value === null ||
    other.value === null ||
    reference.value === 0
  )
    return <td className="px-3 py-2 text-right text-ink-muted">—</td>;
  const pct =
    ((other.value - reference.value) / Math.abs(reference.value)) * 100;
  const exceeds = threshold !== null && Math.abs(pct) > threshold;
  const flagged =
    reference.outsideRange ||
    other.outsideRange ||
    reference.warnings.includes("extrapolated") ||
    other.warnings.includes("extrapolated");
  return (
    <td
      className={`px-3 py-2 text-right align-top tabular-nums ${exceeds ? "bg-caution-soft font-bold text-caution" : ""}`}
      data-testid="compare-difference"
      data-exceeds={exceeds ? "true" : "false"}
      title={
        flagged ? "At least one of the two values is extrapolated." : undefined
      }
    >
      {exceeds ? (
        <span aria-hidden="true" className="mr-1">
          ▲
        </span>
      ) : null}
      {formatDifference(pct)}
      {exceeds ? (
        <span className="sr-only"> (beyond the threshold)</span>
      ) : null}
      {flagged ? (
        <span className="block text-xs font-normal text-caution">
          from an extrapolated value
        </span>
      ) : null}
    </td>
  );
}

function defaultConditionsText(data: LoaderData): string {
  const pairs: string[] = [];
  for (const s of data.selected) {
    const info = data.samples.find((x) => x.id === s.id);
    if (
      !info ||
      info.reservoirPressure === null ||
      info.reservoirTemperature === null
    )
      continue;
    const line = `${formatSignificant(info.reservoirPressure, 4)}, ${formatSignificant(info.reservoirTemperature, 4)}`;
    if (!pairs.includes(line)) pairs.push(line);
  }
  return pairs.join("\n");
}

function convertConditionsText(
  text: string,
  from: OutputSystem,
  to: OutputSystem,
): string {
  const parsed = parseConditionList(text);
  if (!parsed.ok || from === to) return text;
  return parsed.conditions
    .map((c) => {
      const p = convertBetweenSystems(
        c.pressure,
        "pressure",
        outputUnitSystem(from),
        outputUnitSystem(to),
      );
      const t = convertBetweenSystems(
        c.temperature,
        "temperature",
        outputUnitSystem(from),
        outputUnitSystem(to),
      );
      return `${formatPressure(p)}, ${formatTemperature(t)}`;
    })
    .join("\n");
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
