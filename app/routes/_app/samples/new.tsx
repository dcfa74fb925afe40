import { Form, href, Link, redirect, useNavigation } from "react-router";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { badRequest, parseForm } from "~/.server/forms";
import {
  NOTHING_SAVED,
  sampleFormChoices,
  submitSampleRecord,
} from "~/.server/samples/record-form";
import { Button, FormAlert, useZodForm } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import {
  SampleFormFields,
  sampleFormSchema,
} from "~/components/samples/sample-form";
import type { Route } from "./+types/new";

export const meta: Route.MetaFunction = () => [
  { title: "New sample · Isopleth" },
];

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "edit:samples");
  return { system: user.unitSystem, ...(await sampleFormChoices()) };
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "edit:samples");
  const { ipAddress } = getCaller(args);
  const form = await parseForm(args.request, sampleFormSchema(user.unitSystem));
  if (!form.ok)
    return badRequest({ errors: form.errors, formError: NOTHING_SAVED });
  const saved = await submitSampleRecord(form.data, user, ipAddress);
  if (!saved.ok) return badRequest(saved);
  throw redirect(
    `${href("/samples/:sampleId", { sampleId: String(saved.sampleId) })}?created=1`,
  );
}

export default function NewSample({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { system, fieldNames, wellNames } = loaderData;
  const navigation = useNavigation();
  const form = useZodForm(sampleFormSchema(system), actionData?.errors);
  return (
    <>
      <PageHeader title="New sample">
        Record where a fluid sample was taken and what the laboratory reported
        about it. Measured grids are uploaded afterwards, on the sample&apos;s
        page.
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
          defaults={{}}
          fieldNames={fieldNames}
          wellNames={wellNames}
        />
        <div className="flex items-center gap-4">
          <Button type="submit" disabled={navigation.state === "submitting"}>
            Create sample
          </Button>
          <Link to={href("/samples")} className="text-sm text-accent underline">
            Cancel
          </Link>
        </div>
      </Form>
    </>
  );
}
