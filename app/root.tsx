import {
  isRouteErrorResponse,
  Links,
  Meta,
  Outlet,
  Scripts,
  ScrollRestoration,
} from "react-router";
import type { Route } from "./+types/root";
import { originGuard, sessionMiddleware } from "~/.server/auth/middleware";
import { edgeMiddleware } from "~/.server/ops/edge";
import { useNonce } from "~/components/nonce";
import "./app.css";

export const middleware: Route.MiddlewareFunction[] = [
  edgeMiddleware,
  originGuard,
  sessionMiddleware,
];

export const meta: Route.MetaFunction = () => [
  { title: "Isopleth — reservoir fluid-property tables" },
  {
    name: "description",
    content:
      "Measured PVT grids, interpolation at reservoir conditions and tables for simulators.",
  },
];

export function Layout({ children }: { children: React.ReactNode }) {
  const nonce = useNonce();
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <link rel="icon" href="/favicon.svg" type="image/svg+xml" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen font-sans">
        {children}
        <ScrollRestoration nonce={nonce} />
        <Scripts nonce={nonce} />
      </body>
    </html>
  );
}

export default function App() {
  return <Outlet />;
}

const ERROR_TITLES: Record<number, string> = {
  400: "This request could not be understood",
  401: "Please sign in",
  403: "You are not allowed to see this",
  404: "Page not found",
  405: "This page does not take that request",
  413: "That was too large",
  429: "Too many requests",
  503: "Isopleth is unavailable for a moment",
};

const ERROR_DETAILS: Record<number, string> = {
  400: "The address or the form sent was not valid.",
  403: "Your role does not include this page. Ask an administrator if you need it.",
  404: "There is no page at this address. It may have moved, or the link may be mistyped.",
  405: "This address cannot be used that way; go back and use the page's own buttons and links.",
  503: "The database is not answering at the moment. Nothing you sent was stored; try again in a few seconds.",
};

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  let title = "Something went wrong";
  let detail = "An unexpected error occurred. The error has been logged.";
  if (isRouteErrorResponse(error)) {
    title =
      ERROR_TITLES[error.status] ??
      (error.status >= 500 ? title : "This request could not be answered");
    detail = ERROR_DETAILS[error.status] ?? detail;
    // A message written for people by our own guards and loaders; never the router's own text.
    if (
      typeof error.data === "string" &&
      error.data &&
      !/^Error: |No route matches/.test(error.data) &&
      error.data.length < 400
    ) {
      detail = error.data;
    }
  } else if (import.meta.env.DEV && error instanceof Error) {
    detail = error.message;
  }
  return (
    <main className="mx-auto max-w-2xl p-8">
      <h1 className="text-2xl font-semibold">{title}</h1>
      <p className="mt-2 text-ink-muted">{detail}</p>
      <a className="mt-4 inline-block text-accent underline" href="/">
        Back to Isopleth
      </a>
    </main>
  );
}
