/**
 * Conditions typed or pasted by a person: one pair, a list from a spreadsheet, or a depletion path (a pressure
 * range with a step at one temperature). Pure and client-safe; numbers stay in the unit system on screen.
 */
import { roundSignificant } from "~/core/format";
export type Condition = { pressure: number; temperature: number };
export type ParsedConditions =
  { ok: true; conditions: Condition[] } | { ok: false; error: string };

const MAX_CONDITIONS = 10_000;

/** A number as people type it: "3250", "3,250.5", "3250,5" (decimal comma when unambiguous), "1e3". */
export function parseNumber(text: string): number | null {
  let t = text.trim().replace(/\s/g, "");
  if (t === "") return null;
  if (/^-?\d{1,3}(,\d{3})+(\.\d+)?$/.test(t)) t = t.replace(/,/g, "");
  else if (/^-?\d+,\d+$/.test(t)) t = t.replace(",", ".");
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/**
 * Lines of "pressure, temperature" separated by a tab, semicolon, comma or spaces; a header line of words is
 * skipped. Decimal commas are accepted when the separator is a tab or semicolon.
 */
export function parseConditionList(text: string): ParsedConditions {
  const conditions: Condition[] = [];
  const lines = text.split(/\r?\n/);
  for (const [i, raw] of lines.entries()) {
    const line = raw.trim();
    if (!line) continue;
    const parts = line.includes("\t")
      ? line.split("\t")
      : line.includes(";")
        ? line.split(";")
        : /\d,\s*\d/.test(line) && !/\d,\d{3}\b/.test(line)
          ? line.split(",")
          : line.split(/\s+/);
    const cells = parts.map((p) => p.trim()).filter((p) => p !== "");
    if (
      conditions.length === 0 &&
      cells.length > 0 &&
      cells.every((c) => /[a-z]/i.test(c) && parseNumber(c) === null)
    )
      continue; // header
    if (cells.length !== 2)
      return {
        ok: false,
        error: `Line ${i + 1} (“${line}”) should hold two numbers: pressure and temperature.`,
      };
    const pressure = parseNumber(cells[0]!);
    const temperature = parseNumber(cells[1]!);
    if (pressure === null)
      return {
        ok: false,
        error: `Line ${i + 1}: “${cells[0]}” is not a number (pressure).`,
      };
    if (temperature === null)
      return {
        ok: false,
        error: `Line ${i + 1}: “${cells[1]}” is not a number (temperature).`,
      };
    conditions.push({ pressure, temperature });
    if (conditions.length > MAX_CONDITIONS)
      return {
        ok: false,
        error: `At most ${MAX_CONDITIONS} conditions at a time.`,
      };
  }
  if (conditions.length === 0)
    return {
      ok: false,
      error: "Paste at least one line with a pressure and a temperature.",
    };
  return { ok: true, conditions };
}

/** Pressures from `from` to `to` (inclusive when the step lands on it) every `step`, at one temperature. */
export function depletionPath(
  from: number,
  to: number,
  step: number,
  temperature: number,
): ParsedConditions {
  if (![from, to, step, temperature].every(Number.isFinite))
    return { ok: false, error: "Fill in every number of the path." };
  if (step <= 0) return { ok: false, error: "The step must be positive." };
  const count = Math.floor(Math.abs(to - from) / step + 1e-9) + 1;
  if (count > MAX_CONDITIONS)
    return {
      ok: false,
      error: `That path has ${count} points; at most ${MAX_CONDITIONS}.`,
    };
  const dir = to >= from ? 1 : -1;
  const conditions = Array.from({ length: count }, (_, k) => ({
    pressure: roundSignificant(from + dir * k * step, 12),
    temperature,
  }));
  return { ok: true, conditions };
}
