import type { RouteConfigEntry } from "@react-router/dev/routes";
import { expect, test, type APIRequestContext } from "@playwright/test";
import routes from "../../app/routes";
import { CORE_RULES } from "../support/access-rules/core";
import { API_RULES } from "../support/access-rules/api";
import { LOOKUP_RULES } from "../support/access-rules/lookup";
import { SAMPLE_RULES } from "../support/access-rules/samples";
import type { Rule } from "../support/access-rules/types";
import { apiContextFor, type DemoRole } from "../support/e2e";

/*
 * Walks EVERY route of app/routes.ts for an anonymous caller and each role. A route without a rule here fails
 * the test, so a new page or API route cannot ship without a decision about who may use it.
 * Expectations follow the capability table of the access issue (viewer < engineer < lab lead < admin).
 */
type Who = "anonymous" | DemoRole;
const ROLES: DemoRole[] = ["viewer", "engineer", "lab_lead", "admin"];
const EVERYONE: Who[] = ["anonymous", ...ROLES];

const RULES: Record<string, Rule> = {
  ...CORE_RULES,
  ...SAMPLE_RULES,
  ...LOOKUP_RULES,
  ...API_RULES,
};

function flatten(entries: RouteConfigEntry[]): string[] {
  return entries.flatMap((e) => [e.file, ...flatten(e.children ?? [])]);
}

const contexts = new Map<Who, APIRequestContext>();
test.beforeAll(async () => {
  for (const who of EVERYONE)
    contexts.set(who, await apiContextFor(who === "anonymous" ? null : who));
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
        case "redirect":
          expect([status, location], label).toEqual([308, rule.location]);
          break;
        case "api": {
          const r =
            rule.method === "POST"
              ? await context.post(rule.path, {
                  data: rule.body,
                  maxRedirects: 0,
                })
              : response;
          const apiStatus = r.status();
          const apiLabel = `${who} ${rule.method ?? "GET"} ${rule.path}`;
          if (
            rule.allowed === "public" ||
            (who !== "anonymous" && rule.allowed.includes(who))
          )
            expect(apiStatus, apiLabel).toBe(rule.okStatus ?? 200);
          else
            expect(apiStatus, apiLabel).toBe(who === "anonymous" ? 401 : 403);
          break;
        }
        case "page":
          if (who === "anonymous") {
            expect(status, label).toBe(302);
            expect(location, label).toMatch(/^\/sign-in\?redirectTo=/);
          } else {
            expect(status, label).toBe(
              rule.allowed.includes(who) ? (rule.okStatus ?? 200) : 403,
            );
          }
          if (rule.post) {
            const post = await context.post(rule.path, {
              form: rule.post.form,
              maxRedirects: 0,
            });
            const postLabel = `${who} POST ${rule.path}`;
            if (who === "anonymous") expect(post.status(), postLabel).toBe(302);
            else if (!rule.post.allowed.includes(who))
              expect(post.status(), postLabel).toBe(403);
            else expect(post.status(), postLabel).toBe(400); // allowed, and the deliberately invalid form is refused
          }
          break;
      }
    }
  });
}
