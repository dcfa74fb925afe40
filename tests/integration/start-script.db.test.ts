import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import {
  appendFileSync,
  existsSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
} from "node:fs";
import net from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, expect, test } from "vitest";

/*
 * `npm start` (scripts/start.sh) run for real in a data folder and on ports of its own: one start per data
 * folder, taken ports reported before anything starts, "ready" only once the app answers, SIGTERM to npm stops
 * every process it started, and MariaDB's own output of a failed start is shown (not stale log lines).
 */
const dataDir = mkdtempSync(path.join(tmpdir(), "isopleth-start-"));
const servers: net.Server[] = [];
const started: ChildProcess[] = [];

async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

async function occupy(port: number): Promise<void> {
  const server = net.createServer();
  await new Promise<void>((resolve) =>
    server.listen(port, "127.0.0.1", resolve),
  );
  servers.push(server);
}

async function portsEnv() {
  const env: NodeJS.ProcessEnv = { ...process.env, ISOPLETH_DATA_DIR: dataDir };
  for (const name of [
    "DATABASE_URL",
    "NODE_ENV",
    "VITEST",
    "TEST_DATABASE_URL",
  ])
    delete env[name];
  const ports = {
    PORT: await freePort(),
    DB_PORT: await freePort(),
    SMTP_PORT: await freePort(),
    SMTP_HTTP_PORT: await freePort(),
  };
  return {
    ports,
    env: {
      ...env,
      ...Object.fromEntries(
        Object.entries(ports).map(([k, v]) => [k, String(v)]),
      ),
    },
  };
}

/** Every process below `root` (by parent pid, from /proc). */
function descendants(root: number): { pid: number; comm: string }[] {
  const children = new Map<number, { pid: number; comm: string }[]>();
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      const comm = stat.slice(stat.indexOf("(") + 1, stat.lastIndexOf(")"));
      const ppid = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]);
      children.set(ppid, [
        ...(children.get(ppid) ?? []),
        { pid: Number(entry), comm },
      ]);
    } catch {
      // gone meanwhile
    }
  }
  const found: { pid: number; comm: string }[] = [];
  const queue = [root];
  while (queue.length > 0) {
    for (const child of children.get(queue.shift()!) ?? []) {
      found.push(child);
      queue.push(child.pid);
    }
  }
  return found;
}

/** Processes whose command line names our private data folder (mariadbd runs in a session of its own). */
function usingDataDir(): number[] {
  return readdirSync("/proc").flatMap((entry) => {
    if (!/^\d+$/.test(entry)) return [];
    try {
      return readFileSync(`/proc/${entry}/cmdline`, "utf8").includes(dataDir)
        ? [Number(entry)]
        : [];
    } catch {
      return [];
    }
  });
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

async function until(
  check: () => boolean,
  timeoutMs: number,
): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (check()) return true;
    await new Promise((r) => setTimeout(r, 200));
  }
  return check();
}

afterAll(async () => {
  for (const server of servers) server.close();
  for (const child of started)
    if (child.exitCode === null) child.kill("SIGTERM");
  await until(() => usingDataDir().length === 0, 15_000);
  spawnSync("find", [
    dataDir,
    "(",
    "-type",
    "f",
    "-o",
    "-type",
    "d",
    ")",
    "-exec",
    "chattr",
    "-i",
    "{}",
    "+",
  ]);
  rmSync(dataDir, { recursive: true, force: true });
}, 30_000);

test("taken ports are named before anything starts, and nothing is started", async () => {
  const { ports, env } = await portsEnv();
  await occupy(ports.PORT);
  await occupy(ports.SMTP_HTTP_PORT);
  const result = spawnSync("bash", ["scripts/start.sh"], {
    env,
    encoding: "utf8",
    timeout: 30_000,
  });
  expect(result.status).toBe(1);
  expect(result.stderr).toContain(
    `PORT=${ports.PORT}: port ${ports.PORT} on 127.0.0.1 is already in use`,
  );
  expect(result.stderr).toContain(
    `SMTP_HTTP_PORT=${ports.SMTP_HTTP_PORT}: port ${ports.SMTP_HTTP_PORT} on 127.0.0.1 is already in use`,
  );
  expect(result.stderr).not.toContain(`SMTP_PORT=${ports.SMTP_PORT}:`);
  expect(result.stderr + result.stdout).not.toMatch(/ready in \d+ s/);
  expect(existsSync(path.join(dataDir, "mariadb"))).toBe(false);
});

test("npm start: ready only once the app answers, a second start on the data folder refuses, SIGTERM to npm stops everything", async () => {
  const { ports, env } = await portsEnv();
  const npm = spawn("npm", ["start"], {
    env,
    stdio: ["ignore", "pipe", "pipe"],
  });
  started.push(npm);
  let output = "";
  let healthAtReady: number | string | undefined;
  const ready = new Promise<void>((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (/ready in \d+ s/.test(output) && healthAtReady === undefined) {
        healthAtReady = "pending";
        // the moment "ready" is printed, the app must already answer
        fetch(`http://127.0.0.1:${ports.PORT}/api/health`)
          .then((r) => (healthAtReady = r.status))
          .catch((e: Error) => (healthAtReady = e.message))
          .finally(resolve);
      }
    };
    npm.stdout!.on("data", onData);
    npm.stderr!.on("data", onData);
    npm.on("exit", (code) =>
      reject(new Error(`npm start exited (${code}) before ready:\n${output}`)),
    );
  });
  await ready;
  expect(healthAtReady).toBe(200);

  const second = spawnSync("bash", ["scripts/start.sh"], {
    env: (await portsEnv()).env,
    encoding: "utf8",
    timeout: 30_000,
  });
  expect(second.status).toBe(1);
  expect(second.stderr).toMatch(
    new RegExp(
      `another npm start \\(pid \\d+\\) is already serving the data folder ${dataDir}`,
    ),
  );
  expect(usingDataDir()).toHaveLength(1); // still the one mariadbd

  const mariadbPid = Number(
    readFileSync(path.join(dataDir, "run", "mariadb.pid"), "utf8"),
  );
  const tree = descendants(npm.pid!);
  expect(tree.filter((p) => p.comm === "node").length).toBeGreaterThanOrEqual(
    2,
  ); // the app and the mail fake
  expect(alive(mariadbPid)).toBe(true);

  npm.kill("SIGTERM");
  const gone = await until(
    () =>
      !tree.some((p) => alive(p.pid)) &&
      !alive(mariadbPid) &&
      usingDataDir().length === 0,
    20_000,
  );
  const left = tree
    .filter((p) => alive(p.pid))
    .map((p) => `${p.pid} ${p.comm}`);
  expect({ gone, left, mariadbd: alive(mariadbPid) }).toEqual({
    gone: true,
    left: [],
    mariadbd: false,
  });
}, 180_000);

test("a MariaDB that fails to start shows its own output of this start, not stale log lines (read-only data folder)", async () => {
  const { env } = await portsEnv();
  // the data folder was initialised and cleanly stopped by the previous test
  expect(existsSync(path.join(dataDir, "mariadb", "mysql"))).toBe(true);
  appendFileSync(
    path.join(dataDir, "run", "mariadb.err"),
    "STALE-LINE from an earlier start\n",
  );
  // read-only even for root: immutable files and folders (chattr refuses sockets, so only those two kinds)
  const chattr = spawnSync(
    "find",
    [
      dataDir,
      "(",
      "-type",
      "f",
      "-o",
      "-type",
      "d",
      ")",
      "-exec",
      "chattr",
      "+i",
      "{}",
      "+",
    ],
    { encoding: "utf8" },
  );
  expect(chattr.status, chattr.stderr).toBe(0);
  try {
    const result = spawnSync("bash", ["scripts/db.sh", "start"], {
      env,
      encoding: "utf8",
      timeout: 60_000,
    });
    expect(result.status).toBe(1);
    expect(result.stderr).toContain("---- MariaDB output of this start ----");
    expect(result.stderr).toMatch(/Can't create.*Operation not permitted/);
    expect(result.stderr).not.toContain("STALE-LINE");
    expect(result.stderr).toContain("mariadbd exited during start-up");
  } finally {
    spawnSync("find", [
      dataDir,
      "(",
      "-type",
      "f",
      "-o",
      "-type",
      "d",
      ")",
      "-exec",
      "chattr",
      "-i",
      "{}",
      "+",
    ]);
  }
}, 60_000);
