import { expect, test } from "vitest";
import { AcceptInvitationSchema, ProfileSchema } from "./auth-schemas";

// People's names are labels shown in lists, audit entries and e-mails: one line, no control characters
// (OWASP Input Validation cheat sheet: allow-list the characters of free-text fields where they matter).
test("a person's name with a line break or a control character is refused, naming the field", () => {
  const bad = ProfileSchema.safeParse({
    intent: "profile",
    name: "Ada\nLovelace",
    unitSystem: "field",
  });
  expect(bad.success).toBe(false);
  expect(bad.error?.issues[0]?.message).toMatch(
    /^The name must be one line.*line break/,
  );
  const ok = ProfileSchema.safeParse({
    intent: "profile",
    name: "  Ada Lovelace ",
    unitSystem: "field",
  });
  expect(ok.success && ok.data.name).toBe("Ada Lovelace");
  const invited = AcceptInvitationSchema.safeParse({
    name: "Eve\u0007",
    password: "long-enough-password",
    confirm: "long-enough-password",
  });
  expect(invited.success).toBe(false);
});
