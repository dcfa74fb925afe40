/**
 * The worker thread's entry: piscina loads it and calls the default export once per job. In the production
 * build it is compiled to build/server/heavy-worker.js beside the server bundle (scripts/build-heavy-worker.mjs);
 * see README.md. Imports only tasks.ts (which imports only app/core) and node:worker_threads for its thread id.
 */
import { threadId } from "node:worker_threads";
import { runTask, type HeavyTask, type TaskOutcome } from "./tasks";

export type HeavyMessage = { task: HeavyTask; input: unknown };
/** The task's outcome, the time it took in the worker and the worker's thread id. */
export type HeavyReply = {
  outcome: TaskOutcome<HeavyTask>;
  runMs: number;
  threadId: number;
};

export default async function heavyWorker({
  task,
  input,
}: HeavyMessage): Promise<HeavyReply> {
  const started = performance.now();
  const outcome = await runTask(task, input as never);
  return { outcome, runMs: performance.now() - started, threadId };
}
