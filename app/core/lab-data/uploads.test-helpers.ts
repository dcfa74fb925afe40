/**
 * Helpers shared by the lab-data tests (not used by application code).
 */
import { columnLetter } from "./cells";
import { parseUpload } from "./parse-upload";
import type {
  Finding,
  ParsedDataset,
  ParseOptions,
  ParseOutcome,
} from "./types";

export function bytesOf(text: string): Uint8Array {
  return new TextEncoder().encode(text);
}

export function parseText(
  filename: string,
  text: string,
  options?: ParseOptions,
): Promise<ParseOutcome> {
  return parseUpload({ filename, bytes: bytesOf(text) }, options);
}

/** The dataset of a successful outcome; throws with the findings otherwise (a test failure). */
export function datasetOf(outcome: ParseOutcome): ParsedDataset {
  if (!outcome.ok)
    throw new Error(
      `expected a dataset, got:\n${outcome.errors.map((e) => e.message).join("\n")}`,
    );
  return outcome.dataset;
}

/** The errors of a failed outcome; throws if it succeeded. */
export function errorsOf(outcome: ParseOutcome): readonly Finding[] {
  if (outcome.ok)
    throw new Error("expected the upload to be refused, but it was accepted");
  return outcome.errors;
}

interface Expected {
  readonly file?: string;
  readonly sheet?: string;
  readonly row?: number;
  readonly column?: number;
  readonly value?: string;
}

/**
 * Find the finding with `code` whose location matches, and check that its one sentence names the file,
 * the sheet, the row, the column letter and the quoted value.
 */
export function findingAt(
  findings: readonly Finding[],
  code: string,
  expected: Expected,
): Finding {
  const match = findings.find(
    (f) =>
      f.code === code &&
      (expected.row === undefined || f.location?.row === expected.row) &&
      (expected.column === undefined ||
        f.location?.column === expected.column) &&
      (expected.sheet === undefined || f.location?.sheet === expected.sheet),
  );
  if (!match) {
    throw new Error(
      `no ${code} finding at ${JSON.stringify(expected)}; findings were:\n${findings.map((f) => `${f.code} ${JSON.stringify(f.location)} ${f.message}`).join("\n")}`,
    );
  }
  const m = match.message;
  const problems: string[] = [];
  if (expected.file !== undefined && !m.includes(expected.file))
    problems.push(`file ${expected.file}`);
  if (expected.sheet !== undefined && !m.includes(`sheet "${expected.sheet}"`))
    problems.push(`sheet ${expected.sheet}`);
  if (expected.row !== undefined && !m.includes(`row ${expected.row}`))
    problems.push(`row ${expected.row}`);
  if (
    expected.column !== undefined &&
    !m.includes(`column ${columnLetter(expected.column)}`)
  )
    problems.push(`column ${columnLetter(expected.column)}`);
  if (expected.value === "" && !m.includes("empty"))
    problems.push("that the value is empty");
  if (
    expected.value !== undefined &&
    expected.value !== "" &&
    !m.includes(`"${expected.value}"`)
  )
    problems.push(`value "${expected.value}"`);
  if (expected.value !== undefined && match.location?.value !== expected.value)
    problems.push(`location.value ${expected.value}`);
  if (!/^In .+\.$/.test(m) || /\n/.test(m))
    problems.push("one sentence starting with 'In <file>'");
  if (problems.length > 0)
    throw new Error(
      `finding ${code} does not name ${problems.join(", ")}: ${m}`,
    );
  return match;
}
