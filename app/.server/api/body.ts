import { problem } from "~/.server/http";

export const MAX_JSON_BODY_BYTES = 8 * 1024 * 1024;

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
  try {
    return { value: JSON.parse(text) as unknown, text };
  } catch (error) {
    throw problem(400, "invalid_body", `The body is not valid JSON: ${(error as Error).message}`);
  }
}
