/*
 * Where to send the browser after sign-in (the `redirectTo` form field and query parameter). Only same-origin
 * paths are followed, as OWASP's Unvalidated Redirects and Forwards Cheat Sheet advises: an allow-list of shape,
 * not a deny-list of hosts. Client-safe, so the sign-in page can clean the value it puts in its form too.
 */
const MAX_REDIRECT_LENGTH = 2048;
const PLACEHOLDER_ORIGIN = "http://redirect-check.invalid";
/** Visible ASCII only: no whitespace, no control characters (browsers strip tab, CR and LF inside URLs), no Unicode. */
const VISIBLE_ASCII = /^[\x21-\x7e]+$/;
const CONTROL = /\p{Cc}/u;

/** `to` when it is a path on this site ("/…", not "//…", no backslash, nothing a browser would rewrite), else `fallback`. */
export function safeRedirect(to: unknown, fallback = "/"): string {
  if (
    typeof to !== "string" ||
    to.length > MAX_REDIRECT_LENGTH ||
    !VISIBLE_ASCII.test(to)
  )
    return fallback;
  if (!isSitePath(to)) return fallback;
  // Percent-encoded variants (%2F%2F, %5C, %0A, double encoding) must not turn into one of the above either.
  let decoded = to;
  for (let round = 0; round < 3; round++) {
    let next: string;
    try {
      next = decodeURIComponent(decoded);
    } catch {
      return fallback;
    }
    if (next === decoded) break;
    if (CONTROL.test(next) || !isSitePath(next)) return fallback;
    decoded = next;
  }
  // Last, resolve it the way a browser does (WHATWG URL parsing, dot segments included) and check where it lands.
  const resolved = new URL(to, PLACEHOLDER_ORIGIN);
  if (
    resolved.origin !== PLACEHOLDER_ORIGIN ||
    resolved.pathname.startsWith("//")
  )
    return fallback;
  return to;
}

function isSitePath(path: string): boolean {
  return path.startsWith("/") && !path.startsWith("//") && !path.includes("\\");
}
