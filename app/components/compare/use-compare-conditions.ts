import { useMemo, useState } from "react";
import type { OutputSystem } from "~/core/units";
import { parseConditionList, type Condition } from "~/utils/conditions";
import type { QueryPoint } from "~/components/plots";
import { convertConditionsText } from "./conditions-text";

/** The table compares at most this many conditions (the first ones typed). */
export const MAX_TABLE_CONDITIONS = 50;

/**
 * The conditions box: its text, what it parses to, and the conditions the table and plots use (at most
 * MAX_TABLE_CONDITIONS, labelled Q1, Q2, … on the plots). Until the person types, the box holds `defaultText`
 * (the chosen samples' reservoir conditions), so it follows the samples as they are chosen. When the unit
 * system changes, the conditions the person typed are converted instead of dropped.
 */
export function useCompareConditions(
  defaultText: string,
  system: OutputSystem,
) {
  // null until the person types: the box then shows the defaults of the samples chosen now
  const [typed, setTyped] = useState<string | null>(null);
  // the unit system the typed text is written in; adjusted while rendering, before anything uses the text
  const [typedSystem, setTypedSystem] = useState(system);
  if (typedSystem !== system) {
    setTypedSystem(system);
    if (typed !== null)
      setTyped(convertConditionsText(typed, typedSystem, system));
  }
  const text = typed ?? defaultText;

  const parsed = useMemo(() => parseConditionList(text), [text]);
  // the same conditions keep the same array, so an edit that changes no number neither redraws the plots nor
  // asks the lookup service again
  const key = JSON.stringify(
    parsed.ok ? parsed.conditions.slice(0, MAX_TABLE_CONDITIONS) : [],
  );
  const conditions = useMemo(() => JSON.parse(key) as Condition[], [key]);
  const queryPoints: QueryPoint[] = useMemo(
    () => conditions.map((c, k) => ({ ...c, label: `Q${k + 1}` })),
    [conditions],
  );
  return { text, setText: setTyped, parsed, conditions, queryPoints };
}
