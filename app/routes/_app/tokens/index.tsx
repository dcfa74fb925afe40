import { useState } from "react";
import { Form, useNavigation } from "react-router";
import { z } from "zod";
import {
  issueApiToken,
  listTokensFor,
  MAX_TOKEN_LIFETIME_DAYS,
  revokeToken,
} from "~/.server/api/tokens";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { listFieldsAndSamples } from "~/.server/db/queries/catalogue";
import { badRequest, readFormData } from "~/.server/forms";
import { Button, FieldError, FormAlert, TextField } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { API_SCOPE_RULES, API_SCOPES, SCOPE_LABELS } from "~/utils/api-scopes";
import { labelSchema } from "~/utils/labels";
import { fieldErrorsOf, readIntent } from "~/utils/forms";
import { ROLE_LABELS } from "~/utils/permissions";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [
  { title: "API tokens · Isopleth" },
];

const CreateSchema = z.object({
  intent: z.literal("create"),
  name: labelSchema(
    "token name",
    120,
    true,
    "Give the token a name, e.g. the model or script that uses it.",
  ),
  scopes: z.array(z.enum(API_SCOPES)).min(1, "Choose at least one scope."),
  fieldIds: z.array(z.coerce.number().int().positive()),
  sampleIds: z.array(z.coerce.number().int().positive()),
  expiresInDays: z.coerce
    .number()
    .int()
    .min(1, "At least one day.")
    .max(
      MAX_TOKEN_LIFETIME_DAYS,
      `At most ${MAX_TOKEN_LIFETIME_DAYS} days (one year).`,
    ),
});
const RevokeSchema = z.object({
  intent: z.literal("revoke"),
  tokenId: z.uuid(),
});

/* Who may list, create and revoke which tokens: app/.server/api/tokens.ts. */
export async function loader(args: Route.LoaderArgs) {
  const user = requirePermission(args, "read:samples");
  const listing = await listTokensFor(user);
  const catalogue = listing.canCreate
    ? await listFieldsAndSamples()
    : { fields: [], samples: [] };
  return {
    user,
    ...listing,
    ...catalogue,
    maxDays: MAX_TOKEN_LIFETIME_DAYS,
  };
}

export async function action(args: Route.ActionArgs) {
  const user = requirePermission(args, "read:samples");
  const { ipAddress } = getCaller(args);
  const form = await readFormData(args.request);
  if (readIntent(form) === "revoke") {
    const parsed = RevokeSchema.safeParse(Object.fromEntries(form));
    if (!parsed.success)
      return badRequest({
        errors: {},
        formError: "That token cannot be found.",
      });
    const revoked = await revokeToken({
      user,
      tokenId: parsed.data.tokenId,
      ipAddress,
    });
    if (!revoked.ok && revoked.reason === "forbidden")
      throw new Response("You may revoke only your own tokens.", {
        status: 403,
      });
    if (!revoked.ok)
      return badRequest({
        errors: {},
        formError: "That token cannot be found.",
      });
    return {
      errors: {},
      done: `Token “${revoked.name}” is revoked; it stops working on its next request.`,
    };
  }
  requirePermission(args, "manage:own-tokens");
  const parsed = CreateSchema.safeParse({
    intent: form.get("intent"),
    name: form.get("name"),
    scopes: form.getAll("scopes"),
    fieldIds: form.getAll("fieldIds"),
    sampleIds: form.getAll("sampleIds"),
    expiresInDays: form.get("expiresInDays"),
  });
  if (!parsed.success)
    return badRequest({ errors: fieldErrorsOf(parsed.error.issues) });
  const { name, scopes, fieldIds, sampleIds, expiresInDays } = parsed.data;
  const issued = await issueApiToken({
    userId: user.id,
    name,
    scopes,
    fieldIds,
    sampleIds,
    expiresInDays,
    ipAddress,
  });
  return {
    errors: {},
    created: {
      name,
      token: issued.token,
      expiresAt: issued.expiresAt.toISOString(),
    },
  };
}

export default function Tokens({
  loaderData,
  actionData,
}: Route.ComponentProps) {
  const { tokens, fields, samples, seeAll, canCreate, user, maxDays } =
    loaderData;
  const navigation = useNavigation();
  const errors: Record<string, string[] | undefined> = actionData?.errors ?? {};
  const created =
    actionData && "created" in actionData ? actionData.created : null;
  const done = actionData && "done" in actionData ? actionData.done : null;
  const [copied, setCopied] = useState(false);
  return (
    <>
      <PageHeader title="API tokens">
        A token lets a reservoir simulator or a script read approved tables and
        run lookups through the API without a person signing in. It is shown
        once; keep it like a password. See the{" "}
        <a className="text-accent underline" href="/api-docs">
          API documentation
        </a>
        .
      </PageHeader>
      <FormAlert message={done} tone="ok" />
      {created ? (
        <section
          className="mb-6 rounded-lg border border-accent bg-accent-soft p-5"
          aria-labelledby="new-token"
        >
          <h2 id="new-token" className="font-semibold text-accent-strong">
            Token “{created.name}” created — copy it now, it will not be shown
            again
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
      ) : null}
      {canCreate ? (
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
                <label
                  key={scope}
                  className="mt-1 flex items-center gap-2 text-sm"
                >
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
              <Button
                type="submit"
                disabled={navigation.state === "submitting"}
              >
                Create token
              </Button>
            </div>
          </Form>
        </section>
      ) : (
        <p className="rounded-lg border border-line bg-panel p-5 text-sm">
          Your role ({ROLE_LABELS[user.role]}) cannot create tokens. You can
          still see and revoke the tokens you have; they can do no more than
          your role allows.
        </p>
      )}
      <ScopeTable />
      <div className="mt-6 overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-sm">
          <caption className="sr-only">
            {seeAll ? "All API tokens" : "Your API tokens"}
          </caption>
          <thead className="bg-surface text-left text-ink-muted">
            <tr>
              <th className="px-3 py-2 font-semibold">Name</th>
              {seeAll ? (
                <th className="px-3 py-2 font-semibold">Owner</th>
              ) : null}
              <th className="px-3 py-2 font-semibold">Scopes</th>
              <th className="px-3 py-2 font-semibold">Restricted to</th>
              <th className="px-3 py-2 font-semibold">Expires</th>
              <th className="px-3 py-2 font-semibold">Last used</th>
              <th className="px-3 py-2 font-semibold">Status</th>
              <th className="px-3 py-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {tokens.map((t) => {
              const restricted = [
                ...(t.restriction?.fieldIds ?? []).map(
                  (id) =>
                    fields.find((f) => f.id === id)?.name ?? `field ${id}`,
                ),
                ...(t.restriction?.sampleIds ?? []).map(
                  (id) =>
                    samples.find((s) => s.id === id)?.label ?? `sample ${id}`,
                ),
              ];
              return (
                <tr key={t.id} className="border-t border-line">
                  <td className="px-3 py-2 font-semibold">{t.name}</td>
                  {seeAll ? (
                    <td className="px-3 py-2">{t.ownerEmail}</td>
                  ) : null}
                  <td className="px-3 py-2 font-mono text-xs">
                    {t.scopes.join(" ")}
                  </td>
                  <td className="px-3 py-2">
                    {restricted.length
                      ? restricted.join(", ")
                      : "everything readable"}
                  </td>
                  <td className="px-3 py-2 tabular-nums">
                    {new Date(t.expiresAt).toISOString().slice(0, 10)}
                  </td>
                  <td className="px-3 py-2 tabular-nums">
                    {t.lastUsedAt
                      ? new Date(t.lastUsedAt)
                          .toISOString()
                          .replace("T", " ")
                          .slice(0, 16)
                      : "never"}
                  </td>
                  <td className="px-3 py-2">
                    {t.revokedAt ? (
                      <span className="text-danger">Revoked</span>
                    ) : t.expired ? (
                      "Expired"
                    ) : (
                      "Active"
                    )}
                  </td>
                  <td className="px-3 py-2 text-right">
                    {!t.revokedAt && (t.userId === user.id || seeAll) ? (
                      <Form method="post">
                        <input type="hidden" name="tokenId" value={t.id} />
                        <Button
                          type="submit"
                          name="intent"
                          value="revoke"
                          variant="danger"
                          className="px-2 py-1"
                          aria-label={`Revoke ${t.name}`}
                        >
                          Revoke
                        </Button>
                      </Form>
                    ) : null}
                  </td>
                </tr>
              );
            })}
            {tokens.length === 0 ? (
              <tr>
                <td
                  colSpan={8}
                  className="px-3 py-6 text-center text-ink-muted"
                >
                  No tokens yet.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </>
  );
}

/** The one table of scope rules (app/utils/api-scopes.ts), as the API enforces it. */
function ScopeTable() {
  return (
    <div className="mt-6 overflow-x-auto rounded-lg border border-line bg-panel">
      <table className="w-full text-sm">
        <caption className="px-3 pt-3 text-left font-semibold">
          What each scope allows
        </caption>
        <thead className="text-left text-ink-muted">
          <tr>
            <th className="px-3 py-2 font-semibold">Request</th>
            <th className="px-3 py-2 font-semibold">Token needs the scope</th>
            <th className="px-3 py-2 font-semibold">Owner&apos;s role needs</th>
            <th className="px-3 py-2 font-semibold">What it gives</th>
          </tr>
        </thead>
        <tbody>
          {API_SCOPE_RULES.map((rule) => (
            <tr key={rule.operation} className="border-t border-line">
              <td className="px-3 py-2 font-mono text-xs">
                {rule.method} {rule.path}
              </td>
              <td className="px-3 py-2 font-mono text-xs">
                {rule.scopes.join(" or ")}
              </td>
              <td className="px-3 py-2 font-mono text-xs">{rule.permission}</td>
              <td className="px-3 py-2">{rule.description}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="px-3 pb-3 text-xs text-ink-muted">
        The role is checked on every request: if the owner&apos;s role changes,
        existing tokens follow at once. Tokens read approved revisions only.
      </p>
    </div>
  );
}
