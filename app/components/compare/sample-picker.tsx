import { useEffect, useRef, useState } from "react";
import { PROPERTIES, type PropertyKey } from "~/core/units";
import { MAX_COMPARED_SAMPLES } from "~/utils/compare";
import type { CompareSampleOption } from "./types";

/**
 * The samples to compare: a searchable list of checkboxes named `samples`, at most MAX_COMPARED_SAMPLES
 * checked; a sample without an approved revision cannot be chosen. Samples the search hides stay in the form,
 * so a choice survives a search.
 */
export function SamplePicker({
  samples,
  chosenIds,
  property,
}: {
  samples: CompareSampleOption[];
  chosenIds: number[];
  property: PropertyKey;
}) {
  const [search, setSearch] = useState("");
  // text typed before the page became interactive is picked up once it is
  const searchRef = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (searchRef.current?.value) setSearch(searchRef.current.value);
  }, []);
  const needle = search.trim().toLowerCase();
  const matches = (s: CompareSampleOption) =>
    !needle || `${s.label} ${s.field} ${s.well}`.toLowerCase().includes(needle);
  const matchCount = samples.filter(matches).length;
  const propertyName = PROPERTIES[property].short;

  return (
    <fieldset className="min-w-0">
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
            (!checked && chosenIds.length >= MAX_COMPARED_SAMPLES);
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
        {chosenIds.length} of at most {MAX_COMPARED_SAMPLES} chosen
        {chosenIds.length >= MAX_COMPARED_SAMPLES
          ? "; clear one to choose another"
          : ""}
        .
      </p>
    </fieldset>
  );
}
