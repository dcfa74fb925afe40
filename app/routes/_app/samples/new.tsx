import { Form, href, Link, redirect, useNavigation } from "react-router";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { listFieldsAndWells } from "~/.server/db/queries/catalogue";
import { createSampleRecord } from "~/.server/db/queries/samples";
import { badRequest, parseForm } from "~/.server/forms";
import { recordInputFromForm } from "~/.server/samples/sample-input";
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
  const places = await listFieldsAndWells();
  return {
    system: user.unitSystem,
    fieldNames: places.fields.map((f) => f.name),
    wellNames: [...new Set(places.wells.map((w) => w.name))],
  };
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "edit:samples");
  const { ipAddress } = getCaller(args);
  const form = await parseForm(args.request, sampleFormSchema(user.unitSystem));
  if (!form.ok)
    return badRequest({
      errors: form.errors,
      formError: "Some fields need attention; nothing was saved.",
    });
  const converted = recordInputFromForm(form.data, user.unitSystem);
  if (!converted.ok)
    return badRequest({
      errors: converted.errors,
      formError: "Some fields need attention; nothing was saved.",
    });
  const result = await createSampleRecord(converted.input, {
    userId: user.id,
    ipAddress,
  });
  if (!result.ok) {
    return badRequest({
      errors: {
        label: [
          `Well ${converted.input.wellName} already has a sample labelled "${converted.input.label}"; choose another label.`,
        ],
      },
      formError: "Some fields need attention; nothing was saved.",
    });
  }
  throw redirect(
    `${href("/samples/:sampleId", { sampleId: String(result.id) })}?created=1`,
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
