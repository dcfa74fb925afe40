import { expect, test } from "vitest";
import { UPLOAD_LIMIT_BYTES } from "~/utils/upload-form";
import { MAX_UPLOAD_BYTES } from "~/core/lab-data";
import { readCappedFormData, UPLOAD_BODY_LIMIT_BYTES } from "./upload";

/* The upload body is capped while it is read: a declared size over the cap is never read, a stream stops being buffered at the cap. */

function multipart(
  fileBytes: Uint8Array,
  fields: Record<string, string> = { intent: "preview" },
) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  form.set(
    "file",
    new File([fileBytes as Uint8Array<ArrayBuffer>], "results.csv", {
      type: "text/csv",
    }),
  );
  return new Request("http://test.invalid/samples/1/upload", {
    method: "POST",
    body: form,
  });
}

/** A stream of `total` bytes in 64 KiB chunks that records how much was pulled. */
function countingStream(total: number) {
  const state = { pulled: 0 };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (state.pulled >= total) return controller.close();
      const n = Math.min(65536, total - state.pulled);
      state.pulled += n;
      controller.enqueue(new Uint8Array(n).fill(65));
    },
  });
  return { stream, state };
}

test("the browser's limit is the parser's limit", () => {
  expect(UPLOAD_LIMIT_BYTES).toBe(MAX_UPLOAD_BYTES);
  expect(UPLOAD_BODY_LIMIT_BYTES).toBeGreaterThan(MAX_UPLOAD_BYTES);
});

test("a body under the cap is read into form data with its file", async () => {
  const result = await readCappedFormData(
    multipart(new TextEncoder().encode("pressure (psia),temperature (degF)\n")),
  );
  expect(result.ok).toBe(true);
  if (!result.ok) return;
  expect(result.formData.get("intent")).toBe("preview");
  const file = result.formData.get("file") as File;
  expect(file.name).toBe("results.csv");
  expect(await file.text()).toContain("pressure (psia)");
});

test("a declared Content-Length over the cap is refused without reading a byte", async () => {
  const { stream, state } = countingStream(10 * 1024 * 1024);
  const request = new Request("http://test.invalid/upload", {
    method: "POST",
    body: stream,
    headers: {
      "Content-Length": String(10 * 1024 * 1024),
      "Content-Type": "multipart/form-data; boundary=x",
    },
    duplex: "half",
  } as RequestInit);
  const result = await readCappedFormData(request);
  expect(result).toMatchObject({
    ok: false,
    reason: "too_large",
    bytesRead: 0,
    declaredBytes: 10 * 1024 * 1024,
  });
  expect(state.pulled).toBeLessThanOrEqual(65536 * 2); // at most what the stream pre-buffers on its own
});

test("a streamed body without Content-Length is cut at the cap (and nothing beyond the cap is kept)", async () => {
  const { stream } = countingStream(3 * 1024 * 1024);
  const request = new Request("http://test.invalid/upload", {
    method: "POST",
    body: stream,
    headers: { "Content-Type": "multipart/form-data; boundary=x" },
    duplex: "half",
  } as RequestInit);
  const result = await readCappedFormData(request, 1024 * 1024);
  expect(result).toMatchObject({
    ok: false,
    reason: "too_large",
    declaredBytes: null,
  });
  expect(result.bytesRead).toBeGreaterThan(1024 * 1024);
});

test("a file just over 5 MB in a real multipart body is refused as too large", async () => {
  const result = await readCappedFormData(
    multipart(new Uint8Array(MAX_UPLOAD_BYTES + 80 * 1024).fill(44)),
  );
  expect(result).toMatchObject({ ok: false, reason: "too_large" });
});

test("a body that is not a form is reported as malformed", async () => {
  const request = new Request("http://test.invalid/upload", {
    method: "POST",
    body: "--x\r\nnot a part",
    headers: { "Content-Type": "multipart/form-data; boundary=x" },
  });
  expect(await readCappedFormData(request)).toMatchObject({
    ok: false,
    reason: "malformed",
  });
});
