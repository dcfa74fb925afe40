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
 * "3,250" (one to three digits, then groups of exactly three after commas, no decimal point): a thousands
 * separator or a decimal comma? 3250 or 3.25. A pasted list refuses it rather than guess.
 */
const AMBIGUOUS_COMMA = /^[-+]?\d{1,3}(,\d{3})+$/;

/** One cell of a pasted list: a number, or why not. */
function readCell(cell: string): number | "ambiguous" | null {
  if (AMBIGUOUS_COMMA.test(cell.replace(/\s/g, ""))) return "ambiguous";
  return parseNumber(cell);
}

/** A plain number without a comma, as the cells of a comma-separated line are ("3250", "-1.5e3"). */
const PLAIN_NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/**
 * The cells of one line: split on tabs when there is one, else on semicolons, else on a comma that separates
 * two plain numbers ("3250,212", "3250, 212"), else on spaces (where a cell may hold a decimal comma:
 * "3250,5 212"). Null for a line whose commas could both separate and group ("3,250,212", "3,250, 212").
 */
function cellsOf(line: string): string[] | null {
  let parts: string[];
  if (line.includes("\t")) parts = line.split("\t");
  else if (line.includes(";")) parts = line.split(";");
  else {
    const byComma = line.split(",");
    if (
      byComma.length === 2 &&
      byComma.every((p) => PLAIN_NUMBER.test(p.trim()))
    )
      parts = byComma;
    else if (
      byComma.length > 2 &&
      byComma.every((p) => /^\s*[-+]?[\d.]+\s*$/.test(p))
    )
      return null;
    else parts = line.split(/\s+/);
  }
  return parts.map((p) => p.trim()).filter((p) => p !== "");
}

/** "3,250": 3250 with a thousands separator, or 3.25 with a decimal comma (only when there is one comma). */
function readings(cell: string): string {
  const grouped = cell.replace(/,/g, "");
  return (cell.match(/,/g) ?? []).length === 1
    ? `${grouped} (a thousands separator) or ${cell.replace(",", ".")} (a decimal comma)`
    : `${grouped} (thousands separators)`;
}

/**
 * Lines of "pressure, temperature" separated by a tab, semicolon, comma or spaces; a header line of words is
 * skipped. Decimal commas ("224,1") are accepted in cells separated by tabs, semicolons or spaces. A comma that
 * could be a thousands separator ("3,250" in a cell, "3,250,212" on a line) is refused with the line (counted
 * from 1) and its text, rather than read as 3250 or 3.25 by a guess.
 */
export function parseConditionList(text: string): ParsedConditions {
  const conditions: Condition[] = [];
  const lines = text.split(/\r?\n/);
  for (const [i, raw] of lines.entries()) {
    const line = raw.trim();
    if (!line) continue;
    const where = `Line ${i + 1} (“${line}”)`;
    const cells = cellsOf(line);
    if (cells === null)
      return {
        ok: false,
        error: `${where}: its commas could separate the two numbers or group thousands. Write each number without a thousands separator and separate the two with one comma, a tab or a semicolon (e.g. “3250, 212”).`,
      };
    if (
      conditions.length === 0 &&
      cells.length > 0 &&
      cells.every(
        (c) =>
          /[a-z]/i.test(c) && !/^[-+.\d]/.test(c) && parseNumber(c) === null,
      )
    )
      continue; // header
    const ambiguous = cells.find((c) => readCell(c) === "ambiguous");
    if (ambiguous !== undefined)
      return {
        ok: false,
        error: `${where}: “${ambiguous}” could be ${readings(ambiguous)}. Write it without a thousands separator, or with a decimal point.`,
      };
    if (cells.length !== 2)
      return {
        ok: false,
        error: `${where} should hold two numbers: pressure and temperature.`,
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
