import { AsyncLocalStorage } from "node:async_hooks";

/**
 * What the HTTP server (scripts/server.mjs) and the app share about one request, carried by async context so
 * that no function has to pass it along: the request id of the log line, the CSP nonce of the page, who called
 * (for the log line) and whether the database failed during the request (turned into a 503 at the edge).
 */
type RequestState = {
  requestId: string;
  nonce: string;
  /** `user:<id>` or `token:<id>`, set by authentication; logged, never the token itself. */
  caller: string | null;
  /** Set by the database client when a query could not reach the database in time. */
  databaseUnavailable: boolean;
};

export const requestStore = new AsyncLocalStorage<RequestState>();

export function currentRequest(): RequestState | undefined {
  return requestStore.getStore();
}

/** Records the caller for the request's log line (no-op outside a request, e.g. in tests and scripts). */
export function noteCaller(caller: string): void {
  const state = requestStore.getStore();
  if (state) state.caller = caller;
}
