import { expect, test } from "vitest";
import { z } from "zod";
import { fieldErrorsOf, readIntent } from "./forms";

test("zod issues become errors by field, whole-form issues under 'form'", () => {
  const schema = z
    .object({
      name: z.string().min(1, "Give a name."),
      days: z.coerce.number().max(9, "At most 9 days."),
    })
    .refine((v) => v.name !== "x", "Not x.");
  const bad = schema.safeParse({ name: "", days: "12" });
  expect(bad.success).toBe(false);
  expect(fieldErrorsOf(bad.error!.issues)).toEqual({
    name: ["Give a name."],
    days: ["At most 9 days."],
  });
  const root = schema.safeParse({ name: "x", days: "1" });
  expect(fieldErrorsOf(root.error!.issues)).toEqual({ form: ["Not x."] });
});

test("the pressed button is read from the intent field of a form or a JSON body", () => {
  const form = new FormData();
  form.set("intent", "revoke");
  expect(readIntent(form)).toBe("revoke");
  expect(readIntent(new FormData())).toBe("");
  expect(readIntent({ intent: "units", units: "metric" })).toBe("units");
  expect(readIntent({ intent: 3 })).toBe("");
});
