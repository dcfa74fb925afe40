import { Outlet } from "react-router";
import { EstimateCaution } from "~/components/estimate-caution";

export default function AuthLayout() {
  return (
    <div className="flex min-h-screen flex-col">
      <main className="flex flex-1 items-start justify-center px-6 py-16">
        <div className="w-full max-w-md">
          <div className="mb-8 flex items-center gap-2 text-2xl font-bold tracking-tight text-accent-strong">
            <img src="/favicon.svg" alt="" className="h-8 w-8" />
            Isopleth
          </div>
          <div className="rounded-lg border border-line bg-panel p-6 shadow-sm">
            <Outlet />
          </div>
        </div>
      </main>
      <footer className="border-t border-line bg-caution-soft">
        <div className="mx-auto max-w-6xl px-6 py-4 text-sm text-caution">
          <EstimateCaution />
        </div>
      </footer>
    </div>
  );
}
