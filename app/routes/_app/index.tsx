import { href, Link } from "react-router";
import { requireUser } from "~/.server/auth/guards";
import { countCatalogue } from "~/.server/db/queries/catalogue";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [
  { title: "Isopleth — reservoir fluid-property tables" },
];

export async function loader(args: Route.LoaderArgs) {
  requireUser(args);
  return { counts: await countCatalogue() };
}

export default function Home({ loaderData }: Route.ComponentProps) {
  const { counts } = loaderData;
  return (
    <div className="space-y-8">
      <section>
        <h1 className="text-3xl font-bold tracking-tight">Isopleth</h1>
        <p className="mt-2 max-w-3xl text-lg text-ink-muted">
          Measured reservoir-fluid properties — formation volume factor,
          solution gas–oil ratio, viscosity, gas deviation factor, density —
          kept with their revision history, checked against the trends the
          physics requires, and interpolated at the pressure and temperature you
          need, with the method, the data zone and an error estimate beside
          every number.
        </p>
      </section>
      <section aria-label="Catalogue" className="grid gap-4 sm:grid-cols-3">
        <Stat label="Fields" value={counts.fields} />
        <Stat label="Wells" value={counts.wells} />
        <Stat label="Samples" value={counts.samples} />
      </section>
      <section className="grid gap-4 sm:grid-cols-3">
        <Card to={href("/samples")} title="Samples">
          Laboratory results per well sample: measured grids, bubble points,
          revisions and checks.
        </Card>
        <Card to={href("/lookup")} title="Lookup">
          Properties at reservoir conditions, with how each number was obtained.
        </Card>
        <Card to={href("/compare")} title="Compare">
          Property surfaces of several samples side by side.
        </Card>
      </section>
    </div>
  );
}

function Stat({ label, value }: { label: string; value: number }) {
  return (
    <div className="rounded-lg border border-line bg-panel p-4">
      <div className="text-sm text-ink-muted">{label}</div>
      <div className="text-2xl font-semibold tabular-nums">{value}</div>
    </div>
  );
}

function Card({
  to,
  title,
  children,
}: {
  to: string;
  title: string;
  children: React.ReactNode;
}) {
  return (
    <Link
      to={to}
      className="block rounded-lg border border-line bg-panel p-4 hover:border-accent"
    >
      <h2 className="font-semibold text-accent-strong">{title}</h2>
      <p className="mt-1 text-sm text-ink-muted">{children}</p>
    </Link>
  );
}
