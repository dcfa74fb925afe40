import { data } from "react-router";
import type { z } from "zod";
import type { FieldErrors } from "~/components/form";

export type FormFailure = { errors: FieldErrors; formError?: string; intent?: string };

/** Parses a urlencoded or multipart form with a zod schema: the data, or field errors for a 400 reply. */
export async function parseForm<S extends z.ZodType>(
  request: Request,
  schema: S,
): Promise<{ ok: true; data: z.output<S>; formData: FormData } | { ok: false; errors: FieldErrors; formData: FormData }> {
  const formData = await request.formData();
  const values: Record<string, unknown> = {};
  for (const [key, value] of formData) if (typeof value === "string") values[key] = value;
  const result = schema.safeParse(values);
  if (result.success) return { ok: true, data: result.data, formData };
  const errors: FieldErrors = {};
  for (const issue of result.error.issues) (errors[String(issue.path[0] ?? "form")] ??= []).push(issue.message);
  return { ok: false, errors, formData };
}

export function badRequest(failure: FormFailure) {
  return data(failure, { status: 400 });
}
