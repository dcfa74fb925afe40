import type { ChildProcess } from "node:child_process";
import net from "node:net";
import type { RouteConfigEntry } from "@react-router/dev/routes";
import { expect, test } from "@playwright/test";
import routes from "../../app/routes";
import { API_RULES } from "../support/access-rules/api";
import { CORE_RULES } from "../support/access-rules/core";
import { LOOKUP_RULES } from "../support/access-rules/lookup";
import { SAMPLE_RULES } from "../support/access-rules/samples";
import {
  createSeededDatabase,
  startAppServer,
  waitForHealth,
} from "../support/app-server";
import { createCookie } from "react-router";
import {
  ACCOUNTS,
  APP_PORT,
  APP_SERVER_ENV,
  DEMO_PASSWORD,
} from "../support/e2e";
import { rawRequest, seededRandom, type RawAnswer } from "../support/raw-http";

/*
 * Bounded fuzzing of the production server (scripts/server.mjs on the production build), in three phases:
 *   A. database up: 10,000+ generated requests over every route of app/routes.ts — malformed percent-escapes,
 *      dot segments, odd bytes, every method, odd and oversized headers, random and hostile bodies (nesting
 *      10,000 deep, binary, broken multipart), anonymous and signed in as each role;
 *   B. database stopped (nothing listens on its port) and C. database frozen (it accepts connections and never
 *      answers): the same kind of traffic.
 * Asserted: the process lives; no 5xx at all in A and none but 503 in B and C; every API answer of 400 or more
 * is application/problem+json; no answer takes longer than the configured bounds allow. Counts are printed.
 * The servers run on a database of their own, created and seeded here and dropped afterwards, so the random
 * writes of the signed-in fuzzing cannot disturb other specs. Seeds are fixed, so a failure can be replayed.
 */
const PORT_A = APP_PORT + 11;
const PORT_B = APP_PORT + 12;
const PORT_C = APP_PORT + 13;
const RULES = { ...CORE_RULES, ...SAMPLE_RULES, ...LOOKUP_RULES, ...API_RULES };
const METHODS = [
  "GET",
  "GET",
  "GET",
  "HEAD",
  "POST",
  "POST",
  "PUT",
  "PATCH",
  "DELETE",
  "OPTIONS",
  "TRACE",
  "PROPFIND",
  "M-SEARCH",
];

function routePatterns(entries: RouteConfigEntry[], prefix = ""): string[] {
  return entries.flatMap((e) => {
    const here = e.path === undefined ? prefix : `${prefix}/${e.path}`;
    return [
      ...(e.path !== undefined || e.index ? [here || "/"] : []),
      ...routePatterns(e.children ?? [], here),
    ];
  });
}

/** One concrete path per route (from its access rule), plus every pattern with its parameters filled randomly. */
function basePaths(): string[] {
  const fromRules = Object.values(RULES).flatMap((r) =>
    "path" in r ? [r.path] : [],
  );
  return [
    ...new Set([...fromRules, ...routePatterns(routes as RouteConfigEntry[])]),
  ];
}

const PARAM_VALUES = [
  "1",
  "2",
  "0",
  "-1",
  "99999999999999999999",
  "1e0",
  "0x1",
  "abc",
  "%00",
  "..",
  "%2e%2e",
  "%E0%A4%A",
  "1%20OR%201=1",
  "%F0%9F%A7%AA",
  "'",
  "%0d%0aSet-Cookie:x=1",
];
const SEGMENT_NOISE = [
  "%E0%A4%A",
  "%",
  "%zz",
  "..",
  ".",
  "%2e%2e",
  "%2f",
  "%5c",
  "\\",
  "//",
  ";x",
  "%00",
  "\x80\xff",
  "\x7f",
  "~",
  "%C0%AE",
];
const QUERY_NOISE = [
  "revision=0x1",
  "revision=1e0",
  "revision=-1",
  "revision=2&revision=3",
  "unit=metric",
  "units=bogus",
  "temperature=-500",
  "temperature=1e308",
  "pressures=0:1e9:1",
  "pressures=5000:500:250",
  "pressures=1:2:0",
  "format=xml",
  "format=csv",
  "format=text",
  "redirectTo=/%09/evil.example",
  "redirectTo=%0a",
  "redirectTo=//evil.example",
  "redirectTo=https://evil.example",
  "q=%E0%A4%A",
  "page=-1",
  "page=1e9",
  "sort=%27",
  "samples=1,2,3,4,5,6,7,8,9,10",
  "property=__proto__",
  "x=" + "A".repeat(3000),
  "%zz=1",
  "=",
  "&&&",
];

function pick<T>(random: () => number, list: readonly T[]): T {
  return list[Math.floor(random() * list.length)]!;
}

function randomBytes(random: () => number, n: number): Buffer {
  const b = Buffer.alloc(n);
  for (let i = 0; i < n; i++) b[i] = Math.floor(random() * 256);
  return b;
}

function mutatePath(random: () => number, base: string): string {
  let p = base
    .replace(/:[a-zA-Z]+\??/g, () => pick(random, PARAM_VALUES))
    .replace(/\*$/, pick(random, ["x", "%E0%A4%A", "../.."]));
  const roll = random();
  if (roll < 0.15) p += `/${pick(random, SEGMENT_NOISE)}`;
  else if (roll < 0.25)
    p = p.replace(/\/[^/]*$/, `/${pick(random, SEGMENT_NOISE)}$&`);
  else if (roll < 0.3)
    p = `/assets/${pick(random, ["%E0%A4%A", "..%2f..%2fpackage.json", "entry.client.js", "x.js%00.map", "%2e%2e"])}`;
  else if (roll < 0.35) p = `/${pick(random, ["..", "%2e%2e", "./.."])}${p}`;
  else if (roll < 0.4) p = p.replace(/\//g, "//");
  if (random() < 0.35)
    p += `${p.includes("?") ? "&" : "?"}${pick(random, QUERY_NOISE)}`;
  if (random() < 0.1)
    p += `${p.includes("?") ? "&" : "?"}${pick(random, QUERY_NOISE)}`;
  return p;
}

function nested(depth: number): string {
  return `{"property":"oil_fvf","points":[{"pressure":${"[".repeat(depth)}1${"]".repeat(depth)},"temperature":212}]}`;
}

const JSON_BODIES = [
  () => nested(10_000),
  () => `{"a":${'{"a":'.repeat(5_000)}1${"}".repeat(5_001)}`,
  () =>
    '{"property":"oil_fvf","points":[{"pressure":1e999,"temperature":-1e999}]}',
  () =>
    '{"property":"oil_fvf","points":[{"pressure":NaN,"temperature":Infinity}]}',
  () =>
    '{"property":"oil_fvf","points":[{"pressure":100000,"temperature":2000}],"extrapolate":true}',
  () =>
    '{"property":"oil_fvf","points":[{"pressure":3000,"temperature":-600}]}',
  () => '{"property":"__proto__","points":[]}',
  () => '{"__proto__":{"admin":true},"constructor":{"prototype":{"x":1}}}',
  () =>
    `{"property":"oil_fvf","points":[${Array.from({ length: 200 }, (_, i) => `{"pressure":${i * 50},"temperature":212}`).join(",")}]}`,
  () => '{"property":"oil_fvf","points":"' + "x".repeat(5000) + '"}',
  () => "[]",
  () => "null",
  () => '"\\ud800"',
  () => "{",
];
const FORM_FIELDS = [
  "intent",
  "email",
  "password",
  "redirectTo",
  "name",
  "role",
  "scopes",
  "label",
  "comment",
  "token",
  "sampleId",
  "revision",
  "confirm",
  "_action",
  "pressure",
  "temperature",
  "file",
];
const FORM_VALUES = [
  "",
  "create",
  "revoke",
  "approve",
  "reject",
  "delete",
  "admin",
  '=HYPERLINK("x")',
  "\u0000",
  "%0d%0a",
  "x".repeat(2000),
  "1e999",
  "-1",
  "//evil.example",
  "\t/evil",
  ACCOUNTS.admin,
  "\u202e",
];

type Generated = { label: string; bytes: Buffer; api: boolean };

const API_PATHS = (paths: string[]) =>
  paths.filter((p) => p.startsWith("/api/"));
const EDGE_BREAKERS = [
  "%E0%A4%A",
  "%",
  "%zz",
  "%00",
  "%0d%0a",
  "%C0",
  "%ff%fe",
];
const BAD_METHODS = [
  "TRACE",
  "PROPFIND",
  "M-SEARCH",
  "CONNECT",
  "LINK",
  "BREW",
];

/**
 * Most requests (~88 %) go where faults of parsing and validation live and are cheap to answer — malformed
 * paths, odd methods, API routes with hostile queries and bodies; the rest are full requests to any route of
 * the app (pages rendered, forms posted), which cost a page render each. Every route gets both kinds.
 */
function generate(
  random: () => number,
  port: number,
  paths: string[],
  cookies: string[],
): Generated {
  const roll = random();
  let method = pick(random, METHODS);
  let path = mutatePath(random, pick(random, paths));
  if (roll < 0.3) {
    const base = mutatePath(random, pick(random, paths)).split("?")[0]!;
    const segments = base.split("/");
    segments.splice(
      1 + Math.floor(random() * Math.max(1, segments.length - 1)),
      0,
      pick(random, EDGE_BREAKERS),
    );
    path = segments.join("/");
  } else if (roll < 0.4) {
    method = pick(random, BAD_METHODS);
  } else if (roll < 0.88) {
    path = mutatePath(random, pick(random, API_PATHS(paths)));
  }
  const headers: string[] = [];
  const host =
    random() < 0.95
      ? `127.0.0.1:${port}`
      : pick(random, ["evil.example", "", "127.0.0.1:99999", "[::1", "a@b"]);
  if (random() < 0.98) headers.push(`Host: ${host}`);
  headers.push(
    `Accept: ${pick(random, ["text/html", "application/json", "*/*", "text/csv", "application/problem+json", ""])}`,
  );
  if (random() < 0.6)
    headers.push(
      `Origin: ${random() < 0.85 ? `http://127.0.0.1:${port}` : pick(random, ["http://evil.example", "null", "%"])}`,
    );
  const cookie =
    random() < 0.55
      ? pick(random, cookies)
      : random() < 0.2
        ? `__session=${randomBytes(random, 20).toString("base64")}`
        : "";
  if (cookie) headers.push(`Cookie: ${cookie}`);
  if (random() < 0.15)
    headers.push(
      `Authorization: ${pick(random, ["Bearer junk", "Bearer ", "Basic YTpi", "Bearer eyJhbGciOiJub25lIn0.e30.", "Bearer " + "a".repeat(5000)])}`,
    );
  if (random() < 0.05)
    headers.push(
      `X-Forwarded-For: ${pick(random, ["1.2.3.4", "junk", "::1, 127.0.0.1", "\u00ff"])}`,
    );
  if (random() < 0.03) headers.push(`X-Big: ${"b".repeat(20_000)}`);
  if (random() < 0.03)
    headers.push(
      `X-Odd: ${randomBytes(random, 12)
        .toString("latin1")
        .replace(/[\r\n]/g, "")}`,
    );
  if (random() < 0.02) headers.push("If-None-Match: *");
  if (random() < 0.02) headers.push("Range: bytes=999999-");
  let body: Buffer = Buffer.alloc(0);
  if (method !== "GET" && method !== "HEAD" && random() < 0.9) {
    const kind = random();
    if (kind < 0.35) {
      headers.push(
        `Content-Type: ${pick(random, ["application/json", "application/json; charset=utf-8", "text/plain"])}`,
      );
      body = Buffer.from(pick(random, JSON_BODIES)());
    } else if (kind < 0.7) {
      headers.push("Content-Type: application/x-www-form-urlencoded");
      const n = 1 + Math.floor(random() * 5);
      body = Buffer.from(
        Array.from(
          { length: n },
          () =>
            `${encodeURIComponent(pick(random, FORM_FIELDS))}=${random() < 0.1 ? "%E0%A4%A" : encodeURIComponent(pick(random, FORM_VALUES))}`,
        ).join("&"),
      );
    } else if (kind < 0.85) {
      headers.push(
        `Content-Type: multipart/form-data; boundary=${pick(random, ["x", "", "----b"])}`,
      );
      body = Buffer.concat([
        Buffer.from(
          '--x\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\n',
        ),
        randomBytes(random, 200),
      ]);
    } else {
      body = randomBytes(random, Math.floor(random() * 2048));
      if (random() < 0.5)
        headers.push(
          `Content-Type: ${pick(random, ["application/octet-stream", "application/json", "??"])}`,
        );
    }
  }
  if (random() < 0.03 && body.length > 0) {
    headers.push("Transfer-Encoding: chunked");
    body = Buffer.concat([
      Buffer.from("zz\r\n"),
      body,
      Buffer.from("\r\n0\r\n\r\n"),
    ]);
  } else if (body.length > 0 || method === "POST") {
    headers.push(`Content-Length: ${body.length}`);
  }
  headers.push("Connection: close");
  const head = `${method} ${path} HTTP/1.1\r\n${headers.join("\r\n")}\r\n\r\n`;
  return {
    label: `${method} ${path.slice(0, 160)}${cookie ? " (signed in)" : ""} [${body.length} B]`,
    bytes: Buffer.concat([Buffer.from(head, "latin1"), body]),
    api: isApiPath(path),
  };
}

/** Whether the server will see an API path, as the Fetch API normalises it (dot segments resolved). */
function isApiPath(path: string): boolean {
  try {
    return new URL(path, "http://127.0.0.1").pathname.startsWith("/api/");
  } catch {
    return false;
  }
}

type Tally = {
  sent: number;
  byClass: Record<string, number>;
  failures: string[];
  slowest: number;
};

async function fuzz(opts: {
  port: number;
  count: number;
  seed: number;
  cookies: string[];
  allowed5xx: number[];
  maxMs: number;
}): Promise<Tally> {
  const random = seededRandom(opts.seed);
  const paths = basePaths();
  const tally: Tally = { sent: 0, byClass: {}, failures: [], slowest: 0 };
  const queue = Array.from({ length: opts.count }, () =>
    generate(random, opts.port, paths, opts.cookies),
  );
  const check = (g: Generated, answer: RawAnswer, ms: number) => {
    tally.sent++;
    tally.slowest = Math.max(tally.slowest, ms);
    if ("error" in answer) {
      tally.byClass.error = (tally.byClass.error ?? 0) + 1;
      tally.failures.push(`${g.label}: no answer (${answer.error})`);
      return;
    }
    const cls = `${Math.floor(answer.status / 100)}xx`;
    tally.byClass[cls] = (tally.byClass[cls] ?? 0) + 1;
    if (answer.status >= 500 && !opts.allowed5xx.includes(answer.status)) {
      tally.failures.push(
        `${g.label}: ${answer.status} ${answer.bodyStart.slice(0, 200)}`,
      );
    }
    const type = answer.headers["content-type"] ?? "";
    if (
      g.api &&
      answer.status >= 400 &&
      !type.startsWith("application/problem+json")
    ) {
      tally.failures.push(
        `${g.label}: API error ${answer.status} as "${type}"`,
      );
    }
    if (ms > opts.maxMs)
      tally.failures.push(`${g.label}: answered after ${Math.round(ms)} ms`);
  };
  const workers = Array.from({ length: 12 }, async () => {
    for (let g = queue.shift(); g; g = queue.shift()) {
      const started = performance.now();
      const answer = await rawRequest(opts.port, g.bytes, opts.maxMs + 5_000);
      check(g, answer, performance.now() - started);
    }
  });
  await Promise.all(workers);
  return tally;
}

function report(name: string, tally: Tally) {
  const classes = Object.entries(tally.byClass)
    .sort()
    .map(([k, v]) => `${k} ${v}`)
    .join(", ");
  console.log(
    `fuzz ${name}: ${tally.sent} requests — ${classes}; slowest ${Math.round(tally.slowest)} ms; ${tally.failures.length} failures`,
  );
}

function startServer(
  port: number,
  extraEnv: Record<string, string>,
): ChildProcess {
  return startAppServer(
    port,
    { LOG_LEVEL: process.env.SERVER_LOG_DIR ? "info" : "fatal", ...extraEnv },
    "pipe",
  );
}

const waitForStatus = waitForHealth;

async function signInCookie(port: number, email: string): Promise<string> {
  const response = await fetch(`http://127.0.0.1:${port}/sign-in`, {
    method: "POST",
    headers: {
      Origin: `http://127.0.0.1:${port}`,
      "Content-Type": "application/x-www-form-urlencoded",
    },
    body: new URLSearchParams({
      email,
      password: DEMO_PASSWORD,
      redirectTo: "/",
    }),
    redirect: "manual",
  });
  expect(response.status, `sign-in of ${email} on the fuzz server`).toBe(302);
  return response.headers.get("set-cookie")!.split(";")[0]!;
}

let database: Awaited<ReturnType<typeof createSeededDatabase>>;
const servers: ChildProcess[] = [];
let frozen: net.Server | undefined;

test.beforeAll(async () => {
  database = await createSeededDatabase();
});

test.afterAll(async () => {
  for (const s of servers) s.kill("SIGKILL");
  frozen?.close();
  await database?.drop();
});

test("fuzz A: 10,000 generated requests with the database up — the process lives, no 5xx, API errors are problem details", async () => {
  test.setTimeout(300_000);
  const server = startServer(PORT_A, { DATABASE_URL: database.url });
  servers.push(server);
  await waitForStatus(PORT_A, 200);
  const cookies = await Promise.all(
    Object.values(ACCOUNTS).map((email) => signInCookie(PORT_A, email)),
  );
  const tally = await fuzz({
    port: PORT_A,
    count: 10_000,
    seed: 20261203,
    cookies,
    allowed5xx: [],
    maxMs: 20_000,
  });
  report("A (database up)", tally);
  expect(server.exitCode, "the server process is still running").toBeNull();
  expect(tally.failures.slice(0, 25)).toEqual([]);
  expect(tally.sent).toBeGreaterThanOrEqual(10_000);
  const health = await fetch(`http://127.0.0.1:${PORT_A}/api/health`);
  expect(health.status).toBe(200);
});

test("fuzz B and C: the database stopped, then frozen — only 503 among 5xx, answered within the bounds, the process lives", async () => {
  test.setTimeout(240_000);
  // B: nothing listens on the database port.
  const closedPort = await new Promise<number>((resolve) => {
    const probe = net.createServer().listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
  const bounds = {
    DATABASE_ACQUIRE_TIMEOUT_MS: "800",
    DATABASE_QUERY_TIMEOUT_MS: "1000",
  };
  const stopped = startServer(PORT_B, {
    ...bounds,
    DATABASE_URL: `mysql://isopleth:x@127.0.0.1:${closedPort}/isopleth_gone`,
  });
  servers.push(stopped);
  await waitForStatus(PORT_B, 503);
  // A session cookie signed as the app signs them (its token is unknown, but checking it needs the database).
  const signed = await createCookie("isopleth_session", {
    secrets: [APP_SERVER_ENV.SESSION_SECRET!],
  }).serialize("abcdefghijklmnopqrstuvwxyz234567");
  const fakeCookie = signed.split(";")[0]!;
  const b = await fuzz({
    port: PORT_B,
    count: 1_500,
    seed: 7,
    cookies: [fakeCookie],
    allowed5xx: [503],
    maxMs: 5_000,
  });
  report("B (database stopped)", b);
  expect(stopped.exitCode).toBeNull();
  expect(b.failures.slice(0, 25)).toEqual([]);
  const healthWithCookie = await fetch(
    `http://127.0.0.1:${PORT_B}/api/health`,
    { headers: { Cookie: fakeCookie } },
  );
  expect(
    healthWithCookie.status,
    "health with a session cookie while the database is down",
  ).toBe(503);

  // C: the database accepts connections and never answers (a frozen server).
  const sockets = new Set<net.Socket>();
  frozen = net.createServer((s) => {
    sockets.add(s);
    s.on("error", () => {});
  });
  await new Promise<void>((resolve) => frozen!.listen(0, "127.0.0.1", resolve));
  const frozenPort = (frozen.address() as net.AddressInfo).port;
  const hung = startServer(PORT_C, {
    ...bounds,
    DATABASE_URL: `mysql://isopleth:x@127.0.0.1:${frozenPort}/isopleth_frozen`,
  });
  servers.push(hung);
  await waitForStatus(PORT_C, 503);
  const c = await fuzz({
    port: PORT_C,
    count: 600,
    seed: 11,
    cookies: [fakeCookie],
    allowed5xx: [503],
    maxMs: 6_000,
  });
  report("C (database frozen)", c);
  for (const s of sockets) s.destroy();
  expect(hung.exitCode).toBeNull();
  expect(c.failures.slice(0, 25)).toEqual([]);
  const page = await fetch(`http://127.0.0.1:${PORT_C}/samples`, {
    headers: { Cookie: fakeCookie, Accept: "text/html" },
  });
  expect(page.status).toBe(503);
  expect(page.headers.get("retry-after")).toBeTruthy();
  expect(await page.text()).toContain("Database unavailable");
});
