/*
 * What to tell the uploader when storing a confirmed upload fails. Storing is one transaction, so in every case
 * nothing was stored; the message says so, says why in words a lab lead can act on, and the page keeps the file
 * and the comment for a retry. The database's own message is not shown (it may name tables and values), only
 * its error code, for whoever reads the server log.
 */

type StoreFailure = {
  status: 409 | 500 | 503;
  kind: "unavailable" | "conflict" | "refused";
  /** For the user. */
  message: string;
  /** For the server log: the code and the driver's message (no query parameters). */
  log: string;
};

/** Codes of mysql2 / MariaDB meaning the database could not be reached or stopped answering. */
const UNAVAILABLE = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EPIPE",
  "ENOTFOUND",
  "PROTOCOL_CONNECTION_LOST",
  "PROTOCOL_SEQUENCE_TIMEOUT",
  "POOL_CLOSED",
  "ER_CON_COUNT_ERROR",
  "ER_SERVER_SHUTDOWN",
  "ER_QUERY_INTERRUPTED",
  "ER_STATEMENT_TIMEOUT",
  "ER_QUERY_TIMEOUT",
]);
/** Codes meaning another change to the same rows got in the way. */
const CONFLICT = new Set([
  "ER_LOCK_WAIT_TIMEOUT",
  "ER_LOCK_DEADLOCK",
  "ER_DUP_ENTRY",
]);

/** The first error code on the error or its causes (drizzle wraps the driver's error as `cause`). */
export function errorCodeOf(error: unknown): string | null {
  let e: unknown = error;
  for (
    let depth = 0;
    depth < 5 && typeof e === "object" && e !== null;
    depth++
  ) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string" && code !== "") return code;
    e = (e as { cause?: unknown }).cause;
  }
  return null;
}

const NOTHING = "Nothing was stored: an upload is stored whole or not at all.";
const KEPT = "Your file and comment are still here";

/** The innermost error's message (drizzle's own message carries the whole query and its parameters). */
function rootMessage(error: unknown): string {
  let e: unknown = error;
  for (let depth = 0; depth < 5; depth++) {
    const cause =
      typeof e === "object" && e !== null
        ? (e as { cause?: unknown }).cause
        : undefined;
    if (cause === undefined || cause === null) break;
    e = cause;
  }
  return e instanceof Error ? e.message : String(e);
}

export function describeStoreFailure(
  error: unknown,
  revisionNumber: number,
): StoreFailure {
  const code = errorCodeOf(error);
  const log = `${code ?? "no code"}: ${rootMessage(error)}`;
  const store = `Store as draft revision ${revisionNumber}`;
  if (code && UNAVAILABLE.has(code)) {
    return {
      status: 503,
      kind: "unavailable",
      log,
      message: `The database did not answer, so the draft revision could not be stored. ${NOTHING} ${KEPT}: choose “${store}” again in a minute; if it keeps failing, tell your administrator (error ${code}).`,
    };
  }
  if (code && CONFLICT.has(code)) {
    return {
      status: 409,
      kind: "conflict",
      log,
      message: `Another change to this sample was being stored at the same moment, so this one was stopped. ${NOTHING} ${KEPT}: choose “${store}” again.`,
    };
  }
  return {
    status: 500,
    kind: "refused",
    log,
    message: `The database refused to store the draft revision${code ? ` (error ${code})` : ""}. ${NOTHING} ${KEPT}: you may try “${store}” again; if it fails again, tell your administrator.`,
  };
}
