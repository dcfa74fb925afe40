import { useMemo, useState } from "react";
import {
  type ShouldRevalidateFunctionArgs,
  useFetcher,
  useSearchParams,
} from "react-router";
import { z } from "zod";
import { requirePermission } from "~/.server/auth/guards";
import { deleteLookupSet } from "~/.server/db/queries/lookup-sets";
import { updateUserProfile } from "~/.server/db/queries/users";
import { badRequest, readFormData, readJsonBody } from "~/.server/forms";
import { SaveLookupSetSchema, saveLookupSet } from "~/.server/lookup/sets";
import { getLookupWorkspace } from "~/.server/lookup/workspace";
import { EstimateCaution } from "~/components/estimate-caution";
import { DraftBanner } from "~/components/lookup/draft-banner";
import { explainTargetOf } from "~/components/lookup/explain-target";
import {
  ExplanationPanel,
  type ExplainTarget,
} from "~/components/lookup/explanation-panel";
import { LookupForm } from "~/components/lookup/lookup-form";
import { unitsInAddress } from "~/components/lookup/lookup-params";
import { LookupPlots } from "~/components/lookup/lookup-plots";
import { answeredRuns } from "~/components/lookup/property-run";
import { LookupResultsTable } from "~/components/lookup/results-table";
import { SavedSets, type SavedLookupSet } from "~/components/lookup/saved-sets";
import { useLookupForm } from "~/components/lookup/use-lookup-form";
import { useLookupRun } from "~/components/lookup/use-lookup-run";
import { useRevisionGrids } from "~/components/lookup/use-revision-grids";
import { PageHeader } from "~/components/page-header";
import {
  OUTPUT_SYSTEMS,
  type OutputSystem,
  type PropertyKey,
  unitLabel,
} from "~/core/units";
import { readIntent } from "~/utils/forms";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Lookup · Isopleth" }];

const SetIdSchema = z.coerce.number().int().positive();

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const units = unitsInAddress(new URL(args.request.url).searchParams);
  return getLookupWorkspace(user, units ?? user.unitSystem);
}

/** The page's other choices live in its address too, but only the unit system changes what the loader lists. */
export function shouldRevalidate({
  currentUrl,
  nextUrl,
  formMethod,
  defaultShouldRevalidate,
}: ShouldRevalidateFunctionArgs) {
  if (
    !formMethod &&
    currentUrl.pathname === nextUrl.pathname &&
    currentUrl.searchParams.get("units") === nextUrl.searchParams.get("units")
  )
    return false;
  return defaultShouldRevalidate;
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "read:samples");
  const contentType = args.request.headers.get("Content-Type") ?? "";
  const payload = (
    contentType.includes("application/json")
      ? await readJsonBody(args.request)
      : Object.fromEntries(await readFormData(args.request))
  ) as Record<string, unknown>;
  const intent = readIntent(payload);
  // "Make this my default": the one way this page changes the account's unit system
  if (intent === "default-units") {
    const units = z.enum(OUTPUT_SYSTEMS).safeParse(payload.units);
    if (!units.success)
      return badRequest({ errors: { units: ["Choose field or metric."] } });
    await updateUserProfile(user.id, { unitSystem: units.data });
    return { ok: true as const };
  }
  requirePermission(args, "save:lookup-sets");
  if (intent === "delete-set") {
    const id = SetIdSchema.safeParse(payload.setId);
    if (id.success) await deleteLookupSet(id.data, user.id);
    return { ok: true as const, saved: "The set is deleted." };
  }
  const parsed = SaveLookupSetSchema.safeParse(payload);
  if (!parsed.success)
    return badRequest({
      errors: { name: parsed.error.issues.map((i) => i.message) },
    });
  return {
    ok: true as const,
    saved: await saveLookupSet(user.id, parsed.data),
  };
}

export default function Lookup({ loaderData }: Route.ComponentProps) {
  const { samples, user, canSave, sets } = loaderData;
  const [params] = useSearchParams();
  // ?revision=N: a named revision (e.g. a draft, for those whose role may read drafts); default the approved one.
  const revision = /^[1-9][0-9]{0,14}$/.test(params.get("revision") ?? "")
    ? Number(params.get("revision"))
    : undefined;
  const form = useLookupForm({ samples, accountUnits: user.unitSystem });
  const lookup = useLookupRun();
  const loadGrids = useRevisionGrids();
  const [explain, setExplain] = useState<ExplainTarget | null>(null);
  const unitsFetcher = useFetcher();
  const setsFetcher = useFetcher<typeof action>();
  const { run } = lookup;
  const units = form.unitLabels;
  // the grids are drawn and explained in absolute pressures, whatever basis the conditions were typed in
  const absoluteUnits = {
    ...units,
    pressure: unitLabel(form.units, "pressure"),
  };

  function changeUnits(next: OutputSystem) {
    form.changeUnits(next);
    lookup.clear();
    setExplain(null);
  }

  function makeDefault() {
    unitsFetcher.submit(
      { intent: "default-units", units: form.units },
      { method: "post" },
    );
  }

  function lookUp(event: React.FormEvent) {
    event.preventDefault();
    setExplain(null);
    const query = form.query(revision);
    if (typeof query === "string") return lookup.fail(query);
    void lookup.start(query);
  }

  async function openExplanation(index: number, property: PropertyKey) {
    if (!run) return;
    const target = await explainTargetOf(run, index, property, {
      loadGrids,
      extrapolate: form.extrapolate,
      units: absoluteUnits,
    });
    if (target) setExplain(target);
  }

  // The plots show the grids of the revision of the first property answered.
  const plotRun = run ? (answeredRuns(run.runs)[0] ?? null) : null;
  const loadPlotGrids = useMemo(
    () =>
      run && plotRun
        ? () => loadGrids(run.sampleId, run.units, plotRun.revision)
        : null,
    [run, plotRun, loadGrids],
  );

  function loadSet(set: SavedLookupSet) {
    form.applySet(set);
    lookup.clear();
    setExplain(null);
  }

  function saveSet() {
    const name = window.prompt(
      "Name of the lookup set (e.g. a well's depletion path):",
    );
    const set = name ? form.setToSave(name) : null;
    if (set)
      setsFetcher.submit(
        { intent: "save-set", ...set },
        { method: "post", encType: "application/json" },
      );
  }

  const sampleLabel = run
    ? (samples.find((s) => s.id === run.sampleId)?.label ?? "")
    : "";
  return (
    <>
      <PageHeader title="Lookup">
        Properties at the conditions you need, interpolated from a sample&apos;s
        approved grids, with the error estimate, the method and the data zone
        behind every number.
      </PageHeader>
      <LookupForm
        form={form}
        samples={samples}
        onSampleChange={(id) => {
          form.setSampleId(id);
          lookup.clear();
          setExplain(null);
        }}
        onUnitsChange={changeUnits}
        onMakeDefault={unitsFetcher.state === "idle" ? makeDefault : null}
        onSubmit={lookUp}
        running={lookup.running}
        onSave={canSave ? saveSet : null}
        error={lookup.error}
        saved={
          setsFetcher.data && "saved" in setsFetcher.data
            ? setsFetcher.data.saved
            : undefined
        }
      />

      {run ? <DraftBanner runs={run.runs} /> : null}
      {run ? (
        <LookupResultsTable
          conditions={run.conditions}
          runs={run.runs}
          units={units}
          method={run.method}
          sampleLabel={sampleLabel}
          onExplain={(index, property) => void openExplanation(index, property)}
          elapsedMs={run.elapsedMs}
          exportQuery={run.query}
        />
      ) : null}
      {explain ? (
        <ExplanationPanel target={explain} onClose={() => setExplain(null)} />
      ) : null}
      {run && plotRun && loadPlotGrids ? (
        <LookupPlots
          key={`${run.sampleId}-${run.units}-${plotRun.revision}-${run.conditions.length}`}
          properties={answeredRuns(run.runs).map((r) => r.property)}
          load={loadPlotGrids}
          conditions={run.absoluteConditions}
          units={absoluteUnits}
          unitOf={(p) => {
            const r = run.runs.find((x) => x.property === p);
            return r?.ok ? r.unit : "";
          }}
          method={run.method}
          degree={plotRun.degree}
          sampleLabel={sampleLabel}
          sampleId={run.sampleId}
        />
      ) : null}

      {run ? (
        <EstimateCaution className="mt-4 rounded border border-caution/30 bg-caution-soft p-3 text-sm text-caution" />
      ) : null}
      {canSave ? <SavedSets sets={sets} onLoad={loadSet} /> : null}
    </>
  );
}
