import { Form } from "react-router";
import { Button } from "~/components/form";
import type { OutputSystem, PropertyKey } from "~/core/units";

/** A saved lookup set as this list shows and loads it (conditions in canonical units, psia and °F; its settings). */
export type SavedLookupSet = {
  id: number;
  name: string;
  sampleId: number;
  sampleLabel: string;
  properties: PropertyKey[];
  conditions: { pressurePsia: number; temperatureF: number }[];
  method: string;
  degree: number | [number, number] | null;
  /** The unit system it was saved in; its runs are shown in it. */
  units: OutputSystem;
  extrapolate: boolean;
};

/** "Your lookup sets": each with Load (into the form), its runs and Delete. Nothing when there are none. */
export function SavedSets({
  sets,
  onLoad,
}: {
  sets: SavedLookupSet[];
  onLoad: (set: SavedLookupSet) => void;
}) {
  if (sets.length === 0) return null;
  return (
    <section
      className="mt-6 rounded-lg border border-line bg-panel p-5"
      aria-labelledby="sets-title"
    >
      <h2 id="sets-title" className="font-semibold">
        Your lookup sets
      </h2>
      <ul className="mt-2 divide-y divide-line text-sm">
        {sets.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center gap-3 py-2">
            <span className="font-semibold">{s.name}</span>
            <span className="text-ink-muted">
              {s.sampleLabel} · {s.conditions.length} conditions ·{" "}
              {s.properties.length} properties · {s.method} · extrapolation{" "}
              {s.extrapolate ? "on" : "off"} · {s.units}
            </span>
            <span className="ml-auto flex gap-2">
              <Button
                type="button"
                variant="secondary"
                className="px-2 py-1"
                onClick={() => onLoad(s)}
              >
                Load
              </Button>
              <a
                href={`/lookup/sets/${s.id}`}
                className="rounded border border-line px-2 py-1 font-semibold hover:border-accent"
              >
                Runs
              </a>
              <Form method="post">
                <input type="hidden" name="setId" value={s.id} />
                <Button
                  type="submit"
                  name="intent"
                  value="delete-set"
                  variant="danger"
                  className="px-2 py-1"
                  aria-label={`Delete ${s.name}`}
                >
                  Delete
                </Button>
              </Form>
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
