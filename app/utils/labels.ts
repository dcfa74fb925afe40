import { z } from "zod";

/*
 * Free text the product stores and shows: labels (sample, well and field names, region, laboratory, report
 * reference, lookup-set names) are one line; comments and notes may hold line breaks. Neither may hold other
 * control characters (NUL, ESC, DEL, the C1 controls…) nor the bidirectional overrides that make a name display
 * differently from what it is (Unicode UAX #9; the "Trojan Source" spoofing). Client-safe: the forms check in
 * the browser and the actions again with the same schema.
 */

/** Line breaks (CR, LF, NEL, U+2028, U+2029) and other control characters, as a label must not hold them. */
const LABEL_FORBIDDEN = /[\p{Cc}\u2028\u2029\u202A-\u202E\u2066-\u2069]/u;
/** In multi-line text: the same, except tab, line feed and carriage return. */
const TEXT_FORBIDDEN =
  // eslint-disable-next-line no-control-regex -- control characters are what this pattern finds
  /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u2028\u2029\u202A-\u202E\u2066-\u2069]/u;

function describe(ch: string): string {
  const code = ch.codePointAt(0)!;
  const hex = `U+${code.toString(16).toUpperCase().padStart(4, "0")}`;
  if (
    ch === "\n" ||
    ch === "\r" ||
    ch === "\u0085" ||
    ch === "\u2028" ||
    ch === "\u2029"
  )
    return `a line break (${hex})`;
  if (ch === "\t") return `a tab (${hex})`;
  if (code >= 0x202a && code <= 0x2069)
    return `a text-direction control (${hex})`;
  return `a control character (${hex})`;
}

/** Why the text is refused, or null. `what` names the field: "The sample label …". */
export function labelProblem(
  text: string,
  what: string,
  multiline = false,
): string | null {
  const pattern = multiline ? TEXT_FORBIDDEN : LABEL_FORBIDDEN;
  const m = pattern.exec(text);
  if (!m) return null;
  const position = [...text.slice(0, m.index)].length + 1;
  const allowed = multiline
    ? "may hold line breaks but no other control characters"
    : "must be one line, without tabs or other control characters";
  return `The ${what} ${allowed}: it holds ${describe(m[0])} at character ${position}.`;
}

/** A one-line label: control characters and line breaks refused (with a message naming the field), then trimmed. */
export function labelSchema(
  what: string,
  max: number,
  required: boolean,
  missing = `Enter the ${what}.`,
) {
  const base = z
    .string({ error: missing })
    .superRefine((v, ctx) => {
      const problem = labelProblem(v, what);
      if (problem) ctx.addIssue({ code: "custom", message: problem });
    })
    .trim()
    .max(max, `Use at most ${max} characters for the ${what}.`);
  return required ? base.min(1, missing) : base.optional().default("");
}

/** Multi-line text (a comment, notes): line breaks and tabs allowed, other control characters refused. */
export function multilineTextSchema(what: string) {
  return z.string().superRefine((v, ctx) => {
    const problem = labelProblem(v, what, true);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });
}
