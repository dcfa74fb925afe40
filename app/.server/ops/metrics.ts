import client from "prom-client";

/**
 * Prometheus metrics (prom-client's default registry, shared with scripts/server.mjs, which records the request
 * counts and latencies). Served by the /metrics route to loopback or an administrator's token.
 */
export const registry = client.register;

let defaultsCollected = false;
/** Process metrics (CPU, memory, event-loop lag, GC) — once per process. */
export function collectProcessMetrics(): void {
  if (defaultsCollected) return;
  defaultsCollected = true;
  client.collectDefaultMetrics({
    register: registry,
    eventLoopMonitoringPrecision: 20,
  });
}

function counter(
  name: string,
  help: string,
  labelNames: string[] = [],
): client.Counter {
  const existing = registry.getSingleMetric(name);
  return (
    (existing as client.Counter | undefined) ??
    new client.Counter({ name, help, labelNames, registers: [registry] })
  );
}

/** Lookup points computed and answered (API and pages), by outcome. */
export const lookupPointsServed = counter(
  "isopleth_lookup_points_total",
  "Lookup points answered, by outcome (value or refused).",
  ["outcome"],
);

/** Upload confirmations, by outcome (stored, refused by checks, failed). */
export const uploadsByOutcome = counter(
  "isopleth_uploads_total",
  "Upload confirmations by outcome.",
  ["outcome"],
);

/** Registers a gauge whose value is read when the metrics are scraped. */
export function gaugeFrom(
  name: string,
  help: string,
  read: () => number | Record<string, number>,
  labelName?: string,
): void {
  if (registry.getSingleMetric(name)) return;
  new client.Gauge({
    name,
    help,
    labelNames: labelName ? [labelName] : [],
    registers: [registry],
    collect() {
      const value = read();
      if (typeof value === "number") this.set(value);
      else
        for (const [label, v] of Object.entries(value))
          this.set({ [labelName!]: label }, v);
    },
  });
}
