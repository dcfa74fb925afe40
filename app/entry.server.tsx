import { PassThrough } from "node:stream";
import { createReadableStreamFromReadable } from "@react-router/node";
import { isbot } from "isbot";
import type { RenderToPipeableStreamOptions } from "react-dom/server";
import { renderToPipeableStream } from "react-dom/server";
import {
  type EntryContext,
  type HandleErrorFunction,
  isRouteErrorResponse,
  ServerRouter,
} from "react-router";
import { settleBackgroundJobs } from "~/.server/auth/background";
import { closeDb } from "~/.server/db/client";
import { closeHeavyPool } from "~/.server/workers/pool";
import { checkDatabaseAtStartup } from "~/.server/ops/startup";
import { getEnv } from "~/.server/env";
import { describeError, logger } from "~/.server/ops/logger";
import { collectProcessMetrics } from "~/.server/ops/metrics";
import { currentRequest, requestStore } from "~/.server/ops/request-store";
import { NonceContext } from "~/components/nonce";

/**
 * React Router's default Node entry, plus what our HTTP server (scripts/server.mjs) needs from the app: the CSP
 * nonce on every inline script, one concise log line per error, and `serverHooks` (configuration, shared request
 * state, start-up check and shutdown), which the server reads from the build's entry module.
 */
export const streamTimeout = 5_000;

export default function handleRequest(
  request: Request,
  responseStatusCode: number,
  responseHeaders: Headers,
  routerContext: EntryContext,
) {
  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, {
      status: responseStatusCode,
      headers: responseHeaders,
    });
  }
  const nonce = currentRequest()?.nonce || undefined;
  return new Promise((resolve, reject) => {
    let shellRendered = false;
    const userAgent = request.headers.get("user-agent");
    const readyOption: keyof RenderToPipeableStreamOptions =
      (userAgent && isbot(userAgent)) || routerContext.isSpaMode
        ? "onAllReady"
        : "onShellReady";
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(
      () => abort(),
      streamTimeout + 1000,
    );
    const { pipe, abort } = renderToPipeableStream(
      <NonceContext.Provider value={nonce}>
        <ServerRouter context={routerContext} url={request.url} nonce={nonce} />
      </NonceContext.Provider>,
      {
        nonce,
        [readyOption]() {
          shellRendered = true;
          const body = new PassThrough({
            final(callback) {
              clearTimeout(timeoutId);
              timeoutId = undefined;
              callback();
            },
          });
          const stream = createReadableStreamFromReadable(body);
          responseHeaders.set("Content-Type", "text/html; charset=utf-8");
          pipe(body);
          resolve(
            new Response(stream, {
              headers: responseHeaders,
              status: responseStatusCode,
            }),
          );
        },
        onShellError(error: unknown) {
          reject(error);
        },
        onError(error: unknown) {
          responseStatusCode = 500;
          if (shellRendered) logError(error);
        },
      },
    );
  });
}

export const handleError: HandleErrorFunction = (error, { request }) => {
  if (request.signal.aborted) return; // the client went away: nothing to report
  if (isRouteErrorResponse(error) && error.status < 500) return; // a 404 or 405 answered as such, not a fault
  logError(error, request);
};

function logError(error: unknown, request?: Request) {
  const state = currentRequest();
  logger.error(
    {
      requestId: state?.requestId,
      ...(request
        ? { method: request.method, path: new URL(request.url).pathname }
        : {}),
      error: describeError(error),
    },
    "request failed",
  );
}

/** What scripts/server.mjs takes from the build (through `build.entry.module.serverHooks`). */
export const serverHooks = {
  /** Parses the configuration; throws EnvError naming every bad variable. */
  configuration: () => getEnv(),
  requestStore,
  logger,
  collectProcessMetrics,
  checkDatabaseAtStartup,
  /** Closes what keeps the process alive once the last request has been answered. */
  async close(): Promise<void> {
    await settleBackgroundJobs(); // e.g. a password-reset mail queued by a request just answered
    await closeHeavyPool();
    await closeDb();
  },
};
