import { useMemo, useState } from "react";
import { Form, useFetcher, useSearchParams } from "react-router";
import { z } from "zod";
import { requirePermission } from "~/.server/auth/guards";
import {
  OUTPUT_SYSTEMS,
  type OutputSystem,
  PROPERTIES,
  PROPERTY_KEYS,
  type PropertyKey,
} from "~/core/units";
import { deleteLookupSet } from "~/.server/db/queries/lookup-sets";
import { SaveLookupSetSchema, saveLookupSet } from "~/.server/lookup/sets";
import { getLookupWorkspace } from "~/.server/lookup/workspace";
import { updateUserProfile } from "~/.server/db/queries/users";
import { badRequest, readFormData, readJsonBody } from "~/.server/forms";
import { Button, FormAlert } from "~/components/form";
import { EstimateCaution } from "~/components/estimate-caution";
import {
  ExplanationPanel,
  type ExplainTarget,
} from "~/components/lookup/explanation-panel";
import { LookupPlots } from "~/components/lookup/lookup-plots";
import {
  answeredRuns,
  type PropertyRun,
} from "~/components/lookup/property-run";
import { useLookupRun } from "~/components/lookup/use-lookup-run";
import { useRevisionGrids } from "~/components/lookup/use-revision-grids";
import { LookupResultsTable } from "~/components/lookup/results-table";
import { PageHeader } from "~/components/page-header";
import type { Method } from "~/core/interpolation";
import {
  depletionPath,
  parseConditionList,
  parseNumber,
  type Condition,
} from "~/utils/conditions";
import { readIntent } from "~/utils/forms";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Lookup · Isopleth" }];

const SetIdSchema = z.coerce.number().int().positive();

export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  return getLookupWorkspace(user);
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
  if (intent === "units") {
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

type Mode = "single" | "list" | "path";
type SampleInfo = Route.ComponentProps["loaderData"]["samples"][number];

const DEFAULT_PROPERTIES: PropertyKey[] = [
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
];

export default function Lookup({ loaderData }: Route.ComponentProps) {
  const { samples, user, canSave, sets } = loaderData;
  const [params] = useSearchParams();
  // ?revision=N: a named revision (e.g. a draft, for those whose role may read drafts); default the approved one.
  const revision = /^[1-9][0-9]{0,14}$/.test(params.get("revision") ?? "")
    ? Number(params.get("revision"))
    : undefined;
  const [filter, setFilter] = useState("");
  const [sampleId, setSampleId] = useState<number | null>(
    Number(params.get("sample")) ||
      samples.find((s) => s.approvedRevision !== null)?.id ||
      null,
  );
  const [properties, setProperties] =
    useState<PropertyKey[]>(DEFAULT_PROPERTIES);
  const [mode, setMode] = useState<Mode>("single");
  const [single, setSingle] = useState({
    pressure: "3250",
    temperature: "212",
  });
  const [list, setList] = useState("");
  const [path, setPath] = useState({
    from: "5000",
    to: "500",
    step: "250",
    temperature: "212",
  });
  const [method, setMethod] = useState<"auto" | Method>("auto");
  const [degree, setDegree] = useState<[number, number]>([3, 3]);
  const [units, setUnits] = useState<OutputSystem>(user.unitSystem);
  const [extrapolate, setExtrapolate] = useState(false);
  const lookup = useLookupRun();
  const { run } = lookup;
  const [explain, setExplain] = useState<ExplainTarget | null>(null);
  const loadGrids = useRevisionGrids();
  const unitsFetcher = useFetcher();
  const setsFetcher = useFetcher<typeof action>();

  const sample = samples.find((s) => s.id === sampleId) ?? null;
  const visibleSamples = useMemo(() => {
    const f = filter.trim().toLowerCase();
    return f
      ? samples.filter((s) =>
          `${s.label} ${s.well} ${s.field}`.toLowerCase().includes(f),
        )
      : samples;
  }, [samples, filter]);

  const pressureUnit = units === "field" ? "psia" : "bara";
  const temperatureUnit = units === "field" ? "°F" : "°C";

  function changeUnits(next: OutputSystem) {
    setUnits(next);
    lookup.clear();
    setExplain(null);
    if (next === "metric" && units === "field") {
      setSingle({ pressure: "224", temperature: "100" });
      setPath({ from: "345", to: "35", step: "15", temperature: "100" });
    } else if (next === "field" && units === "metric") {
      setSingle({ pressure: "3250", temperature: "212" });
      setPath({ from: "5000", to: "500", step: "250", temperature: "212" });
    }
    unitsFetcher.submit({ intent: "units", units: next }, { method: "post" });
  }

  function conditions(): Condition[] | string {
    if (mode === "single") {
      const pressure = parseNumber(single.pressure);
      const temperature = parseNumber(single.temperature);
      if (pressure === null || temperature === null)
        return "Enter a pressure and a temperature.";
      return [{ pressure, temperature }];
    }
    const parsed =
      mode === "list"
        ? parseConditionList(list)
        : depletionPath(
            parseNumber(path.from) ?? NaN,
            parseNumber(path.to) ?? NaN,
            parseNumber(path.step) ?? NaN,
            parseNumber(path.temperature) ?? NaN,
          );
    return parsed.ok ? parsed.conditions : parsed.error;
  }

  function runLookup(event: React.FormEvent) {
    event.preventDefault();
    setExplain(null);
    const conds = conditions();
    if (typeof conds === "string") return lookup.fail(conds);
    if (!sample) return lookup.fail("Choose a sample.");
    if (properties.length === 0)
      return lookup.fail("Choose at least one property.");
    void lookup.start({
      sampleId: sample.id,
      properties,
      conditions: conds,
      method,
      degree,
      units,
      extrapolate,
      revision,
    });
  }

  async function openExplanation(
    conditionIndex: number,
    property: PropertyKey,
  ) {
    if (!run) return;
    const propertyRun = run.runs.find((r) => r.property === property);
    if (!propertyRun?.ok) return;
    const result = propertyRun.results[conditionIndex];
    const condition = run.conditions[conditionIndex];
    if (!result || !condition || result.value === null) return;
    const data = await loadGrids(run.sampleId, run.units, propertyRun.revision);
    const grid = data.grids.find((g) => g.property === property);
    if (!grid) return;
    setExplain({
      propertyName: PROPERTIES[property].phrase,
      grid,
      point: condition,
      method: result.method as Method,
      degree:
        result.method === "pchip"
          ? null
          : result.method === "linear"
            ? [1, 1]
            : (propertyRun.degree ?? [3, 3]),
      extrapolate: run.runs.length > 0 && extrapolate,
      serverValue: result.value,
      revision: propertyRun.revision,
      units: {
        pressure: pressureUnit,
        temperature: temperatureUnit,
        value: propertyRun.unit,
      },
    });
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

  function loadSet(set: (typeof sets)[number]) {
    setSampleId(set.sampleId);
    setProperties(set.properties);
    setMethod(set.method as "auto" | Method);
    if (Array.isArray(set.degree)) setDegree(set.degree);
    changeUnits("field");
    setMode("list");
    setList(
      set.conditions
        .map((c) => `${c.pressurePsia}\t${c.temperatureF}`)
        .join("\n"),
    );
    lookup.clear();
  }

  function saveSet() {
    const name = window.prompt(
      "Name of the lookup set (e.g. a well's depletion path):",
    );
    const conds = conditions();
    if (!name || typeof conds === "string" || !sample) return;
    setsFetcher.submit(
      {
        intent: "save-set",
        name,
        sampleId: sample.id,
        properties,
        units,
        method,
        degree: method === "newton" ? degree : null,
        conditions: conds,
      },
      { method: "post", encType: "application/json" },
    );
  }

  return (
    <>
      <PageHeader title="Lookup">
        Properties at the conditions you need, interpolated from a sample&apos;s
        approved grids, with the error estimate, the method and the data zone
        behind every number.
      </PageHeader>
      <form
        onSubmit={runLookup}
        className="grid gap-4 rounded-lg border border-line bg-panel p-5 lg:grid-cols-3"
        aria-label="Lookup"
      >
        <fieldset className="space-y-2">
          <legend className="text-sm font-semibold">Sample</legend>
          <label className="sr-only" htmlFor="sample-filter">
            Filter samples
          </label>
          <input
            id="sample-filter"
            type="search"
            placeholder="Filter by sample, well or field"
            value={filter}
            onChange={(e) => setFilter(e.target.value)}
            className="w-full rounded border border-line px-3 py-1.5 text-sm"
          />
          <label className="sr-only" htmlFor="sample">
            Sample
          </label>
          <select
            id="sample"
            size={6}
            value={sampleId ?? ""}
            onChange={(e) => {
              setSampleId(Number(e.target.value));
              lookup.clear();
              setExplain(null);
            }}
            className="w-full rounded border border-line text-sm"
          >
            {visibleSamples.map((s) => (
              <option
                key={s.id}
                value={s.id}
                disabled={s.approvedRevision === null}
              >
                {s.label} — {s.well}, {s.field}
                {s.approvedRevision === null
                  ? " (no approved revision)"
                  : ` · rev. ${s.approvedRevision}`}
              </option>
            ))}
          </select>
          {sample ? (
            <SampleFacts
              sample={sample}
              pressureUnit={pressureUnit}
              temperatureUnit={temperatureUnit}
            />
          ) : null}
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold">Properties</legend>
          <div className="grid grid-cols-1 gap-1 text-sm">
            {PROPERTY_KEYS.map((p) => (
              <label
                key={p}
                className={`flex items-center gap-2 ${sample && !sample.properties.includes(p) ? "text-ink-muted" : ""}`}
              >
                <input
                  type="checkbox"
                  checked={properties.includes(p)}
                  disabled={!!sample && !sample.properties.includes(p)}
                  onChange={(e) =>
                    setProperties(
                      e.target.checked
                        ? [...properties, p]
                        : properties.filter((x) => x !== p),
                    )
                  }
                />
                {PROPERTIES[p].phrase}
              </label>
            ))}
          </div>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Method</span>
              <select
                value={method}
                onChange={(e) => setMethod(e.target.value as "auto" | Method)}
                className="rounded border border-line px-2 py-1"
              >
                <option value="auto">
                  Automatic (Newton [3,3], pchip where it overshoots)
                </option>
                <option value="newton">Newton, degree per axis</option>
                <option value="pchip">pchip (shape-preserving)</option>
                <option value="linear">Linear</option>
              </select>
            </label>
            {method === "newton" ? (
              <div className="flex gap-2">
                <label className="flex flex-col gap-1">
                  <span className="font-semibold">Degree in p</span>
                  <input
                    type="number"
                    min={1}
                    max={6}
                    value={degree[0]}
                    onChange={(e) =>
                      setDegree([Number(e.target.value), degree[1]])
                    }
                    className="w-20 rounded border border-line px-2 py-1"
                  />
                </label>
                <label className="flex flex-col gap-1">
                  <span className="font-semibold">Degree in T</span>
                  <input
                    type="number"
                    min={1}
                    max={6}
                    value={degree[1]}
                    onChange={(e) =>
                      setDegree([degree[0], Number(e.target.value)])
                    }
                    className="w-20 rounded border border-line px-2 py-1"
                  />
                </label>
              </div>
            ) : null}
          </div>
          <fieldset className="text-sm">
            <legend className="font-semibold">Units</legend>
            <div className="mt-1 flex gap-4">
              <label className="flex items-center gap-2">
                <input
                  type="radio"
                  name="units"
                  checked={units === "field"}
                  onChange={() => changeUnits("field")}
                />{" "}
                Field (psia, °F)
              </label>
              <label className="flex items-center gap-2">
                <input
                  type="radio"
                  name="units"
                  checked={units === "metric"}
                  onChange={() => changeUnits("metric")}
                />{" "}
                Metric (bara, °C)
              </label>
            </div>
          </fieldset>
          <label className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={extrapolate}
              onChange={(e) => setExtrapolate(e.target.checked)}
            />{" "}
            Allow extrapolation beyond the measured range (flagged)
          </label>
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold">Conditions</legend>
          <div
            role="tablist"
            aria-label="How to enter conditions"
            className="flex gap-1 text-sm"
          >
            {(
              [
                ["single", "One point"],
                ["list", "Pasted list"],
                ["path", "Depletion path"],
              ] as const
            ).map(([m, label]) => (
              <button
                key={m}
                type="button"
                role="tab"
                aria-selected={mode === m}
                onClick={() => setMode(m)}
                className={`rounded px-3 py-1 font-semibold ${mode === m ? "bg-accent-soft text-accent-strong" : "text-ink-muted hover:bg-surface"}`}
              >
                {label}
              </button>
            ))}
          </div>
          {mode === "single" ? (
            <div className="flex gap-3 text-sm">
              <label className="flex flex-col gap-1">
                <span className="font-semibold">Pressure ({pressureUnit})</span>
                <input
                  inputMode="decimal"
                  value={single.pressure}
                  onChange={(e) =>
                    setSingle({ ...single, pressure: e.target.value })
                  }
                  className="w-32 rounded border border-line px-2 py-1 tabular-nums"
                />
              </label>
              <label className="flex flex-col gap-1">
                <span className="font-semibold">
                  Temperature ({temperatureUnit})
                </span>
                <input
                  inputMode="decimal"
                  value={single.temperature}
                  onChange={(e) =>
                    setSingle({ ...single, temperature: e.target.value })
                  }
                  className="w-32 rounded border border-line px-2 py-1 tabular-nums"
                />
              </label>
            </div>
          ) : mode === "list" ? (
            <label className="block text-sm">
              <span className="font-semibold">
                Pressure ({pressureUnit}) and temperature ({temperatureUnit}),
                one pair per line
              </span>
              <textarea
                value={list}
                onChange={(e) => setList(e.target.value)}
                rows={6}
                placeholder={"3250\t212\n3000\t212"}
                className="mt-1 block w-full rounded border border-line px-2 py-1 font-mono text-xs"
              />
              <span className="text-xs text-ink-muted">
                Paste two columns from a spreadsheet; tabs, semicolons, commas
                or spaces.
              </span>
            </label>
          ) : (
            <div className="grid grid-cols-2 gap-2 text-sm">
              {(
                [
                  ["from", `From (${pressureUnit})`],
                  ["to", `To (${pressureUnit})`],
                  ["step", `Step (${pressureUnit})`],
                  ["temperature", `At (${temperatureUnit})`],
                ] as const
              ).map(([k, label]) => (
                <label key={k} className="flex flex-col gap-1">
                  <span className="font-semibold">{label}</span>
                  <input
                    inputMode="decimal"
                    value={path[k]}
                    onChange={(e) => setPath({ ...path, [k]: e.target.value })}
                    className="rounded border border-line px-2 py-1 tabular-nums"
                  />
                </label>
              ))}
            </div>
          )}
          <div className="flex flex-wrap gap-2 pt-2">
            <Button type="submit" disabled={lookup.running}>
              {lookup.running ? "Looking up…" : "Look up"}
            </Button>
            {canSave ? (
              <Button type="button" variant="secondary" onClick={saveSet}>
                Save as set
              </Button>
            ) : null}
          </div>
          {lookup.error ? <FormAlert message={lookup.error} /> : null}
          {setsFetcher.data && "saved" in setsFetcher.data ? (
            <FormAlert message={setsFetcher.data.saved} tone="ok" />
          ) : null}
        </fieldset>
      </form>

      {run ? <DraftBanner runs={run.runs} /> : null}
      {run ? (
        <LookupResultsTable
          conditions={run.conditions}
          runs={run.runs}
          units={{ pressure: pressureUnit, temperature: temperatureUnit }}
          method={run.method}
          sampleLabel={samples.find((s) => s.id === run.sampleId)?.label ?? ""}
          onExplain={openExplanation}
          elapsedMs={run.elapsedMs}
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
          conditions={run.conditions}
          units={{ pressure: pressureUnit, temperature: temperatureUnit }}
          unitOf={(p) => {
            const r = run.runs.find((x) => x.property === p);
            return r?.ok ? r.unit : "";
          }}
          method={run.method}
          degree={plotRun.degree}
          sampleLabel={samples.find((s) => s.id === run.sampleId)?.label ?? ""}
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

/** Said wherever a page shows values of an unapproved revision (asked for with ?revision=N). */
function DraftBanner({ runs }: { runs: PropertyRun[] }) {
  const drafts = [
    ...new Map(
      runs.flatMap((r) =>
        r.ok && !r.approved ? [[r.revision, r.revisionStatus] as const] : [],
      ),
    ).entries(),
  ];
  if (drafts.length === 0) return null;
  return (
    <div
      role="alert"
      className="mt-6 rounded-lg border border-danger/40 bg-red-50 p-4 text-sm text-danger"
    >
      <strong>Unapproved draft.</strong>{" "}
      {drafts
        .map(([number, status]) => `revision ${number} (${status})`)
        .join(", ")}{" "}
      has not been approved; its checks may have failed. These values are for
      review only: do not use them for decisions or hand them on.
    </div>
  );
}

function SampleFacts({
  sample,
  pressureUnit,
  temperatureUnit,
}: {
  sample: SampleInfo;
  pressureUnit: string;
  temperatureUnit: string;
}) {
  return (
    <dl className="grid grid-cols-2 gap-x-3 text-xs text-ink-muted">
      <dt>Reservoir</dt>
      <dd className="tabular-nums">
        {sample.reservoirPressure ?? "—"} {pressureUnit},{" "}
        {sample.reservoirTemperature ?? "—"} {temperatureUnit}
      </dd>
      <dt>Bubble point</dt>
      <dd className="tabular-nums">
        {sample.bubblePoint === null
          ? "—"
          : `${sample.bubblePoint} ${pressureUnit}`}
      </dd>
      <dt>Approved revision</dt>
      <dd>{sample.approvedRevision ?? "none"}</dd>
    </dl>
  );
}

function SavedSets({
  sets,
  onLoad,
}: {
  sets: Route.ComponentProps["loaderData"]["sets"];
  onLoad: (set: Route.ComponentProps["loaderData"]["sets"][number]) => void;
}) {
  if (sets.length === 0) return null;
  return (
    <section
      className="mt-6 rounded-lg border border-line bg-panel p-5"
      aria-labelledby="sets-title"
    >
      <h2 id="sets-title" className="font-semibold">
        Your lookup sets
      </h2>
      <ul className="mt-2 divide-y divide-line text-sm">
        {sets.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center gap-3 py-2">
            <span className="font-semibold">{s.name}</span>
            <span className="text-ink-muted">
              {s.sampleLabel} · {s.conditions.length} conditions ·{" "}
              {s.properties.length} properties · {s.method}
            </span>
            <span className="ml-auto flex gap-2">
              <Button
                type="button"
                variant="secondary"
                className="px-2 py-1"
                onClick={() => onLoad(s)}
              >
                Load
              </Button>
              <a
                href={`/lookup/sets/${s.id}`}
                className="rounded border border-line px-2 py-1 font-semibold hover:border-accent"
              >
                Runs
              </a>
              <Form method="post">
                <input type="hidden" name="setId" value={s.id} />
                <Button
                  type="submit"
                  name="intent"
                  value="delete-set"
                  variant="danger"
                  className="px-2 py-1"
                  aria-label={`Delete ${s.name}`}
                >
                  Delete
                </Button>
              </Form>
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
