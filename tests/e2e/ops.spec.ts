import { spawn } from "node:child_process";
import { expect, test } from "@playwright/test";
import {
  SERVER_ARGS,
  startAppServer,
  waitForHealth,
} from "../support/app-server";
import { APP_PORT, APP_SERVER_ENV, APP_URL, signIn } from "../support/e2e";

/*
 * Operating the production server: security headers on every response (OWASP Secure Headers Project;
 * CSP Level 3 nonces), error pages for people, refusing a bad production configuration, a wrong database
 * password reported at start-up, one structured log line per request without secrets, and metrics.
 */

test("every response carries the security headers; pages run scripts by nonce only and cannot be framed", async ({
  page,
  request,
}) => {
  for (const path of [
    "/sign-in",
    "/api/health",
    "/api/v1/samples",
    "/no-such-page",
    "/favicon.svg",
    "/api/v1/openapi.json",
  ]) {
    const response = await request.get(path, { maxRedirects: 0 });
    const h = response.headers();
    expect(h["x-content-type-options"], path).toBe("nosniff");
    expect(h["referrer-policy"], path).toBe("same-origin");
    expect(h["content-security-policy"], path).toContain(
      "frame-ancestors 'none'",
    );
    expect(h["x-frame-options"], path).toBe("DENY");
    expect(
      h["strict-transport-security"],
      `${path} over plain http has no HSTS`,
    ).toBeUndefined();
    expect(h["x-request-id"], path).toMatch(/^[0-9a-f-]{36}$/);
  }
  // Each page gets its own nonce, and every inline script of the page carries it.
  const first = await request.get("/sign-in");
  const second = await request.get("/sign-in");
  const nonceOf = (csp: string) => /'nonce-([^']+)'/.exec(csp)?.[1];
  const nonce = nonceOf(first.headers()["content-security-policy"]!);
  expect(nonce).toBeTruthy();
  expect(nonceOf(second.headers()["content-security-policy"]!)).not.toBe(nonce);
  const html = await first.text();
  const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)([^>]*)>/g)].map(
    (m) => m[1]!,
  );
  expect(inline.length).toBeGreaterThan(0);
  for (const attrs of inline) expect(attrs).toContain(`nonce="${nonce}"`);
  expect(first.headers()["content-security-policy"]).not.toMatch(
    /script-src[^;]*'unsafe-inline'/,
  );

  // The page still hydrates and works under the policy: signing in is client-side navigation.
  const violations: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
  });
  await signIn(page, "engineer");
  await page.getByRole("link", { name: "Lookup", exact: true }).click();
  await expect(page).toHaveURL(/\/lookup/);
  expect(violations).toEqual([]);
});

test("error pages speak to people: 403 says what happened, unknown addresses and 405 get a page, not router text", async ({
  page,
}) => {
  await signIn(page, "viewer");
  const forbidden = await page.goto("/admin/people");
  expect(forbidden!.status()).toBe(403);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(
    "You are not allowed to see this",
  );
  await expect(page.getByText("Internal Server Error")).toHaveCount(0);

  const missing = await page.goto("/no/such/page");
  expect(missing!.status()).toBe(404);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(
    "Page not found",
  );
  await expect(page.getByText(/No route matches/)).toHaveCount(0);
  await expect(
    page.getByRole("link", { name: "Back to Isopleth" }),
  ).toBeVisible();

  const notAllowed = await page.request.fetch("/api/health", {
    method: "DELETE",
    headers: { Origin: APP_URL },
  });
  expect(notAllowed.status()).toBe(405);
  expect(notAllowed.headers()["content-type"]).toContain(
    "application/problem+json",
  );
  const header = await page.request.get("/api/v1/samples", {
    headers: { "X-Big": "x".repeat(20_000) },
  });
  expect(header.status()).toBe(431);
  expect(header.headers()["content-type"]).toContain(
    "application/problem+json",
  );
});

test("HSTS is sent when the request came over https through a trusted proxy", async () => {
  const port = APP_PORT + 15;
  const server = startAppServer(port, { TRUST_PROXY: "true" });
  try {
    await waitForHealth(port);
    const https = await fetch(`http://127.0.0.1:${port}/sign-in`, {
      headers: { "X-Forwarded-Proto": "https" },
    });
    expect(https.headers.get("strict-transport-security")).toMatch(
      /max-age=\d{7,}/,
    );
    const plain = await fetch(`http://127.0.0.1:${port}/sign-in`);
    expect(plain.headers.get("strict-transport-security")).toBeNull();
  } finally {
    server.kill("SIGTERM");
  }
});

function runToExit(
  env: Record<string, string | undefined>,
  port: number,
  waitMs = 20_000,
) {
  return new Promise<{ code: number | null; stdout: string; stderr: string }>(
    (resolve) => {
      const child = spawn("node", SERVER_ARGS, {
        env: {
          PATH: process.env.PATH,
          ...env,
          PORT: String(port),
        } as NodeJS.ProcessEnv,
      });
      let stdout = "";
      let stderr = "";
      child.stdout.on("data", (d) => (stdout += d));
      child.stderr.on("data", (d) => (stderr += d));
      const timer = setTimeout(() => child.kill("SIGTERM"), waitMs);
      child.on("exit", (code) => {
        clearTimeout(timer);
        resolve({ code, stdout, stderr });
      });
    },
  );
}

test("a bad production configuration stops the server before it listens, naming every bad variable", async () => {
  const { SESSION_SECRET: _s, API_TOKEN_SECRET: _a, ...rest } = APP_SERVER_ENV;
  const result = await runToExit(
    { ...rest, API_TOKEN_SECRET: "too-short", DATABASE_POOL_SIZE: "zero" },
    APP_PORT + 16,
  );
  expect(result.code).toBe(1);
  expect(result.stderr).toContain("SESSION_SECRET");
  expect(result.stderr).toContain("API_TOKEN_SECRET");
  expect(result.stderr).toContain("DATABASE_POOL_SIZE");
  expect(result.stdout).not.toContain("listening");
});

test("a wrong database password is logged at start-up; the server answers 503, and its log lines carry no secrets", async () => {
  const port = APP_PORT + 17;
  const url = new URL(APP_SERVER_ENV.DATABASE_URL!);
  url.password = "wrong-password-for-the-test";
  const server = startAppServer(
    port,
    { DATABASE_URL: url.toString(), LOG_LEVEL: "info" },
    "pipe",
  );
  let log = "";
  server.stdout!.on("data", (d) => (log += d));
  try {
    await waitForHealth(port, 503);
    const api = await fetch(`http://127.0.0.1:${port}/api/v1/samples`, {
      headers: { Authorization: "Bearer not-a-token" },
    });
    expect([401, 503]).toContain(api.status);
    expect(api.headers.get("content-type")).toContain(
      "application/problem+json",
    );
    await new Promise((r) => setTimeout(r, 300));
    expect(log).toMatch(
      /database check at start-up failed: the database refused the user or password/,
    );
    const lines = log
      .trim()
      .split("\n")
      .map((l) => JSON.parse(l) as Record<string, unknown>);
    const requests = lines.filter((l) => l.msg === "request");
    expect(requests.length).toBeGreaterThanOrEqual(2);
    for (const line of requests) {
      expect(Object.keys(line)).toEqual(
        expect.arrayContaining([
          "time",
          "level",
          "requestId",
          "method",
          "route",
          "status",
          "durationMs",
        ]),
      );
    }
    expect(log).not.toContain("wrong-password-for-the-test");
    expect(log).not.toContain("not-a-token");
    expect(log).not.toMatch(/select |insert |Failed query/i);
  } finally {
    server.kill("SIGTERM");
  }
});

test("metrics: Prometheus text to loopback, with request, pool and event-loop figures", async ({
  request,
}) => {
  await request.get("/api/health");
  const response = await request.get("/metrics");
  expect(response.status()).toBe(200);
  expect(response.headers()["content-type"]).toContain("text/plain");
  const text = await response.text();
  expect(text).toMatch(
    /^http_requests_total\{method="GET",route="\/api\/health",status="200"\} \d+/m,
  );
  expect(text).toContain("http_request_duration_seconds_bucket");
  expect(text).toContain("isopleth_db_pool_connections");
  expect(text).toContain("nodejs_eventloop_lag_seconds");
});

test("metrics are refused to anyone but loopback and administrators' tokens", async () => {
  const port = APP_PORT + 18;
  // Behind a trusted proxy the forwarded client counts: a request relayed from the world is not loopback.
  const server = startAppServer(port, { TRUST_PROXY: "true" });
  try {
    await waitForHealth(port);
    const relayed = await fetch(`http://127.0.0.1:${port}/metrics`, {
      headers: { "X-Forwarded-For": "203.0.113.9" },
    });
    expect(relayed.status).toBe(403);
    expect(relayed.headers.get("content-type")).toContain(
      "application/problem+json",
    );
    const badToken = await fetch(`http://127.0.0.1:${port}/metrics`, {
      headers: {
        "X-Forwarded-For": "203.0.113.9",
        Authorization: "Bearer junk",
      },
    });
    expect(badToken.status).toBe(403);
  } finally {
    server.kill("SIGTERM");
  }
});
