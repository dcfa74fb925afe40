/*
 * The conditions box of the compare page as text: what it holds when the page opens, and the same conditions
 * written in another unit system. Pure; numbers come from app/core/format.
 */
import {
  formatPressure,
  formatSignificant,
  formatTemperature,
} from "~/core/format";
import {
  convertBetweenSystems,
  outputUnitSystem,
  type OutputSystem,
} from "~/core/units";
import { parseConditionList } from "~/utils/conditions";
import type { CompareView } from "./types";

/** One line per chosen sample with a reservoir pressure and temperature ("5000, 220"), without repeats. */
export function defaultConditionsText(
  view: Pick<CompareView, "samples" | "selected">,
): string {
  const pairs: string[] = [];
  for (const s of view.selected) {
    const info = view.samples.find((x) => x.id === s.id);
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

/** The conditions of `text` converted from one unit system to another; text that does not parse is kept. */
export function convertConditionsText(
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
