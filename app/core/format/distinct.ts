/**
 * Numbers in a message that compares a value with limits ("75.00000001 °C is outside 75 to 95 °C"): the
 * value gets as many significant digits as it needs to differ in print from every limit it is compared
 * with, at least `digits` (6 unless given), at most the shortest text that reads back as the same number.
 * So a message never says "75 °C is outside 75 to 95 °C". Imports nothing (any part of app/core may use it).
 */
export function formatApart(
  x: number,
  others: readonly number[],
  digits = 6,
): string {
  if (!Number.isFinite(x)) return String(x);
  const exact = String(x);
  for (let d = digits; d <= 17; d++) {
    const text = significant(x, d);
    if (Number(text) === x) return text;
    let clash = false;
    for (const o of others)
      if (o !== x && Number.isFinite(o) && significant(o, d) === text) {
        clash = true;
        break;
      }
    if (!clash) return text;
  }
  return exact;
}

/** `x` to `d` significant digits, trailing zeros dropped, plain notation from 1e-4 to 1e15. */
function significant(x: number, d: number): string {
  if (x === 0) return "0";
  const a = Math.abs(x);
  if (a < 1e-4 || a >= 1e15) {
    const [m, e] = x.toExponential(d - 1).split("e");
    return `${trim(m!)}e${e!}`;
  }
  const text = x.toPrecision(d);
  return text.includes("e") ? String(Number(text)) : trim(text);
}

function trim(text: string): string {
  return text.includes(".") ? text.replace(/\.?0+$/, "") : text;
}
