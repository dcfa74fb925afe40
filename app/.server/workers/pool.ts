/**
 * Heavy work off the event loop: large lookups, table builds and upload parsing/QC run in a pool of worker
 * threads (piscina), so one big request cannot stall every other request of the process. See README.md.
 *
 *   const result = await runHeavy("table", input);                         // API: busy → 503 problem details
 *   const checked = await runHeavy("check-upload", input, { surface: "page" }); // page: busy → 503 message
 *
 * Small jobs stay inline (below MIN_WORKER_SIZE, measured: the worker round trip would cost more than the
 * job). At most `workers + queueLimit` heavy jobs are admitted at once; past that the caller gets a 503 with
 * Retry-After, thrown as a Response (the route's answer, like the other expected failures).
 */
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { fileURLToPath } from "node:url";
import { Piscina } from "piscina";
import { getEnv } from "~/.server/env";
import { problem } from "~/.server/http";
import type { HeavyMessage, HeavyReply } from "./heavy-worker";
import {
  decodeError,
  runTask,
  type HeavyInput,
  type HeavyOutput,
  type HeavyTask,
  type TaskOutcome,
} from "./tasks";

/*
 * Below these sizes a job runs inline. Measured on this 2-core machine (warm, but shared with other work, so
 * figures are high): a round trip through a worker costs 1–2 ms (message, clone, wake-up). Inline, a lookup of
 * 1,000 points costs 5–10 ms (interpolation plus the results' JSON), 2,000 points 15–25 ms, 100,000 points
 * 600+ ms; a table of 23 rows 1–2.5 ms, 10,000 rows 50–270 ms (so 500 rows ≈ 3–13 ms). Under the thresholds a
 * job blocks the event loop for about 10–20 ms at most, and the lookup workspace's 3 × 1,000 points (bench:api)
 * keep their direct path. Uploads always go to a worker: even a 7 kB lab file took 65 ms to parse and 70 ms
 * to check (runQc), far more than the round trip.
 */
export const MIN_WORKER_SIZE: Readonly<Record<HeavyTask, number>> =
  Object.freeze({
    "api-lookup": 2_000, // points
    // characters of JSON: 256 kB is about 7,000 points, whose JSON.parse and check take some 5–10 ms inline; the
    // 3.5 MB of 100,000 points take 70–200 ms, which is what kept health waiting behind large lookups.
    "read-lookup-body": 256 * 1024,
    lookup: 2_000, // points
    table: 500, // rows (pressures)
    "check-upload": 1, // bytes: every upload
  });

/** The size of a job in the unit of MIN_WORKER_SIZE. */
function jobSize<T extends HeavyTask>(task: T, input: HeavyInput<T>): number {
  switch (task) {
    case "api-lookup":
      return (input as HeavyInput<"api-lookup">).pressures.length;
    case "read-lookup-body":
      return (input as HeavyInput<"read-lookup-body">).text.length;
    case "lookup": {
      const points = (input as HeavyInput<"lookup">).points;
      return "pressures" in points ? points.pressures.length : points.length;
    }
    case "table":
      return (input as HeavyInput<"table">).pressures.length;
    case "check-upload":
      return (input as HeavyInput<"check-upload">).bytes.byteLength;
    default:
      return 0;
  }
}

type HeavyPoolSettings = {
  /** Worker threads. */
  workers: number;
  /** Heavy jobs that may wait for a worker; one more is refused with 503. */
  queueLimit: number;
  /** The worker entry; null runs every job inline (development, tests, HEAVY_WORK_INLINE=true). */
  filename: string | null;
  /** Node flags of the workers (tests: ["--import", "tsx"] to run the TypeScript entry). */
  execArgv?: string[];
  /** Sizes from which a job goes to a worker (default MIN_WORKER_SIZE). */
  minSize?: Partial<Record<HeavyTask, number>>;
};

/** Who gets a refusal: the JSON API (problem details) or a page (a plain message for the error boundary). */
export type HeavySurface = "api" | "page";

export type HeavyRun<T extends HeavyTask> = {
  value: HeavyOutput<T>;
  where: "worker" | "inline";
  /** Time waiting for a worker (and crossing to it and back). */
  waitMs: number;
  /** Time computing. */
  runMs: number;
  /** The worker's thread id (0 = the main thread, inline). */
  thread: number;
};

export class HeavyPool {
  readonly settings: Readonly<HeavyPoolSettings>;
  #piscina: Piscina<HeavyMessage, HeavyReply> | null = null;
  #admitted = 0;
  #closed = false;
  #averageRunMs = 500;

  constructor(settings: HeavyPoolSettings) {
    this.settings = Object.freeze({
      ...settings,
      workers: Math.max(1, Math.floor(settings.workers)),
      queueLimit: Math.max(0, Math.floor(settings.queueLimit)),
    });
  }

  /** Heavy jobs admitted and not yet finished (running or waiting). */
  get admitted(): number {
    return this.#admitted;
  }

  /** Most heavy jobs admitted at once. */
  get capacity(): number {
    return this.settings.workers + this.settings.queueLimit;
  }

  usesWorker<T extends HeavyTask>(task: T, input: HeavyInput<T>): boolean {
    return (
      this.settings.filename !== null &&
      jobSize(task, input) >=
        (this.settings.minSize?.[task] ?? MIN_WORKER_SIZE[task])
    );
  }

  async run<T extends HeavyTask>(
    task: T,
    input: HeavyInput<T>,
    options: { surface?: HeavySurface } = {},
  ): Promise<HeavyRun<T>> {
    const started = performance.now();
    if (!this.usesWorker(task, input)) {
      const outcome = await runTask(task, input);
      return settle(outcome, "inline", 0, performance.now() - started, 0);
    }
    if (this.#closed || this.#admitted >= this.capacity)
      throw this.busy(options.surface ?? "api");
    this.#admitted++;
    try {
      const reply = await this.#pool().run(
        { task, input },
        { transferList: transferListOf(task, input) },
      );
      this.#averageRunMs = 0.8 * this.#averageRunMs + 0.2 * reply.runMs;
      return settle(
        reply.outcome as TaskOutcome<T>,
        "worker",
        Math.max(0, performance.now() - started - reply.runMs),
        reply.runMs,
        reply.threadId,
      );
    } finally {
      this.#admitted--;
    }
  }

  /** Seconds after which a refused job may well be admitted: the queue's expected drain time, 1–30 s. */
  retryAfterSeconds(): number {
    const perWorker = this.#admitted / this.settings.workers;
    return Math.min(
      30,
      Math.max(1, Math.ceil((perWorker * this.#averageRunMs) / 1000)),
    );
  }

  busy(surface: HeavySurface): Response {
    const seconds = this.retryAfterSeconds();
    const n = this.capacity;
    const why = this.#closed
      ? "The server is shutting down"
      : `The server is at its limit of ${n} large ${n === 1 ? "computation" : "computations"} at once`;
    const wait = `${seconds} ${seconds === 1 ? "second" : "seconds"}`;
    if (surface === "api")
      return problem(503, "server_busy", `${why}; try again in ${wait}.`, {
        headers: { "Retry-After": String(seconds) },
      });
    return new Response(
      `${why}, so this was not done and nothing was changed. Try again in ${wait}.`,
      {
        status: 503,
        statusText: "Service Unavailable",
        headers: {
          "Retry-After": String(seconds),
          "Content-Type": "text/plain; charset=utf-8",
          "Cache-Control": "no-store",
        },
      },
    );
  }

  /** Lets running and waiting jobs finish, then stops the workers; later heavy jobs are refused (503). */
  async close(): Promise<void> {
    this.#closed = true;
    const piscina = this.#piscina;
    this.#piscina = null;
    if (piscina) await piscina.close();
  }

  #pool(): Piscina<HeavyMessage, HeavyReply> {
    this.#piscina ??= new Piscina<HeavyMessage, HeavyReply>({
      filename: this.settings.filename,
      name: "default",
      minThreads: this.settings.workers,
      maxThreads: this.settings.workers,
      // The admission count above is the bound; piscina's own queue never refuses.
      maxQueue: Infinity,
      idleTimeout: 60_000,
      ...(this.settings.execArgv ? { execArgv: this.settings.execArgv } : {}),
    });
    return this.#piscina;
  }
}

function settle<T extends HeavyTask>(
  outcome: TaskOutcome<T>,
  where: "worker" | "inline",
  waitMs: number,
  runMs: number,
  thread: number,
): HeavyRun<T> {
  if ("error" in outcome) throw decodeError(outcome.error);
  return { value: outcome.value, where, waitMs, runMs, thread };
}

/** The API lookup's point columns are moved to the worker, not copied (the caller builds them for it). */
function transferListOf<T extends HeavyTask>(
  task: T,
  input: HeavyInput<T>,
): ArrayBuffer[] {
  if (task !== "api-lookup") return [];
  const { pressures, temperatures } = input as HeavyInput<"api-lookup">;
  return [pressures, temperatures]
    .filter(
      (a) =>
        a.byteOffset === 0 &&
        a.byteLength === a.buffer.byteLength &&
        a.buffer instanceof ArrayBuffer,
    )
    .map((a) => a.buffer as ArrayBuffer)
    .filter((b, i, all) => all.indexOf(b) === i);
}

// Resolved against this module's URL: in the production build that is build/server/index.js, beside which
// `npm run build` writes heavy-worker.js; in development and tests it is this source file, with no compiled
// worker beside it, so the work runs inline.
const WORKER_FILE = "./heavy-worker.js";

function heavyPoolSettingsFromEnv(): HeavyPoolSettings {
  const env = getEnv();
  const file = fileURLToPath(new URL(WORKER_FILE, import.meta.url));
  return {
    workers: env.HEAVY_WORKERS ?? Math.max(1, availableParallelism() - 1),
    queueLimit: env.HEAVY_QUEUE_LIMIT,
    filename: env.HEAVY_WORK_INLINE || !existsSync(file) ? null : file,
  };
}

let shared: HeavyPool | undefined;

/** The process's pool, made on first use from the environment. */
function getHeavyPool(): HeavyPool {
  shared ??= new HeavyPool(heavyPoolSettingsFromEnv());
  return shared;
}

/** Runs a heavy job in a worker (or inline when small); throws the core error it threw, or a 503 Response. */
export async function runHeavy<T extends HeavyTask>(
  task: T,
  input: HeavyInput<T>,
  options?: { surface?: HeavySurface },
): Promise<HeavyOutput<T>> {
  return (await getHeavyPool().run(task, input, options)).value;
}

/** As runHeavy, also saying where the job ran and how long it waited and ran (for Server-Timing). */
export function runHeavyTimed<T extends HeavyTask>(
  task: T,
  input: HeavyInput<T>,
  options?: { surface?: HeavySurface },
): Promise<HeavyRun<T>> {
  return getHeavyPool().run(task, input, options);
}

/** For the HTTP server's graceful shutdown: finishes admitted jobs, then stops the worker threads. */
export async function closeHeavyPool(): Promise<void> {
  await shared?.close();
}
