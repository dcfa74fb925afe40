import { Form, href, Link, useNavigation } from "react-router";
import { requestPasswordReset } from "~/.server/auth/accounts";
import { getCaller, requireAnonymous } from "~/.server/auth/guards";
import { badRequest, parseForm } from "~/.server/forms";
import { Button, FormAlert, TextField, useZodForm } from "~/components/form";
import { ForgotPasswordSchema } from "~/utils/auth-schemas";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [
  { title: "Reset your password · Isopleth" },
];

/** Same answer whether or not the address has an account. */
const SENT =
  "If an account uses this address, a link to choose a new password is on its way. It works once, for one hour.";

export async function loader(args: Route.LoaderArgs) {
  requireAnonymous(args);
  return null;
}

export async function action(args: Route.ActionArgs) {
  requireAnonymous(args);
  const form = await parseForm(args.request, ForgotPasswordSchema);
  if (!form.ok) return badRequest({ errors: form.errors });
  requestPasswordReset({
    email: form.data.email,
    ipAddress: getCaller(args).ipAddress,
  });
  return { errors: {}, sent: SENT };
}

export default function ForgotPassword({ actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const { errors, onSubmit } = useZodForm(
    ForgotPasswordSchema,
    actionData?.errors,
  );
  const sent = actionData && "sent" in actionData ? actionData.sent : null;
  return (
    <>
      <h1 className="text-xl font-bold">Reset your password</h1>
      <p className="mt-1 text-sm text-ink-muted">
        Enter the e-mail address of your account; we will send a link.
      </p>
      <Form
        method="post"
        className="mt-4 space-y-4"
        onSubmit={onSubmit}
        noValidate
      >
        <FormAlert message={sent} tone="ok" />
        <TextField
          label="E-mail address"
          name="email"
          type="email"
          autoComplete="email"
          required
          errors={errors.email}
        />
        <Button
          type="submit"
          className="w-full"
          disabled={navigation.state === "submitting"}
        >
          Send the link
        </Button>
      </Form>
      <p className="mt-4 text-sm">
        <Link to={href("/sign-in")} className="text-accent underline">
          Back to sign-in
        </Link>
      </p>
    </>
  );
}
