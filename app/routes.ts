import { type RouteConfig, index, layout, prefix, route } from "@react-router/dev/routes";

export default [
  layout("routes/_app/layout.tsx", [
    index("routes/_app/index.tsx"),
    route("samples", "routes/_app/samples/index.tsx"),
    route("lookup", "routes/_app/lookup/index.tsx"),
    route("compare", "routes/_app/compare/index.tsx"),
    route("tokens", "routes/_app/tokens/index.tsx"),
  ]),
  ...prefix("api", [route("health", "routes/api/health.ts")]),
] satisfies RouteConfig;
