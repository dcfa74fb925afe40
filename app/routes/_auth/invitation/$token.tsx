import { Form, href, Link, redirect, useNavigation } from "react-router";
import { acceptInvitation, getInvitation } from "~/.server/auth/accounts";
import { getCaller } from "~/.server/auth/guards";
import { badRequest, parseForm } from "~/.server/forms";
import { Button, FormAlert, TextField, useZodForm } from "~/components/form";
import { NewPasswordFields } from "~/components/new-password-fields";
import { AcceptInvitationSchema } from "~/utils/auth-schemas";
import { ROLE_LABELS } from "~/utils/permissions";
import type { Route } from "./+types/$token";

export const meta: Route.MetaFunction = () => [
  { title: "Accept your invitation · Isopleth" },
];

export async function loader({ params }: Route.LoaderArgs) {
  const invitation = await getInvitation(params.token);
  return invitation?.role
    ? { valid: true as const, email: invitation.email, role: invitation.role }
    : { valid: false as const };
}

export async function action(args: Route.ActionArgs) {
  const form = await parseForm(args.request, AcceptInvitationSchema);
  if (!form.ok) return badRequest({ errors: form.errors });
  const result = await acceptInvitation({
    token: args.params.token,
    name: form.data.name,
    password: form.data.password,
    ipAddress: getCaller(args).ipAddress,
    userAgent: args.request.headers.get("User-Agent"),
  });
  if (!result.ok) return badRequest({ errors: {}, formError: result.message });
  return redirect("/", { headers: { "Set-Cookie": result.setCookie } });
}

export default function AcceptInvitation({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const navigation = useNavigation();
  const { errors, onSubmit } = useZodForm(
    AcceptInvitationSchema,
    actionData?.errors,
  );
  if (!loaderData.valid) {
    return (
      <>
        <h1 className="text-xl font-bold">This invitation no longer works</h1>
        <p className="mt-2 text-sm text-ink-muted">
          Invitations work once and expire after 72 hours. Ask an administrator
          to invite you again.
        </p>
        <Link
          to={href("/sign-in")}
          className="mt-4 inline-block text-accent underline"
        >
          Go to sign-in
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="text-xl font-bold">Welcome to Isopleth</h1>
      <p className="mt-1 text-sm text-ink-muted">
        Your account will be {loaderData.email}, as{" "}
        {ROLE_LABELS[loaderData.role]}.
      </p>
      <Form
        method="post"
        className="mt-4 space-y-4"
        onSubmit={onSubmit}
        noValidate
      >
        <FormAlert message={actionData?.formError} />
        <TextField
          label="Your name"
          name="name"
          autoComplete="name"
          required
          errors={errors.name}
        />
        <NewPasswordFields label="Password" errors={errors} />
        <Button
          type="submit"
          className="w-full"
          disabled={navigation.state === "submitting"}
        >
          Create my account
        </Button>
      </Form>
    </>
  );
}
