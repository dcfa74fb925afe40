import { describe, expect, test } from "vitest";
import { API_SCOPE_RULES, apiAccess } from "./api-scopes";
import { ROLES } from "./permissions";

/* OWASP Authorization cheat sheet: deny by default, check every request; RFC 6750 §3.1 insufficient_scope. */
describe("the scope table", () => {
  test("a token may do an operation only with one of its scopes AND its owner's current role's permission", () => {
    const export_ = API_SCOPE_RULES.find(
      (r) => r.operation === "export-table",
    )!;
    expect(export_.permission).toBe("export:tables");
    expect(apiAccess(["tables:read"], "engineer", "export-table")).toEqual({
      ok: true,
    });
    expect(apiAccess(["tables:read"], "viewer", "export-table")).toMatchObject({
      ok: false,
      reason: "role",
    });
    expect(apiAccess(["lookup"], "admin", "export-table")).toMatchObject({
      ok: false,
      reason: "scope",
    });
    expect(apiAccess(["lookup"], "viewer", "read-sample")).toMatchObject({
      ok: false,
      reason: "scope",
    });
    expect(apiAccess(["lookup"], "viewer", "lookup")).toEqual({ ok: true });
    expect(apiAccess([], "admin", "list-samples")).toMatchObject({
      ok: false,
      reason: "scope",
    });
  });

  test("a session (no scopes) is bound by its role alone", () => {
    for (const role of ROLES)
      expect(apiAccess(null, role, "export-table").ok).toBe(role !== "viewer");
    for (const role of ROLES)
      expect(apiAccess(null, role, "read-sample").ok).toBe(true);
  });
});
