/**
 * Numbers in QC messages, shown in the units the file used (values are canonical inside). The digits follow
 * the reading format of app/core/format.
 */
import { formatReading, formatReadingPair } from "../../format";
import {
  fromCanonical,
  getUnit,
  type Quantity,
  type UnitId,
} from "../../units";
import type { UnitRef } from "../types";

export const CANONICAL_REFS: Readonly<
  Record<"pressure" | "temperature", UnitRef>
> = {
  pressure: { quantity: "pressure", id: "psia", symbol: "psia", label: "psia" },
  temperature: {
    quantity: "temperature",
    id: "degF",
    symbol: "°F",
    label: "°F",
  },
};

/** Convert a canonical value to the unit of `ref` for display (falls back to canonical on any problem). */
function toDisplay(
  value: number,
  ref: UnitRef | undefined,
  barometricPsia?: number,
): { value: number; symbol: string } {
  if (!ref) return { value, symbol: "" };
  try {
    const def = getUnit(ref.quantity, ref.id);
    const shown = fromCanonical(
      value,
      ref.quantity as Quantity,
      ref.id as UnitId<Quantity>,
      {
        ...(barometricPsia !== undefined ? { barometricPsia } : {}),
      },
    );
    return { value: shown, symbol: def.symbol };
  } catch {
    return { value, symbol: ref.symbol };
  }
}

export function withUnit(
  value: number,
  ref: UnitRef | undefined,
  barometricPsia?: number,
  digits = 4,
): string {
  const d = toDisplay(value, ref, barometricPsia);
  const text = formatReading(d.value, digits);
  return d.symbol === "" || d.symbol === "–" ? text : `${text} ${d.symbol}`;
}

/** Two values of one unit, distinguishable: ["1.4416 rb/STB", "1.4412 rb/STB"]. */
export function pairWithUnit(
  a: number,
  b: number,
  ref: UnitRef | undefined,
  barometricPsia?: number,
): [string, string] {
  const da = toDisplay(a, ref, barometricPsia);
  const db = toDisplay(b, ref, barometricPsia);
  const [fa, fb] = formatReadingPair(da.value, db.value);
  const suffix = da.symbol === "" || da.symbol === "–" ? "" : ` ${da.symbol}`;
  return [`${fa}${suffix}`, `${fb}${suffix}`];
}
