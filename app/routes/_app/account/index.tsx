import { Form, useNavigation } from "react-router";
import { changePassword } from "~/.server/auth/accounts";
import { getCaller, requireUser } from "~/.server/auth/guards";
import { updateUserProfile } from "~/.server/db/queries/users";
import { badRequest, parseFormData, readFormData } from "~/.server/forms";
import { readIntent } from "~/utils/forms";
import { Button, FormAlert, TextField, useZodForm } from "~/components/form";
import { NewPasswordFields } from "~/components/new-password-fields";
import { PageHeader } from "~/components/page-header";
import { ChangePasswordSchema, ProfileSchema } from "~/utils/auth-schemas";
import { OUTPUT_SYSTEMS } from "~/core/units";
import { ROLE_LABELS } from "~/utils/permissions";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [
  { title: "Your account · Isopleth" },
];

export async function loader(args: Route.LoaderArgs) {
  return { user: requireUser(args) };
}

export async function action(args: Route.ActionArgs) {
  const user = requireUser(args);
  const caller = getCaller(args);
  const formData = await readFormData(args.request);
  const intent = readIntent(formData);
  if (intent === "profile") {
    const form = parseFormData(formData, ProfileSchema);
    if (!form.ok) return badRequest({ errors: form.errors, intent });
    await updateUserProfile(user.id, {
      name: form.data.name,
      unitSystem: form.data.unitSystem,
    });
    return { errors: {}, intent, saved: "Your details are saved." };
  }
  const form = parseFormData(formData, ChangePasswordSchema);
  if (!form.ok) return badRequest({ errors: form.errors, intent: "password" });
  const result = await changePassword({
    userId: user.id,
    sessionId: caller.sessionId!,
    currentPassword: form.data.currentPassword,
    newPassword: form.data.password,
    ipAddress: caller.ipAddress,
  });
  if (!result.ok)
    return badRequest({
      errors: { [result.field]: [result.message] },
      intent: "password",
    });
  return {
    errors: {},
    intent: "password",
    saved: "Your password is changed; your other sessions were signed out.",
  };
}

export default function Account({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { user } = loaderData;
  const navigation = useNavigation();
  const profile = useZodForm(
    ProfileSchema,
    actionData?.intent === "profile" ? actionData.errors : null,
  );
  const password = useZodForm(
    ChangePasswordSchema,
    actionData?.intent === "password" ? actionData.errors : null,
  );
  const saved = actionData && "saved" in actionData ? actionData.saved : null;
  return (
    <>
      <PageHeader title="Your account">
        {user.email} · {ROLE_LABELS[user.role]}
      </PageHeader>
      <div className="grid gap-6 md:grid-cols-2">
        <section className="rounded-lg border border-line bg-panel p-5">
          <h2 className="font-semibold">Details</h2>
          <Form
            method="post"
            className="mt-3 space-y-4"
            onSubmit={profile.onSubmit}
            noValidate
          >
            <input type="hidden" name="intent" value="profile" />
            {actionData?.intent === "profile" ? (
              <FormAlert message={saved} tone="ok" />
            ) : null}
            <TextField
              label="Name"
              name="name"
              defaultValue={user.name}
              autoComplete="name"
              required
              errors={profile.errors.name}
            />
            <fieldset>
              <legend className="text-sm font-semibold">
                Units for lookups and tables
              </legend>
              <div className="mt-1 flex gap-4 text-sm">
                {OUTPUT_SYSTEMS.map((system) => (
                  <label key={system} className="flex items-center gap-2">
                    <input
                      type="radio"
                      name="unitSystem"
                      value={system}
                      defaultChecked={user.unitSystem === system}
                    />
                    {system === "field"
                      ? "Field (psia, °F, rb/STB, scf/STB)"
                      : "Metric (bara, °C, rm³/sm³, sm³/sm³)"}
                  </label>
                ))}
              </div>
            </fieldset>
            <Button type="submit" disabled={navigation.state === "submitting"}>
              Save details
            </Button>
          </Form>
        </section>
        <section className="rounded-lg border border-line bg-panel p-5">
          <h2 className="font-semibold">Password</h2>
          <Form
            method="post"
            className="mt-3 space-y-4"
            onSubmit={password.onSubmit}
            noValidate
          >
            <input type="hidden" name="intent" value="password" />
            {actionData?.intent === "password" ? (
              <FormAlert message={saved} tone="ok" />
            ) : null}
            <TextField
              label="Current password"
              name="currentPassword"
              type="password"
              autoComplete="current-password"
              required
              errors={password.errors.currentPassword}
            />
            <NewPasswordFields label="New password" errors={password.errors} />
            <Button type="submit" disabled={navigation.state === "submitting"}>
              Change password
            </Button>
          </Form>
        </section>
      </div>
    </>
  );
}
