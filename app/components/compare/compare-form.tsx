import { Form, useNavigation, useSubmit } from "react-router";
import { Button } from "~/components/form";
import {
  OUTPUT_SYSTEMS,
  PROPERTIES,
  PROPERTY_KEYS,
  type OutputSystem,
  type PropertyKey,
} from "~/core/units";
import { SamplePicker } from "./sample-picker";
import type { CompareSampleOption } from "./types";

/** The fields whose change reloads the page's data at once (the query string is the page's state). */
const RELOADING_FIELDS = ["samples", "property", "units"];

/**
 * What to compare, as a GET form: the samples, the property and the unit system. Changing any of them
 * submits the form, so the page's data follow the choice without a page load.
 */
export function CompareForm({
  samples,
  chosenIds,
  property,
  system,
}: {
  samples: CompareSampleOption[];
  chosenIds: number[];
  property: PropertyKey;
  system: OutputSystem;
}) {
  const submit = useSubmit();
  const busy = useNavigation().state !== "idle";
  return (
    <Form
      method="get"
      className="mb-8 grid gap-6 rounded-lg border border-line bg-panel p-5 md:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]"
      onChange={(event) => {
        const target = event.target;
        if (
          (target instanceof HTMLInputElement ||
            target instanceof HTMLSelectElement) &&
          RELOADING_FIELDS.includes(target.name)
        )
          submit(event.currentTarget, {
            preventScrollReset: true,
            replace: true,
          });
      }}
    >
      <SamplePicker
        samples={samples}
        chosenIds={chosenIds}
        property={property}
      />
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
        <fieldset className="min-w-0">
          <legend className="text-sm font-semibold">Units</legend>
          <div className="mt-1 flex gap-4 text-sm">
            {OUTPUT_SYSTEMS.map((s) => (
              <label key={s} className="flex items-center gap-2">
                <input
                  type="radio"
                  name="units"
                  value={s}
                  defaultChecked={system === s}
                  key={`${s}-${system}`}
                  className="accent-accent"
                />
                {s === "field" ? "Field (psia, °F)" : "Metric (bara, °C)"}
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
  );
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
