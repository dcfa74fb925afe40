import { expect, test } from "vitest";
import { negotiateLookupFormat } from "./lookup";

// RFC 9110 §12.5.1: media ranges with q-values; `format` in the body wins over Accept.
test.each([
  [null, undefined, "points"],
  ["application/json", undefined, "points"],
  ["*/*", undefined, "points"],
  ["text/csv", undefined, "csv"],
  ["application/vnd.isopleth.columns+json", undefined, "columns"],
  ["text/csv;q=0.5, application/json", undefined, "points"],
  ["application/json;q=0.2, text/csv;q=0.9", undefined, "csv"],
  ["TEXT/CSV", undefined, "csv"],
  ["text/csv;q=0", undefined, "points"],
  ["text/html", undefined, "points"],
  ["text/csv", "columns", "columns"],
  ["text/csv", "points", "points"],
] as const)(
  "Accept %s with format %s answers %s",
  (accept, format, expected) => {
    expect(negotiateLookupFormat(accept, format)).toBe(expected);
  },
);
