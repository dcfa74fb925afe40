import { expect, test } from "vitest";
import readme from "./README.md?raw";
import { RULES } from "./qc/rules";
import { parseText, datasetOf } from "./uploads.test-helpers";
import { runQc } from "./qc/run-qc";

// README.md is shown on the upload page: it must list every QC rule with the source given in the code, and
// its layout examples must read as documented.

test("the README lists every QC rule with the same source as the code", () => {
  for (const [id, rule] of Object.entries(RULES)) {
    const line = readme.split("\n").find((l) => l.startsWith(`| \`${id}\``));
    expect(line, id).toBeDefined();
    const cells = line?.split("|").map((cell) => cell.trim());
    expect(cells?.at(-2), id).toBe(rule.source);
  }
});

test("the README's long and grid examples read, and pass QC", async () => {
  const blocks = [...readme.matchAll(/```\n([\s\S]*?)```/g)].map(
    (m) => m[1] ?? "",
  );
  expect(blocks).toHaveLength(2);
  const [long, grid] = blocks;
  const a = datasetOf(await parseText("long.csv", long ?? ""));
  expect(a.file?.layout).toBe("long");
  expect(runQc(a).filter((f) => f.severity !== "info")).toEqual([]);
  const b = datasetOf(await parseText("grid.csv", grid ?? ""));
  expect(b.file?.layout).toBe("grid");
  expect(b.bubblePoints.map((x) => x.pressure)).toEqual([2400, 2635]);
  expect(runQc(b).filter((f) => f.severity !== "info")).toEqual([]);
});
