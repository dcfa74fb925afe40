import { MAX_UPLOAD_BYTES } from "~/core/lab-data";

/*
 * Reading an upload's request body with a cap. The cap is enforced while the body is read, never after:
 *  1. a declared Content-Length over the cap is refused before a single byte is read;
 *  2. otherwise the stream is read chunk by chunk and buffering stops as soon as the total passes the cap.
 * In case 2 the rest of the body is read and thrown away (up to DRAIN_LIMIT_BYTES) so that the browser, still
 * sending, receives the 413 page instead of a reset connection; past that the stream is cancelled.
 */

/** Room for the other form fields and the multipart framing around a file of MAX_UPLOAD_BYTES. */
const FORM_OVERHEAD_BYTES = 64 * 1024;
export const UPLOAD_BODY_LIMIT_BYTES = MAX_UPLOAD_BYTES + FORM_OVERHEAD_BYTES;
/** Past this much, an oversized body is no longer drained but cut off. */
const DRAIN_LIMIT_BYTES = 64 * 1024 * 1024;

export type CappedForm =
  | { ok: true; formData: FormData; bytesRead: number }
  | {
      ok: false;
      reason: "too_large";
      bytesRead: number;
      declaredBytes: number | null;
    }
  | { ok: false; reason: "malformed"; bytesRead: number };

export async function readCappedFormData(
  request: Request,
  limit = UPLOAD_BODY_LIMIT_BYTES,
): Promise<CappedForm> {
  const declaredHeader = request.headers.get("Content-Length");
  const declared =
    declaredHeader !== null && /^\d+$/.test(declaredHeader)
      ? Number(declaredHeader)
      : null;
  if (declared !== null && declared > limit)
    return {
      ok: false,
      reason: "too_large",
      bytesRead: 0,
      declaredBytes: declared,
    };

  const chunks: Uint8Array[] = [];
  let total = 0;
  let tooLarge = false;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > limit) {
        tooLarge = true;
        chunks.length = 0;
        if (total > DRAIN_LIMIT_BYTES) {
          await reader.cancel().catch(() => undefined);
          break;
        }
        continue;
      }
      chunks.push(value);
    }
  }
  if (tooLarge)
    return {
      ok: false,
      reason: "too_large",
      bytesRead: total,
      declaredBytes: declared,
    };

  const body = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  const contentType = request.headers.get("Content-Type") ?? "";
  try {
    const copy = new Request(request.url, {
      method: "POST",
      headers: { "Content-Type": contentType },
      body,
    });
    return { ok: true, formData: await copy.formData(), bytesRead: total };
  } catch {
    return { ok: false, reason: "malformed", bytesRead: total };
  }
}
