import { useMemo, useState } from "react";
import { formatPlain } from "~/core/format";
import type { OutputSystem } from "~/core/units";
import type { Condition } from "~/utils/conditions";
import type { ComparedSample } from "./types";

/** A handful of curves stays readable: up to six in all. */
const MAX_SLICES = 6;

/**
 * The temperatures of the pressure slices: typed by the person, or by default those of the conditions (else
 * the first measured ones), up to six curves in all. A unit change drops what was typed.
 */
export function useSliceTemperatures(
  samples: ComparedSample[],
  conditions: Condition[],
  system: OutputSystem,
) {
  const [typed, setTyped] = useState<string | null>(null);
  const [typedSystem, setTypedSystem] = useState(system);
  if (typedSystem !== system) {
    setTypedSystem(system);
    setTyped(null);
  }

  const defaults = useMemo(() => {
    const limit = Math.max(
      1,
      Math.floor(MAX_SLICES / Math.max(samples.length, 1)),
    );
    const fromConditions = [...new Set(conditions.map((c) => c.temperature))]
      .sort((a, b) => a - b)
      .slice(0, limit);
    return fromConditions.length > 0
      ? fromConditions
      : (samples[0]?.grid.temperatures.slice(0, limit) ?? []);
  }, [conditions, samples]);
  const input = typed ?? defaults.map(formatPlain).join(", ");
  const temperatures = useMemo(() => {
    const list = input
      .split(/[,;\s]+/)
      .filter((v) => v !== "")
      .map((v) => Number(v))
      .filter(Number.isFinite);
    return [...new Set(list)].slice(0, MAX_SLICES);
  }, [input]);
  return { input, setInput: setTyped, temperatures };
}
