import { data, Form, href, Link, redirect, useNavigation } from "react-router";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { getSampleRecord } from "~/.server/db/queries/samples";
import { badRequest, parseForm } from "~/.server/forms";
import { sampleIdFrom } from "~/.server/samples/params";
import {
  NOTHING_SAVED,
  sampleFormChoices,
  submitSampleRecord,
} from "~/.server/samples/record-form";
import {
  formDefaultsFromRecord,
  standardLabel,
  standardPresetOf,
} from "~/.server/samples/sample-input";
import { Button, FormAlert, useZodForm } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import {
  SampleFormFields,
  sampleFormSchema,
} from "~/components/samples/sample-form";
import type { Route } from "./+types/edit";

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `Edit ${data?.label ?? "sample"} · Isopleth` },
];

async function requireRecord(params: { sampleId?: string }) {
  const id = sampleIdFrom(params);
  const record = await getSampleRecord(id);
  if (!record) throw data(`There is no sample ${id}.`, { status: 404 });
  return record;
}

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "edit:samples");
  const record = await requireRecord(args.params);
  return {
    id: record.id,
    label: record.label,
    system: user.unitSystem,
    defaults: formDefaultsFromRecord(record, user.unitSystem),
    currentStandard: standardPresetOf(record)
      ? null
      : { label: standardLabel(record) },
    ...(await sampleFormChoices()),
  };
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "edit:samples");
  const { ipAddress } = getCaller(args);
  const record = await requireRecord(args.params);
  const form = await parseForm(args.request, sampleFormSchema(user.unitSystem));
  if (!form.ok)
    return badRequest({ errors: form.errors, formError: NOTHING_SAVED });
  const saved = await submitSampleRecord(form.data, user, ipAddress, record);
  if (!saved.ok) return badRequest(saved);
  throw redirect(
    `${href("/samples/:sampleId", { sampleId: String(saved.sampleId) })}?saved=1`,
  );
}

export default function EditSample({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const {
    id,
    label,
    system,
    defaults,
    currentStandard,
    fieldNames,
    wellNames,
  } = loaderData;
  const navigation = useNavigation();
  const form = useZodForm(sampleFormSchema(system), actionData?.errors);
  const back = href("/samples/:sampleId", { sampleId: String(id) });
  return (
    <>
      <PageHeader title={`Edit ${label}`}>
        Change the sample&apos;s record. Uploaded revisions are never changed:
        upload a new revision to correct measured values.
      </PageHeader>
      <Form
        method="post"
        noValidate
        onSubmit={form.onSubmit}
        className="space-y-6"
      >
        <FormAlert message={actionData?.formError} />
        <SampleFormFields
          system={system}
          errors={form.errors}
          defaults={defaults}
          fieldNames={fieldNames}
          wellNames={wellNames}
          currentStandard={currentStandard}
        />
        <div className="flex items-center gap-4">
          <Button type="submit" disabled={navigation.state === "submitting"}>
            Save changes
          </Button>
          <Link to={back} className="text-sm text-accent underline">
            Cancel
          </Link>
        </div>
      </Form>
    </>
  );
}
