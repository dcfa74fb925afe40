import {
  type RouteConfig,
  index,
  layout,
  prefix,
  route,
} from "@react-router/dev/routes";

export default [
  layout("routes/_app/layout.tsx", [
    index("routes/_app/index.tsx"),
    ...prefix("samples", [
      index("routes/_app/samples/index.tsx"),
      route("new", "routes/_app/samples/new.tsx"),
      route(":sampleId", "routes/_app/samples/$sampleId/index.tsx"),
      route(":sampleId/edit", "routes/_app/samples/$sampleId/edit.tsx"),
      route(":sampleId/upload", "routes/_app/samples/$sampleId/upload.tsx"),
      route(
        ":sampleId/revisions/:number",
        "routes/_app/samples/$sampleId/revisions/$number.tsx",
      ),
      route(":sampleId/diff", "routes/_app/samples/$sampleId/diff.tsx"),
    ]),
    route("lookup", "routes/_app/lookup/index.tsx"),
    route("lookup/sets/:setId", "routes/_app/lookup/sets/$setId.tsx"),
    route("compare", "routes/_app/compare/index.tsx"),
    route("tokens", "routes/_app/tokens/index.tsx"),
    route("account", "routes/_app/account/index.tsx"),
    route("api-docs", "routes/_app/api-docs/index.tsx"),
    ...prefix("admin", [
      route("people", "routes/_app/admin/people/index.tsx"),
      route("audit", "routes/_app/admin/audit/index.tsx"),
      route("mail", "routes/_app/admin/mail/index.tsx"),
      route("settings", "routes/_app/admin/settings/index.tsx"),
    ]),
  ]),
  layout("routes/_auth/layout.tsx", [
    route("sign-in", "routes/_auth/sign-in/index.tsx"),
    route("forgot-password", "routes/_auth/forgot-password/index.tsx"),
    route("reset-password/:token", "routes/_auth/reset-password/$token.tsx"),
    route("invitation/:token", "routes/_auth/invitation/$token.tsx"),
  ]),
  route("sign-out", "routes/sign-out.ts"),
  route("metrics", "routes/metrics.ts"),
  route("upload-templates/:file", "routes/upload-templates/$file.ts"),
  // downloads of lookups and of saved sets' runs (CSV, XLSX): resource routes
  route("lookup/export", "routes/lookup/export.ts"),
  route("lookup/sets/:setId/export", "routes/lookup/sets/$setId/export.ts"),
  // the first address of the upload templates, a permanent redirect to the one above
  route("templates/:file", "routes/templates/$file.ts"),
  ...prefix("api", [
    route("health", "routes/api/health.ts"),
    route("ready", "routes/api/ready.ts"),
    ...prefix("v1", [
      route("openapi.json", "routes/api/v1/openapi.ts"),
      route("samples", "routes/api/v1/samples/index.ts"),
      route("samples/:sampleId", "routes/api/v1/samples/$sampleId/index.ts"),
      route(
        "samples/:sampleId/lookup",
        "routes/api/v1/samples/$sampleId/lookup.ts",
      ),
      route(
        "samples/:sampleId/table",
        "routes/api/v1/samples/$sampleId/table.ts",
      ),
    ]),
    route("*", "routes/api/not-found.ts"),
  ]),
] satisfies RouteConfig;
