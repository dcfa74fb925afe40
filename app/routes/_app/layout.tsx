import { href, NavLink, Outlet } from "react-router";
import { EstimateCaution } from "~/components/estimate-caution";

const NAV = [
  { to: href("/samples"), label: "Samples" },
  { to: href("/lookup"), label: "Lookup" },
  { to: href("/compare"), label: "Compare" },
  { to: href("/tokens"), label: "API tokens" },
] as const;

export default function AppLayout() {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-line bg-panel">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-8 gap-y-2 px-6 py-3">
          <NavLink to="/" className="flex items-center gap-2 text-lg font-bold tracking-tight text-accent-strong">
            <img src="/favicon.svg" alt="" className="h-6 w-6" />
            Isopleth
          </NavLink>
          <nav aria-label="Main" className="flex flex-wrap gap-1">
            {NAV.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                className={({ isActive }) =>
                  `rounded px-3 py-1.5 text-sm font-semibold ${
                    isActive ? "bg-accent-soft text-accent-strong" : "text-ink-muted hover:bg-surface hover:text-ink"
                  }`
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
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
