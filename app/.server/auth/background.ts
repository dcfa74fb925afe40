/*
 * Work that must not hold up the answer (sending mail, and the password-reset work whose duration would tell
 * whether an address has an account). Runs after the current request's work in this process; a failure is
 * logged. If the process stops first the job is lost: the user asks again.
 */
const pending = new Set<Promise<void>>();

export function runInBackground(
  label: string,
  job: () => Promise<unknown>,
): void {
  const run: Promise<void> = new Promise<void>((resolve) =>
    setImmediate(resolve),
  )
    .then(job)
    .then(
      () => undefined,
      (error: unknown) =>
        console.error(`background job "${label}" failed:`, error),
    )
    .finally(() => pending.delete(run));
  pending.add(run);
}

/** Resolves once every job started so far (and any they started) has finished: for tests and shutdown. */
export async function settleBackgroundJobs(): Promise<void> {
  while (pending.size > 0) await Promise.allSettled([...pending]);
}
