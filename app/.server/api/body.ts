import { problem } from "~/.server/http";

export const MAX_JSON_BODY_BYTES = 8 * 1024 * 1024;
/** Deepest nesting of arrays and objects a JSON body may have (a lookup body needs 3). */
export const MAX_JSON_DEPTH = 32;

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
      for (const item of v) if (typeof item === "object" && item !== null) stack.push([item, depth + 1]);
    } else {
      for (const key in v) {
        const item = (v as Record<string, unknown>)[key];
        if (typeof item === "object" && item !== null) stack.push([item, depth + 1]);
      }
    }
  }
  return false;
}

/**
 * Reads a JSON body, refusing it while it is read once it passes `maxBytes` (413), and answering 415 for a
 * body that is not application/json and 400 for JSON that does not parse. Throws problem Responses.
 */
export async function readJsonBody(request: Request, maxBytes = MAX_JSON_BODY_BYTES): Promise<unknown> {
  return (await readJsonBodyWithText(request, maxBytes)).value;
}

/** As readJsonBody, also returning the body's text (e.g. to derive an ETag from the request). */
export async function readJsonBodyWithText(request: Request, maxBytes = MAX_JSON_BODY_BYTES): Promise<{ value: unknown; text: string }> {
  const type = request.headers.get("Content-Type") ?? "";
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    throw problem(415, "unsupported_media_type", "Send the body as JSON with Content-Type: application/json.");
  }
  const tooLarge = () => problem(413, "payload_too_large", `The body is larger than ${maxBytes / 1024 / 1024} MB; send fewer points per request.`);
  const declared = Number(request.headers.get("Content-Length") ?? "NaN");
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge();
  const reader = request.body?.getReader();
  if (!reader) throw problem(400, "invalid_body", "The request has no body.");
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let offset = 0;
  for (const c of chunks) {
    bytes.set(c, offset);
    offset += c.byteLength;
  }
  const text = new TextDecoder().decode(bytes);
  let value: unknown;
  try {
    value = JSON.parse(text) as unknown;
  } catch (error) {
    // V8's message quotes the text around the fault; the problem helper cuts what it quotes.
    throw problem(400, "invalid_body", `The body is not valid JSON: ${(error as Error).message.slice(0, 120)}`);
  }
  if (nestedDeeperThan(value, MAX_JSON_DEPTH)) {
    throw problem(400, "invalid_body", `The body nests lists or objects more than ${MAX_JSON_DEPTH} levels deep; a lookup body needs three.`);
  }
  return { value, text };
}
