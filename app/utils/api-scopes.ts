import { can, ROLE_LABELS, type Permission, type Role } from "./permissions";

/**
 * What an API token may do: the one table of scope rules. The token page shows it, the API enforces it
 * (app/.server/api/caller.ts) and the OpenAPI description quotes it. Client-safe.
 *
 * A token's authority is the intersection of its scopes and its owner's *current* role: each operation needs
 * one of its scopes on the token AND its permission (app/utils/permissions.ts) for the owner's role at the
 * time of the request. A signed-in browser session has no scopes; the role's permission alone applies.
 */
export const API_SCOPES = ["tables:read", "lookup"] as const;
export type ApiScope = (typeof API_SCOPES)[number];

export type ApiOperation =
  "list-samples" | "read-sample" | "export-table" | "lookup";

type ApiScopeRule = {
  operation: ApiOperation;
  method: "GET" | "POST";
  /** The path as the OpenAPI description writes it. */
  path: string;
  /** A request that exercises it (tests and the docs). */
  example: string;
  /** A token needs one of these. */
  scopes: readonly ApiScope[];
  /** The owner's role (or the signed-in person's role) needs this. */
  permission: Permission;
  description: string;
};

export const API_SCOPE_RULES: readonly ApiScopeRule[] = [
  {
    operation: "list-samples",
    method: "GET",
    path: "/api/v1/samples",
    example: "/api/v1/samples",
    scopes: ["tables:read", "lookup"],
    permission: "read:samples",
    description:
      "List the samples you may read: names, reservoir conditions, bubble point, approved revision and the properties measured (no measured values).",
  },
  {
    operation: "read-sample",
    method: "GET",
    path: "/api/v1/samples/{sampleId}",
    example: "/api/v1/samples/{sampleId}",
    scopes: ["tables:read"],
    permission: "read:samples",
    description:
      "Read a sample with the whole measured grids of an approved revision.",
  },
  {
    operation: "export-table",
    method: "GET",
    path: "/api/v1/samples/{sampleId}/table",
    example:
      "/api/v1/samples/{sampleId}/table?temperature=212&pressures=1000:4000:500",
    scopes: ["tables:read"],
    permission: "export:tables",
    description:
      "Export a resampled black-oil table (JSON, CSV or text); the owner must be allowed to export tables (engineer or above).",
  },
  {
    operation: "lookup",
    method: "POST",
    path: "/api/v1/samples/{sampleId}/lookup",
    example: "/api/v1/samples/{sampleId}/lookup",
    scopes: ["lookup"],
    permission: "read:samples",
    description:
      "Interpolate one property at given conditions: values with error estimates, never the measured grid itself.",
  },
];

export const SCOPE_LABELS: Record<ApiScope, string> = {
  "tables:read": "Read samples, measured grids and resampled tables",
  lookup: "Run lookups",
};

export function apiScopeRule(operation: ApiOperation): ApiScopeRule {
  const rule = API_SCOPE_RULES.find((r) => r.operation === operation);
  if (!rule) throw new Error(`no scope rule for ${operation}`);
  return rule;
}

type ApiAccess =
  { ok: true } | { ok: false; reason: "scope" | "role"; message: string };

/** Whether a caller (a token's scopes, or null for a browser session) with `role` may perform `operation`. */
export function apiAccess(
  scopes: readonly ApiScope[] | null,
  role: Role,
  operation: ApiOperation,
): ApiAccess {
  const rule = apiScopeRule(operation);
  if (scopes !== null && !rule.scopes.some((s) => scopes.includes(s))) {
    const needed = rule.scopes.map((s) => `\`${s}\``).join(" or ");
    return {
      ok: false,
      reason: "scope",
      message: `This token lacks the ${needed} scope that ${rule.method} ${rule.path} needs.`,
    };
  }
  if (!can({ role }, rule.permission)) {
    const who = scopes === null ? "Your role" : "The token's owner is now";
    return {
      ok: false,
      reason: "role",
      message: `${who} ${scopes === null ? `(${ROLE_LABELS[role]})` : `a ${role} (${ROLE_LABELS[role]})`} may not ${rule.permission === "export:tables" ? "export tables" : "do this"} (${rule.method} ${rule.path} needs the ${rule.permission} permission).`,
    };
  }
  return { ok: true };
}
