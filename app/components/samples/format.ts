/** A measured value for a table cell: up to 6 significant digits, no float noise, no thousands separators. */
export function formatValue(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value))
    return "";
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs < 1e-4 || abs >= 1e9)
    return value.toExponential(4).replace(/\.?0+e/, "e");
  return String(Number(value.toPrecision(6)));
}

/** A date-time as "2026-03-14 09:26 UTC" (the same on the server and in the browser). */
export function formatDateTime(
  value: Date | string | null | undefined,
): string {
  if (!value) return "—";
  const d = typeof value === "string" ? new Date(value) : value;
  return `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** A signed relative change, "+1.2 %", or "" when it cannot be computed. */
export function formatChange(from: number | null, to: number | null): string {
  if (from === null || to === null || from === 0) return "";
  const pct = ((to - from) / Math.abs(from)) * 100;
  const text =
    Math.abs(pct) >= 10
      ? pct.toFixed(0)
      : Math.abs(pct) >= 1
        ? pct.toFixed(1)
        : pct.toPrecision(2);
  return `${pct > 0 ? "+" : ""}${text} %`;
}
