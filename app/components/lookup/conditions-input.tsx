import type { ConditionMode, LookupFormState } from "./use-lookup-form";

const MODES: readonly (readonly [ConditionMode, string])[] = [
  ["single", "One point"],
  ["list", "Pasted list"],
  ["path", "Depletion path"],
];

/** The conditions, in one of three ways (tabs): one point, a list pasted from a spreadsheet, a depletion path. */
export function ConditionsInput({ form }: { form: LookupFormState }) {
  const { mode, single, path } = form;
  const { pressure: pressureUnit, temperature: temperatureUnit } =
    form.unitLabels;
  return (
    <>
      <div
        role="tablist"
        aria-label="How to enter conditions"
        className="flex gap-1 text-sm"
      >
        {MODES.map(([m, label]) => (
          <button
            key={m}
            type="button"
            role="tab"
            aria-selected={mode === m}
            onClick={() => form.setMode(m)}
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
                form.setSingle({ ...single, pressure: e.target.value })
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
                form.setSingle({ ...single, temperature: e.target.value })
              }
              className="w-32 rounded border border-line px-2 py-1 tabular-nums"
            />
          </label>
        </div>
      ) : mode === "list" ? (
        <label className="block text-sm">
          <span className="font-semibold">
            Pressure ({pressureUnit}) and temperature ({temperatureUnit}), one
            pair per line
          </span>
          <textarea
            value={form.list}
            onChange={(e) => form.setList(e.target.value)}
            rows={6}
            placeholder={"3250\t212\n3000\t212"}
            className="mt-1 block w-full rounded border border-line px-2 py-1 font-mono text-xs"
          />
          <span className="text-xs text-ink-muted">
            Paste two columns from a spreadsheet; tabs, semicolons, commas or
            spaces. No thousands separators (3250, not 3,250).
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
                onChange={(e) => form.setPath({ ...path, [k]: e.target.value })}
                className="rounded border border-line px-2 py-1 tabular-nums"
              />
            </label>
          ))}
        </div>
      )}
    </>
  );
}
