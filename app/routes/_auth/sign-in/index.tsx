import {
  data,
  Form,
  href,
  Link,
  redirect,
  useNavigation,
  useSearchParams,
} from "react-router";
import { signIn } from "~/.server/auth/accounts";
import { getCaller, requireAnonymous } from "~/.server/auth/guards";
import { badRequest, parseForm } from "~/.server/forms";
import { Button, FormAlert, TextField, useZodForm } from "~/components/form";
import { SignInSchema } from "~/utils/auth-schemas";
import { safeRedirect } from "~/utils/safe-redirect";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Sign in · Isopleth" }];

/** Passes the action's Retry-After (on a 429) through to the document response. */
export const headers: Route.HeadersFunction = ({ actionHeaders }) => {
  const retryAfter = actionHeaders.get("Retry-After");
  return retryAfter ? { "Retry-After": retryAfter } : new Headers();
};

export async function loader(args: Route.LoaderArgs) {
  requireAnonymous(args);
  return null;
}

export async function action(args: Route.ActionArgs) {
  requireAnonymous(args);
  const form = await parseForm(args.request, SignInSchema);
  if (!form.ok) return badRequest({ errors: form.errors });
  const result = await signIn({
    email: form.data.email,
    password: form.data.password,
    ipAddress: getCaller(args).ipAddress,
    userAgent: args.request.headers.get("User-Agent"),
  });
  if (!result.ok && result.reason === "throttled") {
    return data(
      { errors: {}, formError: result.message },
      {
        status: 429,
        headers: { "Retry-After": String(result.retryAfterSeconds) },
      },
    );
  }
  if (!result.ok)
    return data({ errors: {}, formError: result.message }, { status: 401 });
  return redirect(safeRedirect(form.data.redirectTo), {
    headers: { "Set-Cookie": result.setCookie },
  });
}

export default function SignIn({ actionData }: Route.ComponentProps) {
  const [params] = useSearchParams();
  const navigation = useNavigation();
  const { errors, onSubmit } = useZodForm(SignInSchema, actionData?.errors);
  return (
    <>
      <h1 className="text-xl font-bold">Sign in</h1>
      <Form
        method="post"
        className="mt-4 space-y-4"
        onSubmit={onSubmit}
        noValidate
      >
        <FormAlert message={actionData?.formError} />
        <input
          type="hidden"
          name="redirectTo"
          value={safeRedirect(params.get("redirectTo"))}
        />
        <TextField
          label="E-mail address"
          name="email"
          type="email"
          autoComplete="username"
          required
          errors={errors.email}
          // The page has one purpose, so the cursor starts in its first field.
          // eslint-disable-next-line jsx-a11y/no-autofocus
          autoFocus
        />
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          errors={errors.password}
        />
        <Button
          type="submit"
          className="w-full"
          disabled={navigation.state === "submitting"}
        >
          Sign in
        </Button>
      </Form>
      <p className="mt-4 text-sm">
        <Link to={href("/forgot-password")} className="text-accent underline">
          Forgot your password?
        </Link>
      </p>
    </>
  );
}
