import type { ParsedConditions } from "~/utils/conditions";
import type { CompareUnits } from "./types";
import { MAX_TABLE_CONDITIONS } from "./use-compare-conditions";

/** The conditions box: pressure and temperature pairs, one per line, with the parse error when there is one. */
export function ConditionsInput({
  text,
  onTextChange,
  parsed,
  units,
}: {
  text: string;
  onTextChange: (text: string) => void;
  parsed: ParsedConditions;
  units: CompareUnits;
}) {
  const invalid = !parsed.ok && text.trim() !== "";
  return (
    <div>
      <label
        htmlFor="compare-conditions"
        className="block text-sm font-semibold"
      >
        Conditions
      </label>
      <textarea
        id="compare-conditions"
        value={text}
        onChange={(e) => onTextChange(e.target.value)}
        rows={4}
        spellCheck={false}
        aria-describedby="conditions-hint conditions-error"
        aria-invalid={invalid ? true : undefined}
        className="mt-1 block w-full rounded border border-line bg-panel px-3 py-2 font-mono text-sm tabular-nums focus:border-accent focus:outline-2 focus:outline-accent/30 aria-invalid:border-danger"
      />
      <span id="conditions-hint" className="mt-1 block text-xs text-ink-muted">
        One per line: pressure ({units.pressure}) and temperature (
        {units.temperature}), separated by a comma, tab or space, without
        thousands separators. Pasting from a spreadsheet works.
      </span>
      {!parsed.ok && invalid ? (
        <span
          id="conditions-error"
          role="alert"
          className="mt-1 block text-sm text-danger"
        >
          {parsed.error}
        </span>
      ) : null}
      {parsed.ok && parsed.conditions.length > MAX_TABLE_CONDITIONS ? (
        <span className="mt-1 block text-sm text-caution">
          Only the first {MAX_TABLE_CONDITIONS} conditions are compared.
        </span>
      ) : null}
    </div>
  );
}
