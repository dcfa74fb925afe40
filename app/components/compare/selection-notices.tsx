import { PROPERTIES, type PropertyKey } from "~/core/units";
import type { CompareSelection } from "./types";

/** Chosen samples without an approved grid of the property, which the table and plots leave out. */
export function MissingGridNotice({
  missing,
  property,
}: {
  missing: CompareSelection[];
  property: PropertyKey;
}) {
  if (missing.length === 0) return null;
  return (
    <p className="mb-4 rounded border border-caution/30 bg-caution-soft px-3 py-2 text-sm text-caution">
      {missing.map((s) => s.label).join(", ")}:{" "}
      {missing.length === 1 ? "has" : "have"} no approved{" "}
      {PROPERTIES[property].phrase} grid, so{" "}
      {missing.length === 1 ? "it is" : "they are"} left out below.
    </p>
  );
}

/** What to do while fewer than two samples with the property are chosen. */
export function ChooseMoreSamples({ compared }: { compared: number }) {
  if (compared >= 2) return null;
  return (
    <div className="rounded-lg border border-dashed border-line bg-panel px-6 py-10 text-center text-ink-muted">
      {compared === 0
        ? "Choose two to four samples to compare."
        : "Choose at least one more sample with this property to compare."}
    </div>
  );
}
