import { Form, href, Link, useNavigation } from "react-router";
import { requirePermission } from "~/.server/auth/guards";
import { invariantResponse } from "~/.server/http";
import {
  getLookupSetPage,
  runLookupSet,
  setPageChoice,
} from "~/.server/lookup/sets";
import { EstimateCaution } from "~/components/estimate-caution";
import { Button, FormAlert } from "~/components/form";
import {
  ComparePicker,
  RunList,
  SetRunCompare,
  SetRunTable,
} from "~/components/lookup/set-runs";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/$setId";

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

/** ?run=<id> shows that run (default the latest); ?a=<id>&b=<id> compares two (default the last two). */
export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "save:lookup-sets");
  const page = await getLookupSetPage(
    setIdFrom(args.params),
    user.id,
    setPageChoice(new URL(args.request.url)),
  );
  invariantResponse(page, NO_SUCH_SET);
  return page;
}

/** Runs the set against the sample's current approved revision with the set's own settings, and records the run. */
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
  const { set, sampleLabel, runs, run, compare, currentRevision } = loaderData;
  const navigation = useNavigation();
  const setHref = href("/lookup/sets/:setId", { setId: String(set.id) });
  const exportHref = href("/lookup/sets/:setId/export", {
    setId: String(set.id),
  });
  return (
    <>
      <PageHeader title={`Lookup set: ${set.name}`}>
        {sampleLabel} · {set.conditionCount} conditions ·{" "}
        {set.properties.join(", ")} · {set.settings.text}. Each run uses and
        records these settings, with the revision it ran against.
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
      <RunList
        runs={runs}
        shownId={run?.id ?? null}
        hrefOf={(id) => `${setHref}?run=${id}`}
      />
      {run ? (
        <SetRunTable
          run={run}
          exportHref={(format) =>
            `${exportHref}?run=${run.id}&format=${format}`
          }
        />
      ) : null}
      <ComparePicker
        runs={runs}
        a={compare?.a.id ?? null}
        b={compare?.b.id ?? null}
      />
      {compare ? <SetRunCompare compare={compare} /> : null}
      {run ? (
        <EstimateCaution className="mt-4 rounded border border-caution/30 bg-caution-soft p-3 text-sm text-caution" />
      ) : null}
    </>
  );
}
