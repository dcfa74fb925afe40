import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import net from "node:net";
import { fileURLToPath } from "node:url";
import { expect, test } from "@playwright/test";
import mysql from "mysql2/promise";
import {
  createSeededDatabase,
  startAppServer,
  waitForHealth,
} from "../support/app-server";
import { ACCOUNTS, APP_PORT, DEMO_PASSWORD } from "../support/e2e";
import { rawRequest } from "../support/raw-http";

/*
 * Graceful shutdown: SIGTERM stops the server accepting connections, lets the requests in flight finish, then
 * closes the database pool and exits 0. The request in flight here is an upload confirm whose body is still
 * arriving when the signal comes; it must be stored whole and answered with its redirect.
 * (Practice of common servers: stop accepting, drain, close — e.g. Kubernetes' termination grace period.)
 */
const PORT = APP_PORT + 14;
const FILE = fileURLToPath(
  new URL(
    "../../reference-data/examples/lab-results-long.csv",
    import.meta.url,
  ),
);

let database: Awaited<ReturnType<typeof createSeededDatabase>>;
test.beforeAll(async () => {
  database = await createSeededDatabase();
});
test.afterAll(async () => {
  await database?.drop();
});

test("an upload confirm in flight at SIGTERM completes and is stored; the server then exits 0 and accepts nothing new", async () => {
  test.setTimeout(90_000);
  const server = startAppServer(PORT, { DATABASE_URL: database.url });
  const exited = new Promise<number | null>((resolve) =>
    server.on("exit", (code) => resolve(code)),
  );
  await waitForHealth(PORT);

  const signIn = await fetch(`http://127.0.0.1:${PORT}/sign-in`, {
    method: "POST",
    headers: {
      Origin: `http://127.0.0.1:${PORT}`,
      "Content-Type": "application/x-www-form-urlencoded",
    },
    body: new URLSearchParams({
      email: ACCOUNTS.lab_lead,
      password: DEMO_PASSWORD,
      redirectTo: "/",
    }),
    redirect: "manual",
  });
  expect(signIn.status).toBe(302);
  const cookie = signIn.headers.get("set-cookie")!.split(";")[0]!;

  const pool = mysql.createPool({ uri: database.url, connectionLimit: 1 });
  const [[before]] = (await pool.query(
    "SELECT COUNT(*) AS n FROM sample_revisions WHERE sample_id = 1",
  )) as unknown as [[{ n: number }]];

  const bytes = readFileSync(FILE);
  const sha = createHash("sha256").update(bytes).digest("hex");
  const boundary = "----isopleth-shutdown-test";
  const part = (name: string, value: string) =>
    `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
  const body = Buffer.concat([
    Buffer.from(
      part("intent", "confirm") +
        part("comment", "Stored across a SIGTERM (test)") +
        part("previewSha256", sha),
    ),
    Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="lab-results-long.csv"\r\nContent-Type: text/csv\r\n\r\n`,
    ),
    bytes,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  const head =
    `POST /samples/1/upload HTTP/1.1\r\nHost: 127.0.0.1:${PORT}\r\nOrigin: http://127.0.0.1:${PORT}\r\nCookie: ${cookie}\r\n` +
    `Content-Type: multipart/form-data; boundary=${boundary}\r\nContent-Length: ${body.length}\r\nConnection: close\r\n\r\n`;

  // Send the head and half the body, signal, then the rest: the request is in flight when SIGTERM arrives.
  const socket = net.connect(PORT, "127.0.0.1");
  await new Promise<void>((resolve) => socket.on("connect", () => resolve()));
  const answer = new Promise<string>((resolve) => {
    let text = "";
    socket.on("data", (d) => (text += d.toString("latin1")));
    socket.on("close", () => resolve(text));
  });
  socket.write(head);
  socket.write(body.subarray(0, body.length >> 1));
  await new Promise((r) => setTimeout(r, 300));
  server.kill("SIGTERM");
  await new Promise((r) => setTimeout(r, 500));

  // No new connection is accepted while the server drains.
  const late = await rawRequest(
    PORT,
    Buffer.from(
      `GET /api/health HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\n\r\n`,
    ),
    3_000,
  );
  expect("error" in late ? late.error : `answered ${late.status}`).toMatch(
    /ECONNREFUSED|closed|ECONNRESET/,
  );

  socket.write(body.subarray(body.length >> 1));
  const response = await answer;
  expect(response.split("\r\n")[0]).toBe("HTTP/1.1 302 Found");
  expect(response).toMatch(/Location: \/samples\/1\/revisions\/\d+\?stored=1/i);

  expect(await exited, "exit code after a graceful shutdown").toBe(0);
  const [[after]] = (await pool.query(
    "SELECT COUNT(*) AS n FROM sample_revisions WHERE sample_id = 1",
  )) as unknown as [[{ n: number }]];
  expect(Number(after.n)).toBe(Number(before.n) + 1);
  await pool.end();
});
