/**
 * Numbers in QC messages, shown in the units the file used (values are canonical inside).
 */
import {
  fromCanonical,
  getUnit,
  type Quantity,
  type UnitId,
} from "../../units";
import type { UnitRef } from "../types";

/** x with `digits` significant digits, trailing zeros dropped; exponent only for very large or small x. */
export function formatNumber(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const abs = Math.abs(x);
  if (abs >= 1e7 || abs < 1e-4)
    return x.toExponential(Math.max(0, digits - 1)).replace(/\.?0+e/, "e");
  const magnitude = Math.floor(Math.log10(abs));
  const decimals = Math.max(0, digits - 1 - magnitude);
  const text = x.toFixed(Math.min(decimals, 12));
  return text.includes(".") ? text.replace(/\.?0+$/, "") : text;
}

/** Two numbers with just enough digits to tell them apart (4 to 10 significant digits). */
export function formatPair(a: number, b: number): [string, string] {
  for (let d = 4; d <= 10; d++) {
    const fa = formatNumber(a, d);
    const fb = formatNumber(b, d);
    if (fa !== fb) return [fa, fb];
  }
  return [formatNumber(a, 10), formatNumber(b, 10)];
}

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
export function toDisplay(
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
  const text = formatNumber(d.value, digits);
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
  const [fa, fb] = formatPair(da.value, db.value);
  const suffix = da.symbol === "" || da.symbol === "–" ? "" : ` ${da.symbol}`;
  return [`${fa}${suffix}`, `${fb}${suffix}`];
}

export function percent(fraction: number): string {
  return `${formatNumber(fraction * 100, 2)} %`;
}

/** "+12 %" or "−7.5 %". */
export function signedPercent(fraction: number): string {
  const text = formatNumber(Math.abs(fraction) * 100, 2);
  return `${fraction < 0 ? "−" : "+"}${text} %`;
}
