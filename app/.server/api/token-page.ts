import type { SessionUser } from "~/.server/auth/session";
import { listFieldsAndSamples } from "~/.server/db/queries/catalogue";
import type { TokenRow } from "~/components/tokens/token-table";
import { listTokensFor, MAX_TOKEN_LIFETIME_DAYS } from "./tokens";

/**
 * What the API tokens page shows: the tokens the person may see (each with the fields and samples it is
 * restricted to, by name, and whether they may revoke it) and, when they may create one, the fields and samples
 * to restrict a new token to. Who may list, create and revoke which tokens: ./tokens.ts.
 */
export async function loadTokensPage(user: SessionUser) {
  const listing = await listTokensFor(user);
  const catalogue = listing.canCreate
    ? await listFieldsAndSamples()
    : { fields: [], samples: [] };
  const tokens = listing.tokens.map((t): TokenRow => ({
    id: t.id,
    name: t.name,
    ownerEmail: t.ownerEmail,
    scopes: t.scopes,
    restrictedTo: [
      ...(t.restriction?.fieldIds ?? []).map(
        (id) =>
          catalogue.fields.find((f) => f.id === id)?.name ?? `field ${id}`,
      ),
      ...(t.restriction?.sampleIds ?? []).map(
        (id) =>
          catalogue.samples.find((s) => s.id === id)?.label ?? `sample ${id}`,
      ),
    ],
    expiresAt: t.expiresAt.toISOString(),
    lastUsedAt: t.lastUsedAt ? t.lastUsedAt.toISOString() : null,
    revoked: t.revokedAt !== null,
    expired: t.expired,
    mayRevoke: !t.revokedAt && (t.userId === user.id || listing.seeAll),
  }));
  return {
    role: user.role,
    seeAll: listing.seeAll,
    canCreate: listing.canCreate,
    tokens,
    fields: catalogue.fields,
    samples: catalogue.samples,
    maxDays: MAX_TOKEN_LIFETIME_DAYS,
  };
}
