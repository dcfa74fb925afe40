import { redirect } from "react-router";
import { getCaller } from "~/.server/auth/guards";
import { clearSessionCookie, signOut } from "~/.server/auth/session";
import type { Route } from "./+types/sign-out";

/** POST /sign-out ends this browser's session. (GET does nothing: signing out is a change.) */
export async function action(args: Route.ActionArgs) {
  const caller = getCaller(args);
  if (!caller.sessionId || !caller.user) {
    return redirect("/sign-in", {
      headers: { "Set-Cookie": await clearSessionCookie() },
    });
  }
  const setCookie = await signOut({
    sessionId: caller.sessionId,
    userId: caller.user.id,
    ipAddress: caller.ipAddress,
  });
  return redirect("/sign-in", { headers: { "Set-Cookie": setCookie } });
}

export async function loader() {
  return redirect("/");
}
