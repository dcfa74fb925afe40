import {
  outputPressureUnit,
  type OutputSystem,
  type PressureBasis,
  PROPERTIES,
  PROPERTY_KEYS,
  unitLabel,
} from "~/core/units";
import type { LookupFormState, LookupMethodChoice } from "./use-lookup-form";

/** What to look up and how: the properties (those the sample lacks disabled), method and degree, units, extrapolation. */
export function LookupOptions({
  form,
  onUnitsChange,
  onMakeDefault,
}: {
  form: LookupFormState;
  onUnitsChange: (units: OutputSystem) => void;
  onMakeDefault: (() => void) | null;
}) {
  const { sample, properties, method, degree, units } = form;
  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-semibold">Properties</legend>
      <div className="grid grid-cols-1 gap-1 text-sm">
        {PROPERTY_KEYS.map((p) => (
          <label
            key={p}
            className={`flex items-center gap-2 ${sample && !sample.properties.includes(p) ? "text-ink-muted" : ""}`}
          >
            <input
              type="checkbox"
              checked={properties.includes(p)}
              disabled={!!sample && !sample.properties.includes(p)}
              onChange={(e) =>
                form.setProperties(
                  e.target.checked
                    ? [...properties, p]
                    : properties.filter((x) => x !== p),
                )
              }
            />
            {PROPERTIES[p].phrase}
          </label>
        ))}
      </div>
      <div className="flex flex-wrap gap-4 text-sm">
        <label className="flex max-w-full min-w-0 flex-col gap-1">
          <span className="font-semibold">Method</span>
          <select
            value={method}
            onChange={(e) =>
              form.setMethod(e.target.value as LookupMethodChoice)
            }
            className="max-w-full rounded border border-line px-2 py-1"
          >
            <option value="auto">
              Automatic (Newton [3,3], pchip where it overshoots)
            </option>
            <option value="newton">Newton, degree per axis</option>
            <option value="pchip">pchip (shape-preserving)</option>
            <option value="linear">Linear</option>
          </select>
        </label>
        {method === "newton" ? (
          <div className="flex gap-2">
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Degree in p</span>
              <input
                type="number"
                min={1}
                max={6}
                value={degree[0]}
                onChange={(e) =>
                  form.setDegree([Number(e.target.value), degree[1]])
                }
                className="w-20 rounded border border-line px-2 py-1"
              />
            </label>
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Degree in T</span>
              <input
                type="number"
                min={1}
                max={6}
                value={degree[1]}
                onChange={(e) =>
                  form.setDegree([degree[0], Number(e.target.value)])
                }
                className="w-20 rounded border border-line px-2 py-1"
              />
            </label>
          </div>
        ) : null}
      </div>
      <fieldset className="text-sm">
        <legend className="font-semibold">Units</legend>
        <div className="mt-1 flex gap-4">
          <label className="flex items-center gap-2">
            <input
              type="radio"
              name="units"
              checked={units === "field"}
              onChange={() => onUnitsChange("field")}
            />{" "}
            {`Field (${systemUnits("field")})`}
          </label>
          <label className="flex items-center gap-2">
            <input
              type="radio"
              name="units"
              checked={units === "metric"}
              onChange={() => onUnitsChange("metric")}
            />{" "}
            {`Metric (${systemUnits("metric")})`}
          </label>
        </div>
        <DefaultUnits form={form} onMakeDefault={onMakeDefault} />
      </fieldset>
      <label className="block text-sm">
        <span className="font-semibold">Pressures</span>
        <select
          value={form.pressureBasis}
          onChange={(e) =>
            form.setPressureBasis(e.target.value as PressureBasis)
          }
          className="mt-1 block w-full max-w-full rounded border border-line px-2 py-1"
        >
          <option value="absolute">{`Absolute (${outputPressureUnit(units, "absolute").symbol})`}</option>
          <option value="gauge">
            {`Gauge (${outputPressureUnit(units, "gauge").symbol}, with the sample's barometric pressure)`}
          </option>
        </select>
      </label>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={form.extrapolate}
          onChange={(e) => form.setExtrapolate(e.target.checked)}
        />{" "}
        Allow extrapolation beyond the measured range (flagged)
      </label>
    </fieldset>
  );
}

/**
 * The page's unit system is its own (in its address); the account's changes only here, when asked: "Your
 * default", or a button that makes the page's system the default.
 */
function DefaultUnits({
  form,
  onMakeDefault,
}: {
  form: LookupFormState;
  onMakeDefault: (() => void) | null;
}) {
  if (form.units === form.accountUnits)
    return <p className="mt-1 text-xs text-ink-muted">Your default units.</p>;
  return (
    <p className="mt-1 flex flex-wrap items-center gap-2 text-xs text-ink-muted">
      Your default is {form.accountUnits}.
      <button
        type="button"
        onClick={onMakeDefault ?? undefined}
        disabled={!onMakeDefault}
        className="rounded border border-line px-2 py-0.5 font-semibold text-ink hover:border-accent disabled:opacity-60"
      >
        Make {form.units} my default
      </button>
    </p>
  );
}

/** "psia, °F": the units conditions are typed in, in a system. */
const systemUnits = (system: OutputSystem) =>
  `${unitLabel(system, "pressure")}, ${unitLabel(system, "temperature")}`;
