import { data } from "react-router";
import type { z } from "zod";
import { fieldErrorsOf, type FieldErrors } from "~/utils/forms";

/**
 * The request's form, or a thrown 400 for a body that is not a readable form (a broken multipart body, another
 * content type): a malformed request is the client's fault, never a 500.
 */
export async function readFormData(request: Request): Promise<FormData> {
  try {
    return await request.formData();
  } catch {
    throw data(
      "The form sent could not be read (its body is not a valid form). Reload the page and try again.",
      { status: 400 },
    );
  }
}

/** The request's JSON body, or a thrown 400 when it is not JSON. */
export async function readJsonBody(request: Request): Promise<unknown> {
  try {
    return await request.json();
  } catch {
    throw data("The body sent is not valid JSON.", { status: 400 });
  }
}

type FormFailure = {
  errors: FieldErrors;
  formError?: string;
  intent?: string;
};

type ParsedForm<S extends z.ZodType> =
  | { ok: true; data: z.output<S>; formData: FormData }
  | { ok: false; errors: FieldErrors; formData: FormData };

/** Parses a urlencoded or multipart form with a zod schema: the data, or field errors for a 400 reply. */
export async function parseForm<S extends z.ZodType>(
  request: Request,
  schema: S,
): Promise<ParsedForm<S>> {
  return parseFormData(await readFormData(request), schema);
}

/**
 * Parses a form already read (its text fields) with a zod schema. An action with several operations reads
 * the form once, picks the schema by `readIntent(formData)` (app/utils/forms.ts), then parses it here.
 */
export function parseFormData<S extends z.ZodType>(
  formData: FormData,
  schema: S,
): ParsedForm<S> {
  const values: Record<string, unknown> = {};
  for (const [key, value] of formData)
    if (typeof value === "string") values[key] = value;
  const result = schema.safeParse(values);
  if (result.success) return { ok: true, data: result.data, formData };
  return { ok: false, errors: fieldErrorsOf(result.error.issues), formData };
}

export function badRequest(failure: FormFailure) {
  return data(failure, { status: 400 });
}
