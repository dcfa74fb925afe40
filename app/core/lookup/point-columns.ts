/**
 * The points of a lookup request — a list of `{ pressure, temperature }` as received in JSON — checked by a
 * plain loop (fast for 100,000 points) and copied into two columns. Issues carry the field path of the point
 * (`["points", i, "pressure"]`), at most 20 of them. Pure: used on the server's main thread and in its workers.
 */
export type PointIssue = { path: (string | number)[]; message: string };

export type PointColumns =
  | { ok: true; pressures: Float64Array; temperatures: Float64Array }
  | { ok: false; issues: PointIssue[] };

/** A received value in a few words, never more than ~40 characters of it (no deep walk, no echo). */
export function describeValue(v: unknown): string {
  if (v === undefined) return "nothing";
  if (v === null) return "null";
  if (Array.isArray(v)) return "a list";
  if (typeof v === "object") return "an object";
  const text = JSON.stringify(v);
  return text.length <= 40
    ? text
    : `${text.slice(0, 24)}… (${text.length} characters)`;
}

export function pointColumns(points: readonly unknown[]): PointColumns {
  const n = points.length;
  const pressures = new Float64Array(n);
  const temperatures = new Float64Array(n);
  const issues: PointIssue[] = [];
  for (let i = 0; i < n && issues.length < 20; i++) {
    const p = points[i] as Record<string, unknown> | null;
    if (typeof p !== "object" || p === null || Array.isArray(p)) {
      issues.push({
        path: ["points", i],
        message: "Expected an object { pressure, temperature }.",
      });
      continue;
    }
    const pressure = p.pressure;
    const temperature = p.temperature;
    if (typeof pressure !== "number" || !Number.isFinite(pressure))
      issues.push({
        path: ["points", i, "pressure"],
        message: `Expected a finite number, received ${describeValue(pressure)}.`,
      });
    else pressures[i] = pressure;
    if (typeof temperature !== "number" || !Number.isFinite(temperature))
      issues.push({
        path: ["points", i, "temperature"],
        message: `Expected a finite number, received ${describeValue(temperature)}.`,
      });
    else temperatures[i] = temperature;
    let extra: string[] | undefined;
    for (const key in p)
      if (key !== "pressure" && key !== "temperature") (extra ??= []).push(key);
    if (extra)
      issues.push({
        path: ["points", i],
        message: `Unrecognized key${extra.length > 1 ? "s" : ""}: ${extra
          .slice(0, 5)
          .map((k) => describeValue(k))
          .join(", ")}`,
      });
  }
  return issues.length
    ? { ok: false, issues }
    : { ok: true, pressures, temperatures };
}

/**
 * Whether `value` nests arrays or objects more than `limit` deep. Iterative, so a hostile body (a value nested
 * 10,000 deep) cannot overflow the stack here or in any later recursive step (OWASP Input Validation cheat
 * sheet: bound the depth of structured input).
 */
export function nestedDeeperThan(value: unknown, limit: number): boolean {
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (typeof v !== "object" || v === null) continue;
    if (depth >= limit) return true;
    if (Array.isArray(v)) {
      for (const item of v)
        if (typeof item === "object" && item !== null)
          stack.push([item, depth + 1]);
    } else {
      for (const key in v) {
        const item = (v as Record<string, unknown>)[key];
        if (typeof item === "object" && item !== null)
          stack.push([item, depth + 1]);
      }
    }
  }
  return false;
}

/**
 * A lookup request's JSON text read as far as can be done without the schema of its other fields: parsed, its
 * depth bounded, its points checked into columns. `head` is the body without its points (the caller validates
 * it with the API schema); `count` is the number of points.
 */
export type LookupText =
  | {
      ok: true;
      head: Record<string, unknown>;
      count: number;
      pressures: Float64Array;
      temperatures: Float64Array;
    }
  | { ok: false; message: string; issues?: PointIssue[] };

export function readLookupText(text: string, maxDepth: number): LookupText {
  let value: unknown;
  try {
    value = JSON.parse(text) as unknown;
  } catch (error) {
    return {
      ok: false,
      message: `The body is not valid JSON: ${(error as Error).message.slice(0, 120)}`,
    };
  }
  if (nestedDeeperThan(value, maxDepth)) {
    return {
      ok: false,
      message: `The body nests lists or objects more than ${maxDepth} levels deep; a lookup body needs three.`,
    };
  }
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    return {
      ok: false,
      message: "The lookup request is not valid; see issues.",
      issues: [{ path: [], message: "Expected an object." }],
    };
  }
  const { points, ...head } = value as Record<string, unknown>;
  if (!Array.isArray(points))
    return {
      ok: true,
      head: { ...head, points },
      count: 0,
      pressures: new Float64Array(0),
      temperatures: new Float64Array(0),
    };
  const columns = pointColumns(points);
  if (!columns.ok)
    return {
      ok: false,
      message: "The lookup request is not valid; see issues.",
      issues: columns.issues,
    };
  return {
    ok: true,
    head,
    count: points.length,
    pressures: columns.pressures,
    temperatures: columns.temperatures,
  };
}
