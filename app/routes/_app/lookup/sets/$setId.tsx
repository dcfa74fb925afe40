import { Form, href, Link, useNavigation } from "react-router";
import { requirePermission } from "~/.server/auth/guards";
import {
  createLookupRun,
  getLookupSet,
  listLookupRuns,
} from "~/.server/db/queries/lookup-sets";
import { getSampleWithPlace } from "~/.server/db/queries/samples";
import { invariantResponse } from "~/.server/http";
import {
  getRevisionData,
  resolveRevision,
} from "~/.server/samples/revision-data";
import { runHeavy } from "~/.server/workers/pool";
import { Button, FormAlert } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { PROPERTY_NAMES, isLookupError } from "~/core/lookup";
import type { PropertyKey } from "~/core/units";
import type { Route } from "./+types/$setId";

export const meta: Route.MetaFunction = () => [
  { title: "Lookup set · Isopleth" },
];

/** The set id of the URL; anything but a positive whole number is a 404 (not a query with NaN). */
function setIdFrom(params: { setId?: string }): number {
  const raw = params.setId ?? "";
  invariantResponse(
    /^[1-9]\d{0,15}$/.test(raw) && Number.isSafeInteger(Number(raw)),
    "There is no such lookup set among yours.",
  );
  return Number(raw);
}

type RunResults = Record<
  string,
  { value: number; errorEstimate: number; warnings: string[] }[]
>;

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "save:lookup-sets");
  const set = await getLookupSet(setIdFrom(args.params), user.id);
  invariantResponse(set, "There is no such lookup set among yours.");
  const [sample, runs, current] = await Promise.all([
    getSampleWithPlace(set.sampleId),
    listLookupRuns(set.id),
    resolveRevision(set.sampleId),
  ]);
  return {
    set,
    sampleLabel: sample?.label ?? "",
    runs,
    currentRevision: current?.number ?? null,
  };
}

/** Runs the set against the sample's current approved revision and records the run (values in field units). */
export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "save:lookup-sets");
  const set = await getLookupSet(setIdFrom(args.params), user.id);
  invariantResponse(set, "There is no such lookup set among yours.");
  const revision = await resolveRevision(set.sampleId);
  if (!revision)
    return { error: "The sample has no approved revision to run against." };
  const data = await getRevisionData(revision);
  const points = set.conditions.map((c) => ({
    pressure: c.pressurePsia,
    temperature: c.temperatureF,
  }));
  const results: RunResults = {};
  for (const property of set.properties) {
    const grid = data.grids[property];
    if (!grid) continue;
    try {
      const r = await runHeavy(
        "lookup",
        {
          grid,
          points,
          options: {
            property,
            method: set.method as "auto",
            degree: set.degree ?? undefined,
            extrapolate: true,
            units: "field",
            messages: false,
          },
        },
        { surface: "page" },
      );
      results[property] = r.results.map((x) => ({
        value: x.value,
        errorEstimate: x.errorEstimate,
        warnings: [...x.warnings],
      }));
    } catch (error) {
      if (isLookupError(error))
        return { error: `${PROPERTY_NAMES[property]}: ${error.message}` };
      throw error;
    }
  }
  await createLookupRun({
    setId: set.id,
    revisionId: data.revisionId,
    revisionNumber: data.number,
    method: set.method,
    results,
    createdBy: user.id,
  });
  return { error: null };
}

export default function LookupSetRuns({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { set, sampleLabel, runs, currentRevision } = loaderData;
  const navigation = useNavigation();
  const [latest, previous] = runs;
  return (
    <>
      <PageHeader title={`Lookup set: ${set.name}`}>
        {sampleLabel} · {set.conditions.length} conditions ·{" "}
        {set.properties.map((p) => PROPERTY_NAMES[p as PropertyKey]).join(", ")}{" "}
        · method {set.method}. Each run records the revision and method used;
        values in field units (psia, °F, rb/STB, scf/STB, ft³/scf, cP, lb/ft³).
      </PageHeader>
      <div className="flex flex-wrap items-center gap-3">
        <Form method="post">
          <Button
            type="submit"
            disabled={
              navigation.state === "submitting" || currentRevision === null
            }
          >
            Run against revision {currentRevision ?? "—"}
          </Button>
        </Form>
        <Link to={href("/lookup")} className="text-sm text-accent underline">
          Back to lookup
        </Link>
      </div>
      {actionData?.error ? (
        <div className="mt-3">
          <FormAlert message={actionData.error} />
        </div>
      ) : null}
      <h2 className="mt-6 font-semibold">Runs</h2>
      <ul className="mt-2 text-sm">
        {runs.map((r) => (
          <li key={r.id} className="tabular-nums">
            {new Date(r.createdAt).toISOString().replace("T", " ").slice(0, 19)}{" "}
            UTC — revision {r.revisionNumber}, method {r.method}
          </li>
        ))}
        {runs.length === 0 ? (
          <li className="text-ink-muted">Not run yet.</li>
        ) : null}
      </ul>
      {latest ? (
        <section className="mt-6" aria-labelledby="changes-title">
          <h2 id="changes-title" className="font-semibold">
            {previous
              ? `What changed: revision ${previous.revisionNumber} → ${latest.revisionNumber}`
              : `Latest run (revision ${latest.revisionNumber})`}
          </h2>
          <div className="mt-2 max-h-[32rem] overflow-auto rounded-lg border border-line bg-panel">
            <table
              className="w-full text-sm tabular-nums"
              data-testid="set-run-table"
            >
              <thead className="sticky top-0 bg-surface text-ink-muted">
                <tr>
                  <th className="px-3 py-2 text-right font-semibold">
                    p (psia)
                  </th>
                  <th className="px-3 py-2 text-right font-semibold">T (°F)</th>
                  {Object.keys(latest.results).map((p) => (
                    <th key={p} className="px-3 py-2 text-right font-semibold">
                      {PROPERTY_NAMES[p as PropertyKey]}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {set.conditions.map((c, i) => (
                  <tr key={i} className="border-t border-line">
                    <td className="px-3 py-1 text-right">
                      {c.pressurePsia.toPrecision(6)}
                    </td>
                    <td className="px-3 py-1 text-right">
                      {c.temperatureF.toPrecision(5)}
                    </td>
                    {Object.entries(latest.results).map(([p, values]) => {
                      const now = values[i]?.value;
                      const before = previous?.results[p]?.[i]?.value;
                      const change =
                        now !== undefined &&
                        before !== undefined &&
                        before !== 0
                          ? ((now - before) / Math.abs(before)) * 100
                          : null;
                      return (
                        <td key={p} className="px-3 py-1 text-right">
                          {now === undefined ? "—" : Number(now.toPrecision(6))}
                          {change !== null ? (
                            <span
                              className={`ml-2 text-xs ${Math.abs(change) > 1 ? "text-caution" : "text-ink-muted"}`}
                            >
                              {change >= 0 ? "+" : ""}
                              {change.toFixed(2)} %
                            </span>
                          ) : null}
                        </td>
                      );
                    })}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      ) : null}
    </>
  );
}
