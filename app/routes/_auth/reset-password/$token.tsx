import { Form, href, Link, redirect, useNavigation } from "react-router";
import { getPasswordReset, resetPassword } from "~/.server/auth/accounts";
import { getCaller } from "~/.server/auth/guards";
import { badRequest, parseForm } from "~/.server/forms";
import { Button, FormAlert, useZodForm } from "~/components/form";
import { NewPasswordFields } from "~/components/new-password-fields";
import { NewPasswordSchema } from "~/utils/auth-schemas";
import type { Route } from "./+types/$token";

export const meta: Route.MetaFunction = () => [
  { title: "Choose a new password · Isopleth" },
];

export async function loader({ params }: Route.LoaderArgs) {
  const reset = await getPasswordReset(params.token);
  return { valid: !!reset, email: reset?.email ?? null };
}

export async function action(args: Route.ActionArgs) {
  const form = await parseForm(args.request, NewPasswordSchema);
  if (!form.ok) return badRequest({ errors: form.errors });
  const result = await resetPassword({
    token: args.params.token,
    password: form.data.password,
    ipAddress: getCaller(args).ipAddress,
    userAgent: args.request.headers.get("User-Agent"),
  });
  if (!result.ok) return badRequest({ errors: {}, formError: result.message });
  return redirect("/", { headers: { "Set-Cookie": result.setCookie } });
}

export default function ResetPassword({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const navigation = useNavigation();
  const { errors, onSubmit } = useZodForm(
    NewPasswordSchema,
    actionData?.errors,
  );
  if (!loaderData.valid) {
    return (
      <>
        <h1 className="text-xl font-bold">This link no longer works</h1>
        <p className="mt-2 text-sm text-ink-muted">
          Reset links work once and expire after one hour.
        </p>
        <Link
          to={href("/forgot-password")}
          className="mt-4 inline-block text-accent underline"
        >
          Ask for a new link
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="text-xl font-bold">Choose a new password</h1>
      <p className="mt-1 text-sm text-ink-muted">
        For {loaderData.email}. Your other sessions will be signed out.
      </p>
      <Form
        method="post"
        className="mt-4 space-y-4"
        onSubmit={onSubmit}
        noValidate
      >
        <FormAlert message={actionData?.formError} />
        <NewPasswordFields label="New password" errors={errors} />
        <Button
          type="submit"
          className="w-full"
          disabled={navigation.state === "submitting"}
        >
          Save and sign in
        </Button>
      </Form>
    </>
  );
}
