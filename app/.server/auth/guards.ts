import { data, redirect, type RouterContextProvider } from "react-router";
import { apiError } from "~/.server/http";
import { can, type Permission } from "~/utils/permissions";
import { callerContext, type Caller } from "./context";
import type { SessionUser } from "./session";

type Args = { request: Request; context: Readonly<RouterContextProvider> };

export function getCaller({ context }: Pick<Args, "context">): Caller {
  return context.get(callerContext);
}

export function getOptionalUser(
  args: Pick<Args, "context">,
): SessionUser | null {
  return getCaller(args).user;
}

/** Pages: the signed-in user, or a redirect to the sign-in page that comes back here afterwards. */
export function requireUser({ request, context }: Args): SessionUser {
  const user = context.get(callerContext).user;
  if (!user) {
    const url = new URL(request.url);
    const redirectTo = url.pathname + url.search;
    throw redirect(`/sign-in?${new URLSearchParams({ redirectTo })}`);
  }
  return user;
}

/** Pages and page actions: the signed-in user holding `permission`, else 403. */
export function requirePermission(
  args: Args,
  permission: Permission,
): SessionUser {
  const user = requireUser(args);
  if (!can(user, permission)) {
    throw data(
      "Your role does not allow this. Ask an administrator if you need access.",
      { status: 403 },
    );
  }
  return user;
}

/** The page a signed-in person should not see (sign-in, reset): send them home. */
export function requireAnonymous({ context }: Pick<Args, "context">): void {
  if (context.get(callerContext).user) throw redirect("/");
}

/** API routes with the session cookie: 401 JSON when signed out, 403 JSON without the permission. */
export function requireApiUser(
  { context }: Pick<Args, "context">,
  permission?: Permission,
): SessionUser {
  const user = context.get(callerContext).user;
  if (!user)
    throw apiError(401, "unauthenticated", "Sign in or send a bearer token.");
  if (permission && !can(user, permission)) {
    throw apiError(403, "forbidden", "Your role does not allow this.");
  }
  return user;
}
