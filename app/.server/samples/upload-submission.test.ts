import { expect, test } from "vitest";
import { readUploadForm } from "./upload-submission";

/* The upload form is parsed once: problems with the intent or the file stop the check; the confirm's own fields only stop the store. */

function form(fields: Record<string, string>, file?: File) {
  const data = new FormData();
  for (const [k, v] of Object.entries(fields)) data.set(k, v);
  if (file) data.set("file", file);
  return data;
}
const csv = () =>
  new File(["pressure,temperature\n"], "results.csv", { type: "text/csv" });

test("a preview needs only the file", () => {
  const read = readUploadForm(form({ intent: "preview" }, csv()));
  expect(read.ok && read.intent).toBe("preview");
  expect(read.ok && read.file.name).toBe("results.csv");
});

test("a confirm with every field can be stored, with the comment trimmed and the raw one kept", () => {
  const read = readUploadForm(
    form(
      {
        intent: "confirm",
        comment: "  Report 7, reissued. ",
        previewSha256: "abc",
        storeIdentical: "yes",
      },
      csv(),
    ),
  );
  expect(read).toMatchObject({
    ok: true,
    intent: "confirm",
    comment: "  Report 7, reissued. ",
    store: {
      ok: true,
      comment: "Report 7, reissued.",
      previewSha256: "abc",
      storeIdentical: true,
    },
  });
});

test("a confirm without a comment is still checked, but not stored", () => {
  const read = readUploadForm(form({ intent: "confirm", comment: " " }, csv()));
  expect(read.ok && read.intent).toBe("confirm");
  if (!read.ok || read.intent !== "confirm") throw new Error("not a confirm");
  expect(read.comment).toBe(" ");
  expect(read.store.ok).toBe(false);
  expect(!read.store.ok && Object.keys(read.store.errors)).toEqual(["comment"]);
  expect(!read.store.ok && read.store.errors.comment?.[0]).toMatch(
    /^Say what this upload is/,
  );
});

test("without a file, or with an unknown intent, nothing is checked and only those fields are named", () => {
  const noFile = readUploadForm(form({ intent: "confirm", comment: "" }));
  expect(noFile).toEqual({
    ok: false,
    errors: { file: ["Choose the CSV or XLSX file with the results."] },
  });
  const empty = readUploadForm(
    form({ intent: "preview" }, new File([], "", { type: "" })),
  );
  expect(!empty.ok && Object.keys(empty.errors)).toEqual(["file"]);
  const unknown = readUploadForm(form({ intent: "store" }, csv()));
  expect(unknown).toEqual({
    ok: false,
    errors: { intent: ["Choose “Check file” or “Store as draft revision”."] },
  });
});
