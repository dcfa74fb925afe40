import { problem } from "~/.server/http";
import { nestedDeeperThan } from "~/core/lookup";

export const MAX_JSON_BODY_BYTES = 8 * 1024 * 1024;
/** Deepest nesting of arrays and objects a JSON body may have (a lookup body needs 3). */
export const MAX_JSON_DEPTH = 32;

export { nestedDeeperThan };

/**
 * Reads a JSON body, refusing it while it is read once it passes `maxBytes` (413), and answering 415 for a
 * body that is not application/json and 400 for JSON that does not parse. Throws problem Responses.
 */
export async function readJsonBody(
  request: Request,
  maxBytes = MAX_JSON_BODY_BYTES,
): Promise<unknown> {
  return (await readJsonBodyWithText(request, maxBytes)).value;
}

/** As readJsonBody, also returning the body's text (e.g. to derive an ETag from the request). */
export async function readJsonBodyWithText(
  request: Request,
  maxBytes = MAX_JSON_BODY_BYTES,
): Promise<{ value: unknown; text: string }> {
  const text = await readJsonText(request, maxBytes);
  let value: unknown;
  try {
    value = JSON.parse(text) as unknown;
  } catch (error) {
    // V8's message quotes the text around the fault; the problem helper cuts what it quotes.
    throw problem(
      400,
      "invalid_body",
      `The body is not valid JSON: ${(error as Error).message.slice(0, 120)}`,
    );
  }
  if (nestedDeeperThan(value, MAX_JSON_DEPTH)) {
    throw problem(
      400,
      "invalid_body",
      `The body nests lists or objects more than ${MAX_JSON_DEPTH} levels deep; a lookup body needs three.`,
    );
  }
  return { value, text };
}

/**
 * A JSON body's text, read without parsing it (a large body is parsed in a worker thread): 415 for another
 * content type, 413 once it passes `maxBytes` while it is read, 400 for no body. Throws problem Responses.
 */
export async function readJsonText(
  request: Request,
  maxBytes = MAX_JSON_BODY_BYTES,
): Promise<string> {
  const type = request.headers.get("Content-Type") ?? "";
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    throw problem(
      415,
      "unsupported_media_type",
      "Send the body as JSON with Content-Type: application/json.",
    );
  }
  const tooLarge = () =>
    problem(
      413,
      "payload_too_large",
      `The body is larger than ${maxBytes / 1024 / 1024} MB; send fewer points per request.`,
    );
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
  return new TextDecoder().decode(bytes);
}
