/** Access rule of one route module, for the authorization matrix (tests/e2e/access-matrix.spec.ts). */
export type DemoRoleName = "viewer" | "engineer" | "lab_lead" | "admin";
export type Rule =
  | { kind: "layout" }
  | { kind: "public"; path: string }
  | { kind: "signed-out-only"; path: string }
  | {
      kind: "page";
      path: string;
      allowed: DemoRoleName[];
      okStatus?: number;
      post?: { allowed: DemoRoleName[]; form: Record<string, string> };
    }
  | {
      kind: "api";
      path: string;
      allowed: DemoRoleName[] | "public";
      method?: "GET" | "POST";
      body?: unknown;
      okStatus?: number;
    }
  | { kind: "post-only"; path: string }
  /** A permanent redirect (308) for every caller; the target has its own rule. */
  | { kind: "redirect"; path: string; location: string };

export const ALL: DemoRoleName[] = ["viewer", "engineer", "lab_lead", "admin"];
export const ENGINEER_UP: DemoRoleName[] = ["engineer", "lab_lead", "admin"];
export const LAB_LEAD_UP: DemoRoleName[] = ["lab_lead", "admin"];
export const ADMIN: DemoRoleName[] = ["admin"];
