import { useState } from "react";
import { Form, useNavigation } from "react-router";
import { Button, FieldError, TextField } from "~/components/form";
import { API_SCOPES, SCOPE_LABELS } from "~/utils/api-scopes";

/** A token just created: shown once, with a button to copy it. */
export function CreatedToken({
  created,
}: {
  created: { name: string; token: string; expiresAt: string };
}) {
  const [copied, setCopied] = useState(false);
  return (
    <section
      className="mb-6 rounded-lg border border-accent bg-accent-soft p-5"
      aria-labelledby="new-token"
    >
      <h2 id="new-token" className="font-semibold text-accent-strong">
        Token “{created.name}” created — copy it now, it will not be shown again
      </h2>
      <textarea
        readOnly
        aria-label="New token"
        className="mt-2 h-24 w-full rounded border border-line bg-panel p-2 font-mono text-xs break-all"
        value={created.token}
      />
      <div className="mt-2 flex items-center gap-3 text-sm">
        <Button
          type="button"
          variant="secondary"
          onClick={() =>
            void navigator.clipboard
              .writeText(created.token)
              .then(() => setCopied(true))
          }
        >
          {copied ? "Copied" : "Copy token"}
        </Button>
        <span className="text-ink-muted">
          Expires {created.expiresAt.slice(0, 10)}. Send it as{" "}
          <code>Authorization: Bearer …</code>.
        </span>
      </div>
    </section>
  );
}

/** The form that creates a token: name, lifetime, scopes and an optional restriction to fields or samples. */
export function NewTokenForm({
  fields,
  samples,
  maxDays,
  errors,
}: {
  fields: { id: number; name: string }[];
  samples: { id: number; label: string }[];
  maxDays: number;
  errors: Record<string, string[] | undefined>;
}) {
  const navigation = useNavigation();
  return (
    <section className="rounded-lg border border-line bg-panel p-5">
      <h2 className="font-semibold">New token</h2>
      <Form method="post" className="mt-3 grid gap-4 md:grid-cols-2">
        <input type="hidden" name="intent" value="create" />
        <TextField
          label="Name"
          name="name"
          required
          errors={errors.name}
          hint="What will use it, e.g. “Calder full-field model”."
        />
        <TextField
          label="Expires after (days)"
          name="expiresInDays"
          type="number"
          min={1}
          max={maxDays}
          defaultValue={90}
          required
          errors={errors.expiresInDays}
          hint={`At most ${maxDays} days.`}
        />
        <fieldset>
          <legend className="text-sm font-semibold">Scopes</legend>
          {API_SCOPES.map((scope) => (
            <label key={scope} className="mt-1 flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                name="scopes"
                value={scope}
                defaultChecked
              />{" "}
              {SCOPE_LABELS[scope]} (<code>{scope}</code>)
            </label>
          ))}
          <p className="mt-1 text-xs text-ink-muted">
            What each scope allows is listed below.
          </p>
          <FieldError errors={errors.scopes} />
        </fieldset>
        <fieldset>
          <legend className="text-sm font-semibold">
            Restrict to (optional)
          </legend>
          <p className="text-xs text-ink-muted">
            Leave both empty for every sample you may read.
          </p>
          <div className="mt-1 grid grid-cols-2 gap-2">
            <label className="text-sm">
              Fields
              <select
                name="fieldIds"
                multiple
                className="mt-1 block h-24 w-full rounded border border-line text-sm"
              >
                {fields.map((f) => (
                  <option key={f.id} value={f.id}>
                    {f.name}
                  </option>
                ))}
              </select>
            </label>
            <label className="text-sm">
              Samples
              <select
                name="sampleIds"
                multiple
                className="mt-1 block h-24 w-full rounded border border-line text-sm"
              >
                {samples.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.label}
                  </option>
                ))}
              </select>
            </label>
          </div>
        </fieldset>
        <div className="md:col-span-2">
          <Button type="submit" disabled={navigation.state === "submitting"}>
            Create token
          </Button>
        </div>
      </Form>
    </section>
  );
}
