import type { z } from "zod";
import { clipInput, problem } from "~/.server/http";
import { zodIssues } from "./schemas";

/*
 * The one way an API route reads its path parameters and query string. Strict, as the OWASP Input Validation
 * and REST Security cheat sheets advise (allow-list, bound sizes): a parameter the endpoint does not know, a
 * parameter given twice, a value longer than its bound or a number not written as a plain decimal is refused
 * with a 400 problem that names it, rather than being ignored or read in some other way.
 */

/** Longest query string accepted, in characters (a pressure list of ~1,000 entries fits). */
export const MAX_QUERY_STRING_CHARS = 8_192;

/**
 * Parses the query string of `request` with `schema` (a zod object of string parameters, the route's
 * documented contract). Throws a 400 `invalid_query` problem naming each parameter at fault.
 */
export function parseApiQuery<S extends z.ZodObject>(
  request: Request,
  schema: S,
): z.output<S> {
  const url = new URL(request.url);
  if (url.search.length > MAX_QUERY_STRING_CHARS) {
    throw problem(
      400,
      "invalid_query",
      `The query string is ${url.search.length} characters long; at most ${MAX_QUERY_STRING_CHARS} are accepted.`,
    );
  }
  const known = Object.keys(schema.shape);
  const issues: { path: string[]; message: string }[] = [];
  const values: Record<string, string> = {};
  for (const key of new Set(url.searchParams.keys())) {
    if (!known.includes(key)) {
      issues.push({
        path: [clipInput(key, 40)],
        message: known.length
          ? `Unknown parameter; this endpoint takes ${known.join(", ")}.`
          : "Unknown parameter; this endpoint takes no query parameters.",
      });
      continue;
    }
    const all = url.searchParams.getAll(key);
    if (all.length > 1) {
      issues.push({
        path: [key],
        message: `Given more than once (${all.length} times); give it once.`,
      });
      continue;
    }
    values[key] = all[0]!;
  }
  if (issues.length) {
    throw problem(
      400,
      "invalid_query",
      `The query string is not valid: ${summarise(issues)}`,
      { issues },
    );
  }
  const parsed = schema.safeParse(values);
  if (!parsed.success) {
    const list = zodIssues(parsed.error);
    throw problem(
      400,
      "invalid_query",
      `The query string is not valid: ${summarise(list)}`,
      { issues: list },
    );
  }
  return parsed.data;
}

/** The first issue in words (parameter name and what is wrong), and how many more the issues list. */
function summarise(
  issues: { path: (string | number)[]; message: string }[],
): string {
  const first = issues[0];
  if (!first) return "see issues.";
  const more =
    issues.length > 1 ? ` (and ${issues.length - 1} more; see issues)` : "";
  return `\`${String(first.path[0] ?? "")}\`: ${first.message}${more}`;
}

/**
 * The first issue of a JSON body in words — its field path as written in JSON (`properties[1]`, `degree`) and
 * what is wrong — and how many more the issues list.
 */
export function describeIssues(
  issues: { path: (string | number)[]; message: string }[],
): string {
  const first = issues[0];
  if (!first) return "see issues.";
  const where = first.path
    .map((p, i) => (typeof p === "number" ? `[${p}]` : i ? `.${p}` : p))
    .join("");
  const more =
    issues.length > 1 ? ` (and ${issues.length - 1} more; see issues)` : "";
  return `${where ? `\`${where}\`: ` : ""}${first.message}${more}`;
}

/** Parses the route's path parameters with `schema`; throws a 400 `invalid_path` problem naming them. */
export function parseApiPath<S extends z.ZodObject>(
  params: Record<string, string | undefined>,
  schema: S,
): z.output<S> {
  const parsed = schema.safeParse(params);
  if (!parsed.success) {
    const list = zodIssues(parsed.error);
    throw problem(
      400,
      "invalid_path",
      `The path is not valid: ${summarise(list)}`,
      { issues: list },
    );
  }
  return parsed.data;
}
