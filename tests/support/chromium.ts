/**
 * Debian's Chromium as Playwright drives it (tests and scripts/bench-surface.ts): never a downloaded browser.
 * The background-networking flags keep it from calling out of this closed network.
 */
export const CHROMIUM_PATH = "/usr/lib/chromium/chromium";
export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--enable-unsafe-swiftshader",
];
