import { expect, test } from "vitest";
import { describeStoreFailure, errorCodeOf } from "./store-failure";

/** An error shaped like mysql2's, wrapped as drizzle-orm 0.45 wraps it (DrizzleQueryError with `cause`). */
function wrapped(code: string) {
  return Object.assign(new Error("Failed query: insert into …"), {
    cause: Object.assign(new Error("driver"), { code }),
  });
}

test("every failure says that nothing was stored and that the file and comment are kept", () => {
  for (const code of [
    "ECONNREFUSED",
    "ER_LOCK_DEADLOCK",
    "ER_SIGNAL_EXCEPTION",
    "",
  ]) {
    const f = describeStoreFailure(code ? wrapped(code) : new Error("x"), 4);
    expect(f.message, code).toContain(
      "Nothing was stored: an upload is stored whole or not at all.",
    );
    expect(f.message, code).toContain("Your file and comment are still here");
    expect(f.message, code).toContain("“Store as draft revision 4”");
  }
});

test("the database down, a conflict and a refusal are told apart, without the database's own message", () => {
  expect(
    describeStoreFailure(wrapped("PROTOCOL_CONNECTION_LOST"), 1),
  ).toMatchObject({ status: 503, kind: "unavailable" });
  expect(
    describeStoreFailure(wrapped("ER_LOCK_WAIT_TIMEOUT"), 1),
  ).toMatchObject({ status: 409, kind: "conflict" });
  const refused = describeStoreFailure(
    Object.assign(new Error("secret table name"), {
      code: "ER_SIGNAL_EXCEPTION",
    }),
    1,
  );
  expect(refused).toMatchObject({ status: 500, kind: "refused" });
  expect(refused.message).toContain("(error ER_SIGNAL_EXCEPTION)");
  expect(refused.message).not.toContain("secret");
  expect(describeStoreFailure(wrapped("ER_SIGNAL_EXCEPTION"), 1).log).toBe(
    "ER_SIGNAL_EXCEPTION: driver",
  );
  expect(errorCodeOf("not an error")).toBeNull();
});
