import { describe, expect, test } from "vitest";
import {
  etagOf,
  finiteJson,
  json,
  NonFiniteNumberError,
  notModified,
  refuseNonFinite,
} from "./respond";

/*
 * RFC 8259 §6: JSON has no NaN or Infinity (JSON.stringify would quietly write null, a hand-written body
 * invalid JSON). RFC 9110 §13.1.2 and §8.8.3.2: If-None-Match uses the weak comparison.
 */
describe("no non-finite number is ever written", () => {
  test("finiteJson writes finite numbers and throws naming the member for NaN and ±Infinity", () => {
    expect(finiteJson({ a: 1.5, b: [0, -2], c: null })).toBe(
      '{"a":1.5,"b":[0,-2],"c":null}',
    );
    for (const bad of [NaN, Infinity, -Infinity]) {
      expect(() => finiteJson({ rows: [{ value: bad }] })).toThrow(
        NonFiniteNumberError,
      );
      expect(() => finiteJson({ rows: [{ value: bad }] })).toThrow(/"value"/);
    }
  });

  test("json() fails loudly outside production (tests and development)", () => {
    expect(() => json(new Request("http://x/"), { value: NaN })).toThrow(
      NonFiniteNumberError,
    );
  });

  test("in production the body is refused: a 500 problem, no number written", async () => {
    const original = console.error;
    const logged: unknown[] = [];
    console.error = (...args: unknown[]) => void logged.push(args);
    try {
      const response = refuseNonFinite(
        new NonFiniteNumberError("value", NaN),
        "refuse",
      );
      expect(response.status).toBe(500);
      expect(response.headers.get("Content-Type")).toContain(
        "application/problem+json",
      );
      expect(await response.text()).not.toMatch(/NaN/);
      expect(logged).toHaveLength(1);
    } finally {
      console.error = original;
    }
    expect(() => refuseNonFinite(new Error("other"), "refuse")).toThrow(
      "other",
    );
  });
});

describe("ETags from what determines the answer", () => {
  test("the same parts give the same tag, any change another", () => {
    expect(etagOf("table", 7, "approved", "csv")).toBe(
      etagOf("table", 7, "approved", "csv"),
    );
    expect(etagOf("table", 7, "approved", "csv")).not.toBe(
      etagOf("table", 7, "draft", "csv"),
    );
    expect(etagOf("table", 7, "approved", "csv")).not.toBe(
      etagOf("table", 7, "approved", "json"),
    );
  });

  test("If-None-Match matches a weak tag by weak comparison, only on GET and HEAD", () => {
    const tag = `W/${etagOf("x")}`;
    const get = (value: string, method = "GET") =>
      new Request("http://x/", { method, headers: { "If-None-Match": value } });
    expect(notModified(get(tag), tag)?.status).toBe(304);
    expect(notModified(get(tag.slice(2)), tag)?.status).toBe(304);
    expect(notModified(get(`"other", ${tag}`), tag)?.status).toBe(304);
    expect(notModified(get("*"), tag)?.status).toBe(304);
    expect(notModified(get('"other"'), tag)).toBeNull();
    expect(notModified(get(tag, "POST"), tag)).toBeNull();
  });
});
