import type { z } from "zod";

/**
 * Forms, client-safe: how zod issues become the errors shown beside each field, and how a form says which
 * button was pressed. Used by the browser check (useZodForm) and by every action (app/.server/forms.ts).
 *
 * The convention for several buttons on one form: each submit button (or a hidden input, for a form with one
 * button) carries `name="intent"` and a value naming the operation ("invite", "revoke", "preview"…); the
 * action reads it once with `readIntent`, or its zod schema discriminates on the `intent` field.
 */

/** Error messages by field name; "form" holds those about the whole form. */
export type FieldErrors = Record<string, string[] | undefined>;

/** The name of the field that says which operation a form asks for. */
const INTENT_FIELD = "intent";

/** Zod issues grouped by the field they are about (the first segment of their path; "form" when none). */
export function fieldErrorsOf(
  issues: readonly z.core.$ZodIssue[],
): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of issues)
    (errors[String(issue.path[0] ?? "form")] ??= []).push(issue.message);
  return errors;
}

/** The operation a submitted form (or JSON body) asks for: the value of its `intent` field, "" when none. */
export function readIntent(
  source: FormData | Readonly<Record<string, unknown>>,
): string {
  const value =
    source instanceof FormData
      ? source.get(INTENT_FIELD)
      : source[INTENT_FIELD];
  return typeof value === "string" ? value : "";
}
