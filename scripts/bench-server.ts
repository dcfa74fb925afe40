// The production server as the benchmarks start it (scripts/bench-api.ts, scripts/bench-heavy.ts): on loopback,
// without a rate limit in the way, with the node options of BENCH_NODE_ARGS (e.g. "--cpu-prof
// --cpu-prof-dir=/tmp/prof" profiles it; the profile is written when it stops).
import { spawn, type ChildProcess } from "node:child_process";

export type BenchServer = {
  base: string;
  process: ChildProcess;
  stop: () => Promise<void>;
};

export async function startBenchServer(opts: {
  port: number;
  databaseUrl: string;
  secret: string;
  env?: Record<string, string>;
}): Promise<BenchServer> {
  const base = `http://127.0.0.1:${opts.port}`;
  const nodeArgs = (process.env.BENCH_NODE_ARGS ?? "")
    .split(" ")
    .filter(Boolean);
  const child = spawn(
    "node",
    [...nodeArgs, "scripts/server.mjs", "build/server/index.js"],
    {
      env: {
        ...process.env,
        NODE_ENV: "production",
        HOST: "127.0.0.1",
        PORT: String(opts.port),
        APP_BASE_URL: base,
        DATABASE_URL: opts.databaseUrl,
        SESSION_SECRET: opts.secret,
        API_TOKEN_SECRET: opts.secret,
        API_RATE_LIMIT_PER_MINUTE: "100000000",
        ...opts.env,
      },
      stdio: "ignore",
    },
  );
  const kill = () => child.kill("SIGKILL");
  process.on("exit", kill);
  const stop = async () => {
    process.off("exit", kill);
    if (child.exitCode !== null) return;
    await new Promise((resolve) => {
      child.once("exit", resolve);
      child.kill("SIGTERM");
      setTimeout(() => child.kill("SIGKILL"), 5_000).unref();
    });
  };
  for (let i = 0; i < 150; i++) {
    if (
      await fetch(`${base}/api/health`)
        .then((r) => r.ok)
        .catch(() => false)
    )
      return { base, process: child, stop };
    await new Promise((r) => setTimeout(r, 200));
  }
  await stop();
  throw new Error("the server did not start");
}
