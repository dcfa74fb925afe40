import { useState } from "react";
import { Form, href, NavLink, Outlet, useLocation } from "react-router";
import { requireUser } from "~/.server/auth/guards";
import { getEnv } from "~/.server/env";
import { EstimateCaution } from "~/components/estimate-caution";
import { can, ROLE_LABELS } from "~/utils/permissions";
import type { Route } from "./+types/layout";

export async function loader(args: Route.LoaderArgs) {
  const user = requireUser(args);
  return { user, mailCapture: !!getEnv().MAIL_CAPTURE_URL };
}

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `rounded px-3 py-1.5 text-sm font-semibold ${
    isActive
      ? "bg-accent-soft text-accent-strong"
      : "text-ink-muted hover:bg-surface hover:text-ink"
  }`;

export default function AppLayout({ loaderData }: Route.ComponentProps) {
  const { user, mailCapture } = loaderData;
  // Phones: the menu is folded behind a button, and folds again on the next page (it is open for one pathname).
  const { pathname } = useLocation();
  const [menuOpenAt, setMenuOpenAt] = useState<string | null>(null);
  const menuOpen = menuOpenAt === pathname;
  const nav = [
    { to: href("/samples"), label: "Samples" },
    { to: href("/lookup"), label: "Lookup" },
    { to: href("/compare"), label: "Compare" },
    ...(can(user, "manage:own-tokens")
      ? [{ to: href("/tokens"), label: "API tokens" }]
      : []),
  ];
  const admin = can(user, "manage:people")
    ? [
        { to: href("/admin/people"), label: "People" },
        { to: href("/admin/audit"), label: "Audit log" },
        ...(can(user, "manage:settings")
          ? [{ to: href("/admin/settings"), label: "Lab policy" }]
          : []),
        ...(mailCapture
          ? [{ to: href("/admin/mail"), label: "Captured e-mail" }]
          : []),
      ]
    : [];
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-line bg-panel">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-8 gap-y-2 px-6 py-3">
          <NavLink
            to="/"
            className="flex items-center gap-2 text-lg font-bold tracking-tight text-accent-strong"
          >
            <img src="/favicon.svg" alt="" className="h-6 w-6" />
            Isopleth
          </NavLink>
          <button
            type="button"
            aria-expanded={menuOpen}
            aria-controls="site-menu"
            onClick={() => setMenuOpenAt(menuOpen ? null : pathname)}
            className="ml-auto rounded border border-line px-3 py-1.5 text-sm font-semibold text-ink-muted hover:border-accent hover:text-ink sm:hidden"
          >
            Menu
          </button>
          {/* on wider screens the wrapper is not a box: its parts sit in the header's row as they always did */}
          <div
            id="site-menu"
            className={`${menuOpen ? "flex" : "hidden"} w-full flex-col gap-3 pb-1 sm:contents`}
          >
            <nav aria-label="Main" className="flex flex-wrap gap-1">
              {nav.map((item) => (
                <NavLink key={item.to} to={item.to} className={linkClass}>
                  {item.label}
                </NavLink>
              ))}
            </nav>
            {admin.length > 0 ? (
              <nav
                aria-label="Administration"
                className="flex flex-wrap gap-1 border-line max-sm:border-t max-sm:pt-2 sm:border-l sm:pl-4"
              >
                {admin.map((item) => (
                  <NavLink key={item.to} to={item.to} className={linkClass}>
                    {item.label}
                  </NavLink>
                ))}
              </nav>
            ) : null}
            <div className="flex items-center gap-3 text-sm max-sm:border-t max-sm:border-line max-sm:pt-3 sm:ml-auto">
              <NavLink
                to={href("/account")}
                className="text-right leading-tight hover:underline"
              >
                <span className="block font-semibold">{user.name}</span>
                <span className="block text-xs text-ink-muted">
                  {ROLE_LABELS[user.role]}
                </span>
              </NavLink>
              <Form method="post" action={href("/sign-out")}>
                <button
                  type="submit"
                  className="rounded border border-line px-3 py-1.5 font-semibold text-ink-muted hover:border-accent hover:text-ink"
                >
                  Sign out
                </button>
              </Form>
            </div>
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-6 py-8">
        <Outlet />
      </main>
      <footer className="border-t border-line bg-caution-soft">
        <div className="mx-auto max-w-6xl px-6 py-4 text-sm text-caution">
          <EstimateCaution />
        </div>
      </footer>
    </div>
  );
}
