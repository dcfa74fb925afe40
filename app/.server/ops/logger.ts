import pino from "pino";
import { getEnv } from "~/.server/env";

/**
 * The one logger: JSON lines on stdout (pino), one per request from the HTTP server and one per error.
 * LOG_LEVEL sets the level (default `info`; `debug` adds error stacks). Secrets, SQL parameters, session and
 * token values never reach it: errors are logged through `describeError`, which keeps the kind and a short
 * message only.
 */
export const logger = pino({
  level: configuredLevel(),
  base: undefined,
  timestamp: pino.stdTimeFunctions.isoTime,
  redact: {
    paths: [
      "req.headers.authorization",
      "req.headers.cookie",
      'res.headers["set-cookie"]',
      "password",
      "token",
    ],
    remove: true,
  },
});

type ErrorSummary = {
  kind: string;
  code?: string;
  message: string;
  stack?: string;
};

/**
 * A short, safe description of an error for the log: its class, a driver code if any, and the first line of its
 * message with SQL text and parameters cut off (drizzle puts both in its "Failed query" messages).
 */
export function describeError(error: unknown): ErrorSummary {
  if (!(error instanceof Error))
    return { kind: typeof error, message: String(error).slice(0, 200) };
  const cause = error.cause instanceof Error ? error.cause : undefined;
  const source = cause ?? error;
  const code = (source as { code?: unknown }).code;
  let message = source.message.split("\n")[0] ?? "";
  if (/^Failed query:/i.test(message)) message = "database query failed";
  const summary: ErrorSummary = {
    kind: cause ? `${error.name} ← ${cause.name}` : error.name,
    ...(typeof code === "string" ? { code } : {}),
    message: message.slice(0, 200),
  };
  if (logger.isLevelEnabled("debug")) summary.stack = source.stack;
  return summary;
}

function configuredLevel(): string {
  try {
    const env = getEnv();
    return env.LOG_LEVEL ?? (env.NODE_ENV === "test" ? "silent" : "info");
  } catch {
    return "info"; // a bad configuration is reported by the server before it listens
  }
}
