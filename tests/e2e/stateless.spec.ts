import { spawn, type ChildProcess } from "node:child_process";
import { expect, test } from "@playwright/test";
import {
  ACCOUNTS,
  APP_SERVER_ENV,
  APP_URL,
  DEMO_PASSWORD,
} from "../support/e2e";

/*
 * App processes keep no state of their own: a second app server process on another port, against the
 * same database, accepts the session made by the first.
 */
const SECOND_PORT = 3102;
let second: ChildProcess;

test.beforeAll(async () => {
  second = spawn("node", ["scripts/server.mjs", "build/server/index.js"], {
    env: { ...process.env, ...APP_SERVER_ENV, PORT: String(SECOND_PORT) },
    stdio: "ignore",
  });
  await expect
    .poll(
      async () =>
        (
          await fetch(`http://127.0.0.1:${SECOND_PORT}/api/health`).catch(
            () => null,
          )
        )?.status ?? 0,
      { timeout: 30_000 },
    )
    .toBe(200);
});

test.afterAll(() => {
  second?.kill("SIGTERM");
});

test("a session made on one app process works on another", async ({
  request,
}) => {
  const signIn = await request.post("/sign-in", {
    form: {
      email: ACCOUNTS.engineer,
      password: DEMO_PASSWORD,
      redirectTo: "/",
    },
    headers: { Origin: APP_URL },
    maxRedirects: 0,
  });
  expect(signIn.status()).toBe(302);
  const cookie = signIn.headers()["set-cookie"]!.split(";")[0]!;

  const elsewhere = await fetch(`http://127.0.0.1:${SECOND_PORT}/samples`, {
    headers: { Cookie: cookie },
    redirect: "manual",
  });
  expect(elsewhere.status).toBe(200);
  expect(await elsewhere.text()).toContain("Samples");

  const anonymous = await fetch(`http://127.0.0.1:${SECOND_PORT}/samples`, {
    redirect: "manual",
  });
  expect(anonymous.status).toBe(302);
});
