/**
 * The sample record form's submission, for a new sample and for an edit alike: the values the route parsed
 * with the form's schema (in the reader's unit system, as the browser checked them), converted to canonical
 * units and stored with their audit row. Every refusal says that nothing was saved; a label the well already
 * has is the label field's error.
 */
import type { SessionUser } from "~/.server/auth/session";
import { listFieldsAndWells } from "~/.server/db/queries/catalogue";
import {
  createSampleRecord,
  getSampleRecord,
  updateSampleRecord,
} from "~/.server/db/queries/samples";
import type { FieldErrors } from "~/components/form";
import type { SampleFormValues } from "~/components/samples/sample-form";
import { recordInputFromForm } from "./sample-input";

/** What the form says above its fields when nothing was saved. */
export const NOTHING_SAVED = "Some fields need attention; nothing was saved.";

type StoredRecord = NonNullable<Awaited<ReturnType<typeof getSampleRecord>>>;

type RecordFormOutcome =
  | { ok: true; sampleId: number }
  | { ok: false; errors: FieldErrors; formError: string };

/** Creates a sample record from the form, or (with `existing`) updates that record. */
export async function submitSampleRecord(
  values: SampleFormValues,
  user: SessionUser,
  ipAddress: string | null,
  existing?: StoredRecord,
): Promise<RecordFormOutcome> {
  const converted = recordInputFromForm(values, user.unitSystem, existing);
  if (!converted.ok)
    return { ok: false, errors: converted.errors, formError: NOTHING_SAVED };
  const actor = { userId: user.id, ipAddress };
  const result = existing
    ? await updateSampleRecord(existing.id, converted.input, actor)
    : await createSampleRecord(converted.input, actor);
  if (!result.ok)
    return {
      ok: false,
      errors: {
        label: [
          `Well ${converted.input.wellName} already has a sample labelled "${converted.input.label}"; choose another label.`,
        ],
      },
      formError: NOTHING_SAVED,
    };
  return { ok: true, sampleId: existing?.id ?? result.id };
}

/** The field and well names the form offers as suggestions. */
export async function sampleFormChoices() {
  const places = await listFieldsAndWells();
  return {
    fieldNames: places.fields.map((f) => f.name),
    wellNames: [...new Set(places.wells.map((w) => w.name))],
  };
}
