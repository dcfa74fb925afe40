import { Form, href, Link, useNavigation } from "react-router";
import { requirePermission } from "~/.server/auth/guards";
import { invariantResponse } from "~/.server/http";
import { getLookupSetPage, runLookupSet } from "~/.server/lookup/sets";
import { Button, FormAlert } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { PROPERTIES, type PropertyKey } from "~/core/units";
import type { Route } from "./+types/$setId";
import { formatDecimals, formatPlain, formatPrecision } from "~/core/format";

export const meta: Route.MetaFunction = () => [
  { title: "Lookup set · Isopleth" },
];

const NO_SUCH_SET = "There is no such lookup set among yours.";

/** The set id of the URL; anything but a positive whole number is a 404 (not a query with NaN). */
function setIdFrom(params: { setId?: string }): number {
  const raw = params.setId ?? "";
  invariantResponse(
    /^[1-9]\d{0,15}$/.test(raw) && Number.isSafeInteger(Number(raw)),
    NO_SUCH_SET,
  );
  return Number(raw);
}

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "save:lookup-sets");
  const page = await getLookupSetPage(setIdFrom(args.params), user.id);
  invariantResponse(page, NO_SUCH_SET);
  return page;
}

/** Runs the set against the sample's current approved revision and records the run (values in field units). */
export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "save:lookup-sets");
  const outcome = await runLookupSet(setIdFrom(args.params), user.id);
  invariantResponse(outcome, NO_SUCH_SET);
  return outcome;
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
        {set.properties
          .map((p) => PROPERTIES[p as PropertyKey].phrase)
          .join(", ")}{" "}
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
                      {PROPERTIES[p as PropertyKey].phrase}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {set.conditions.map((c, i) => (
                  <tr key={i} className="border-t border-line">
                    <td className="px-3 py-1 text-right">
                      {formatPrecision(c.pressurePsia, 6)}
                    </td>
                    <td className="px-3 py-1 text-right">
                      {formatPrecision(c.temperatureF, 5)}
                    </td>
                    {Object.entries(latest.results).map(([p, values]) => {
                      const now = values[i]?.value;
                      const before = previous?.results[p]?.[i]?.value;
                      const change =
                        now != null && before != null && before !== 0
                          ? ((now - before) / Math.abs(before)) * 100
                          : null;
                      return (
                        <td key={p} className="px-3 py-1 text-right">
                          {now === undefined || now === null
                            ? "—"
                            : formatPlain(now)}
                          {change !== null ? (
                            <span
                              className={`ml-2 text-xs ${Math.abs(change) > 1 ? "text-caution" : "text-ink-muted"}`}
                            >
                              {change >= 0 ? "+" : ""}
                              {formatDecimals(change, 2)} %
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
