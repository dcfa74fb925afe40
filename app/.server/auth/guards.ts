import { data, redirect, type RouterContextProvider } from "react-router";
import { can, type Permission } from "~/utils/permissions";
import { callerContext, type Caller } from "./context";
import type { SessionUser } from "./session";

type Args = { request: Request; context: Readonly<RouterContextProvider> };

export function getCaller({ context }: Pick<Args, "context">): Caller {
  return context.get(callerContext);
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
