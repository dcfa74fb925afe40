import { describe, expect, test } from "vitest";
import { safeRedirect } from "./safe-redirect";

/*
 * Open-redirect defence: only same-origin paths are followed after sign-in. The hostile list follows
 * OWASP's Unvalidated Redirects and Forwards Cheat Sheet and the URL parsing rules of the WHATWG URL
 * Standard (browsers strip ASCII tab and newline anywhere in a URL, and treat "\" like "/" in http(s) URLs).
 */
describe("safeRedirect", () => {
  test.each([
    "/",
    "/samples",
    "/samples/12?tab=revisions",
    "/samples?q=Calder%20Shelf&page=2",
    "/lookup#result",
    "/admin/people",
  ])("keeps the same-origin path %j", (path) => {
    expect(safeRedirect(path)).toBe(path);
  });

  const hostile: [string, unknown][] = [
    ["protocol-relative", "//evil.example"],
    ["protocol-relative with a path", "//evil.example/sign-in"],
    [
      "tab between the slashes (browsers strip it: //evil.example)",
      "/\t/evil.example",
    ],
    ["newline between the slashes", "/\n/evil.example"],
    ["carriage return between the slashes", "/\r/evil.example"],
    ["CR LF header injection", "/samples\r\nSet-Cookie: x=1"],
    ["a bare newline", "/a\nb"],
    ["a NUL byte", "/samples\u0000"],
    ["a space", "/ /evil.example"],
    ["a leading space", " /samples"],
    ["a non-breaking space", "/\u00a0/evil.example"],
    ["a line separator", "/\u2028/evil.example"],
    ["a backslash (http URLs treat it as /)", "/\\evil.example"],
    ["two backslashes", "\\\\evil.example"],
    ["slash backslash later in the path", "/samples/\\/evil.example"],
    ["absolute http URL", "http://evil.example/"],
    ["absolute https URL", "https://evil.example"],
    ["scheme without slashes", "https:evil.example"],
    ["javascript: URL", "javascript:alert(1)"],
    ["data: URL", "data:text/html,<script>alert(1)</script>"],
    ["relative path", "samples"],
    ["relative dot path", "./samples"],
    ["empty", ""],
    ["encoded slashes //", "/%2F%2Fevil.example"],
    ["encoded second slash", "/%2Fevil.example"],
    ["encoded backslash", "/%5Cevil.example"],
    ["encoded tab", "/%09/evil.example"],
    ["encoded newline", "/%0A/evil.example"],
    ["encoded CR LF", "/samples%0D%0ASet-Cookie:%20x=1"],
    ["double-encoded slashes", "/%252F%252Fevil.example"],
    ["double-encoded newline", "/%250A"],
    ["malformed percent-encoding", "/samples%E0%A4%A"],
    ["dot segment that resolves to //", "/.//evil.example"],
    ["userinfo trick", "//user@evil.example"],
    ["overlong", `/${"a".repeat(3000)}`],
    ["a number", 42],
    ["null", null],
    ["undefined", undefined],
    ["an array", ["/samples"]],
  ];
  test.each(hostile)("refuses %s and falls back to /", (_label, value) => {
    expect(safeRedirect(value)).toBe("/");
  });

  test("the fallback can be chosen", () => {
    expect(safeRedirect("//evil.example", "/samples")).toBe("/samples");
  });
});
