import { z } from "zod";
import { loadTokensPage } from "~/.server/api/token-page";
import {
  issueApiToken,
  MAX_TOKEN_LIFETIME_DAYS,
  revokeToken,
} from "~/.server/api/tokens";
import { getCaller, requirePermission } from "~/.server/auth/guards";
import { badRequest, readFormData } from "~/.server/forms";
import { FormAlert } from "~/components/form";
import { PageHeader } from "~/components/page-header";
import { CreatedToken, NewTokenForm } from "~/components/tokens/new-token";
import { ScopeRulesTable } from "~/components/tokens/scope-rules-table";
import { TokenTable } from "~/components/tokens/token-table";
import { API_SCOPES } from "~/utils/api-scopes";
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
  return loadTokensPage(user);
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
  const { tokens, fields, samples, seeAll, canCreate, role, maxDays } =
    loaderData;
  const errors: Record<string, string[] | undefined> = actionData?.errors ?? {};
  const created =
    actionData && "created" in actionData ? actionData.created : null;
  const done = actionData && "done" in actionData ? actionData.done : null;
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
      {created ? <CreatedToken key={created.token} created={created} /> : null}
      {canCreate ? (
        <NewTokenForm
          fields={fields}
          samples={samples}
          maxDays={maxDays}
          errors={errors}
        />
      ) : (
        <p className="rounded-lg border border-line bg-panel p-5 text-sm">
          Your role ({ROLE_LABELS[role]}) cannot create tokens. You can still
          see and revoke the tokens you have; they can do no more than your role
          allows.
        </p>
      )}
      <ScopeRulesTable />
      <TokenTable tokens={tokens} seeAll={seeAll} />
    </>
  );
}
