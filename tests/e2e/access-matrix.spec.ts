import type { RouteConfigEntry } from "@react-router/dev/routes";
import { expect, test, type APIRequestContext } from "@playwright/test";
import routes from "../../app/routes";
import { apiContextFor, type DemoRole } from "../support/e2e";

/*
 * Walks EVERY route of app/routes.ts for an anonymous caller and each role. A route without a rule here fails
 * the test, so a new page or API route cannot ship without a decision about who may use it.
 * Expectations follow the capability table of the access issue (viewer < engineer < lab lead < admin).
 */
type Who = "anonymous" | DemoRole;
const ROLES: DemoRole[] = ["viewer", "engineer", "lab_lead", "admin"];
const EVERYONE: Who[] = ["anonymous", ...ROLES];

type Rule =
  | { kind: "layout" }
  | { kind: "public"; path: string }
  | { kind: "signed-out-only"; path: string }
  | { kind: "page"; path: string; allowed: DemoRole[]; post?: { allowed: DemoRole[]; form: Record<string, string> } }
  | { kind: "api"; path: string; allowed: DemoRole[] | "public" }
  | { kind: "post-only"; path: string };

const ALL = ROLES;
const ENGINEER_UP: DemoRole[] = ["engineer", "lab_lead", "admin"];
const ADMIN: DemoRole[] = ["admin"];

const RULES: Record<string, Rule> = {
  "routes/_app/layout.tsx": { kind: "layout" },
  "routes/_auth/layout.tsx": { kind: "layout" },
  "routes/_app/index.tsx": { kind: "page", path: "/", allowed: ALL },
  "routes/_app/samples/index.tsx": { kind: "page", path: "/samples", allowed: ALL },
  "routes/_app/lookup/index.tsx": { kind: "page", path: "/lookup", allowed: ALL },
  "routes/_app/compare/index.tsx": { kind: "page", path: "/compare", allowed: ALL },
  "routes/_app/tokens/index.tsx": { kind: "page", path: "/tokens", allowed: ENGINEER_UP },
  "routes/_app/account/index.tsx": { kind: "page", path: "/account", allowed: ALL },
  "routes/_app/admin/people/index.tsx": {
    kind: "page",
    path: "/admin/people",
    allowed: ADMIN,
    post: { allowed: ADMIN, form: { intent: "invite", email: "not-an-email", role: "viewer" } },
  },
  "routes/_app/admin/audit/index.tsx": { kind: "page", path: "/admin/audit", allowed: ADMIN },
  "routes/_app/admin/mail/index.tsx": { kind: "page", path: "/admin/mail", allowed: ADMIN },
  "routes/_auth/sign-in/index.tsx": { kind: "signed-out-only", path: "/sign-in" },
  "routes/_auth/forgot-password/index.tsx": { kind: "signed-out-only", path: "/forgot-password" },
  "routes/_auth/reset-password/$token.tsx": { kind: "public", path: "/reset-password/not-a-real-token" },
  "routes/_auth/invitation/$token.tsx": { kind: "public", path: "/invitation/not-a-real-token" },
  "routes/sign-out.ts": { kind: "post-only", path: "/sign-out" },
  "routes/api/health.ts": { kind: "api", path: "/api/health", allowed: "public" },
};

function flatten(entries: RouteConfigEntry[]): string[] {
  return entries.flatMap((e) => [e.file, ...flatten(e.children ?? [])]);
}

const contexts = new Map<Who, APIRequestContext>();
test.beforeAll(async () => {
  for (const who of EVERYONE) contexts.set(who, await apiContextFor(who === "anonymous" ? null : who));
});
test.afterAll(async () => {
  for (const c of contexts.values()) await c.dispose();
});

test("every route in app/routes.ts has an access rule", () => {
  const files = flatten(routes as RouteConfigEntry[]);
  const missing = files.filter((f) => !(f in RULES));
  expect(missing, "routes without an access rule").toEqual([]);
  const stale = Object.keys(RULES).filter((f) => !files.includes(f));
  expect(stale, "rules for routes that no longer exist").toEqual([]);
});

for (const [file, rule] of Object.entries(RULES)) {
  if (rule.kind === "layout") continue;
  test(`access to ${file}`, async () => {
    for (const who of EVERYONE) {
      const context = contexts.get(who)!;
      const label = `${who} GET ${rule.path}`;
      const response = await context.get(rule.path, { maxRedirects: 0 });
      const status = response.status();
      const location = response.headers()["location"] ?? "";
      switch (rule.kind) {
        case "public":
          expect(status, label).toBe(200);
          break;
        case "signed-out-only":
          if (who === "anonymous") expect(status, label).toBe(200);
          else expect([status, location], label).toEqual([302, "/"]);
          break;
        case "post-only": {
          expect(status, label).toBe(302);
          break;
        }
        case "api":
          if (rule.allowed === "public" || (who !== "anonymous" && rule.allowed.includes(who))) expect(status, label).toBe(200);
          else expect(status, label).toBe(who === "anonymous" ? 401 : 403);
          break;
        case "page":
          if (who === "anonymous") {
            expect(status, label).toBe(302);
            expect(location, label).toMatch(/^\/sign-in\?redirectTo=/);
          } else {
            expect(status, label).toBe(rule.allowed.includes(who) ? 200 : 403);
          }
          if (rule.post) {
            const post = await context.post(rule.path, { form: rule.post.form, maxRedirects: 0 });
            const postLabel = `${who} POST ${rule.path}`;
            if (who === "anonymous") expect(post.status(), postLabel).toBe(302);
            else if (!rule.post.allowed.includes(who)) expect(post.status(), postLabel).toBe(403);
            else expect(post.status(), postLabel).toBe(400); // allowed, and the deliberately invalid form is refused
          }
          break;
      }
    }
  });
}
