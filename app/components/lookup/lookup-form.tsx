import { Button, FormAlert } from "~/components/form";
import type { OutputSystem } from "~/core/units";
import type { SampleSummary } from "~/utils/api/client";
import { ConditionsInput } from "./conditions-input";
import { LookupOptions } from "./lookup-options";
import { SamplePicker } from "./sample-picker";
import type { LookupFormState } from "./use-lookup-form";

/** The lookup form: sample, properties and options, conditions, and the buttons with their messages. */
export function LookupForm({
  form,
  samples,
  onSampleChange,
  onUnitsChange,
  onMakeDefault,
  onSubmit,
  running,
  onSave,
  error,
  saved,
}: {
  form: LookupFormState;
  samples: readonly SampleSummary[];
  onSampleChange: (sampleId: number) => void;
  onUnitsChange: (units: OutputSystem) => void;
  /** "Make this my default" (the page's unit system becomes the account's); null while it is being saved. */
  onMakeDefault: (() => void) | null;
  onSubmit: (event: React.FormEvent) => void;
  running: boolean;
  /** "Save as set", offered only when given. */
  onSave: (() => void) | null;
  error: string | null;
  /** What the last save said, e.g. "Saved “…” (3 conditions)." */
  saved?: string;
}) {
  return (
    <form
      onSubmit={onSubmit}
      className="grid gap-4 rounded-lg border border-line bg-panel p-5 lg:grid-cols-3 [&>fieldset]:min-w-0"
      aria-label="Lookup"
    >
      <SamplePicker
        samples={samples}
        sampleId={form.sampleId}
        onChange={onSampleChange}
        units={form.unitLabels}
      />
      <LookupOptions
        form={form}
        onUnitsChange={onUnitsChange}
        onMakeDefault={onMakeDefault}
      />
      <fieldset className="space-y-3">
        <legend className="text-sm font-semibold">Conditions</legend>
        <ConditionsInput form={form} />
        <div className="flex flex-wrap gap-2 pt-2">
          <Button type="submit" disabled={running}>
            {running ? "Looking up…" : "Look up"}
          </Button>
          {onSave ? (
            <Button type="button" variant="secondary" onClick={onSave}>
              Save as set
            </Button>
          ) : null}
        </div>
        {error ? <FormAlert message={error} /> : null}
        {saved ? <FormAlert message={saved} tone="ok" /> : null}
      </fieldset>
    </form>
  );
}
