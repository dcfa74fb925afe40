import { problem } from "~/.server/http";
import { nestedDeeperThan } from "~/core/lookup";

const MAX_JSON_BODY_BYTES = 8 * 1024 * 1024;
/** Deepest nesting of arrays and objects a JSON body may have (a lookup body needs 3). */
export const MAX_JSON_DEPTH = 32;

export { nestedDeeperThan };

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
