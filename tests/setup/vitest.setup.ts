import { afterEach, beforeEach, vi } from "vitest";

// A console.error during a test is a failure: it means something went wrong that the test did not expect.
let consoleError: ReturnType<typeof vi.spyOn>;
beforeEach(() => {
  consoleError = vi
    .spyOn(console, "error")
    .mockImplementation((...args: unknown[]) => {
      throw new Error(`console.error called: ${args.map(String).join(" ")}`);
    });
});
afterEach(() => {
  consoleError.mockRestore();
});
