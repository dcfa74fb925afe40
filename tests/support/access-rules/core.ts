import { ADMIN, ALL, type Rule } from "./types";

/** Shell, account, administration and sign-in routes. */
export const CORE_RULES: Record<string, Rule> = {
  "routes/_app/layout.tsx": { kind: "layout" },
  "routes/_auth/layout.tsx": { kind: "layout" },
  "routes/_app/index.tsx": { kind: "page", path: "/", allowed: ALL },
  // Everyone may list and revoke their own tokens; creating one needs engineer or above (api-hardening.spec.ts).
  "routes/_app/tokens/index.tsx": {
    kind: "page",
    path: "/tokens",
    allowed: ALL,
  },
  "routes/_app/account/index.tsx": {
    kind: "page",
    path: "/account",
    allowed: ALL,
  },
  "routes/_app/api-docs/index.tsx": {
    kind: "page",
    path: "/api-docs",
    allowed: ALL,
  },
  "routes/_app/admin/people/index.tsx": {
    kind: "page",
    path: "/admin/people",
    allowed: ADMIN,
    post: {
      allowed: ADMIN,
      form: { intent: "invite", email: "not-an-email", role: "viewer" },
    },
  },
  "routes/_app/admin/audit/index.tsx": {
    kind: "page",
    path: "/admin/audit",
    allowed: ADMIN,
  },
  "routes/_app/admin/mail/index.tsx": {
    kind: "page",
    path: "/admin/mail",
    allowed: ADMIN,
  },
  "routes/_auth/sign-in/index.tsx": {
    kind: "signed-out-only",
    path: "/sign-in",
  },
  "routes/_auth/forgot-password/index.tsx": {
    kind: "signed-out-only",
    path: "/forgot-password",
  },
  "routes/_auth/reset-password/$token.tsx": {
    kind: "public",
    path: "/reset-password/not-a-real-token",
  },
  "routes/_auth/invitation/$token.tsx": {
    kind: "public",
    path: "/invitation/not-a-real-token",
  },
  "routes/sign-out.ts": { kind: "post-only", path: "/sign-out" },
  // Served to loopback (every test request comes from 127.0.0.1) or an administrator's token; tests/e2e/ops.spec.ts.
  "routes/metrics.ts": { kind: "public", path: "/metrics" },
};
