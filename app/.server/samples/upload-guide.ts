import readme from "~/core/lab-data/README.md?raw";
import type { GuideBlock } from "~/components/samples/guide";

/*
 * The upload page documents both layouts with the text of app/core/lab-data/README.md (the part above
 * "For developers"), so the page and the parser's documentation cannot drift apart. A small reader for the
 * Markdown that README uses: headings, paragraphs, bullet lists, tables and code blocks.
 */

function splitRow(line: string): string[] {
  const cells: string[] = [];
  let current = "";
  let inCode = false;
  const body = line.trim().replace(/^\|/, "").replace(/\|$/, "");
  for (const ch of body) {
    if (ch === "`") inCode = !inCode;
    if (ch === "|" && !inCode) {
      cells.push(current.trim());
      current = "";
    } else current += ch;
  }
  cells.push(current.trim());
  return cells;
}

export function parseGuide(markdown: string): GuideBlock[] {
  const userPart = markdown.split(/\n---\s*\n/)[0] ?? markdown;
  const lines = userPart.replace(/\r\n/g, "\n").split("\n");
  const blocks: GuideBlock[] = [];
  let i = 0;
  while (i < lines.length) {
    const line = lines[i]!;
    if (line.trim() === "") {
      i++;
    } else if (line.startsWith("```")) {
      const code: string[] = [];
      i++;
      while (i < lines.length && !lines[i]!.startsWith("```"))
        code.push(lines[i++]!);
      i++;
      blocks.push({ kind: "code", text: code.join("\n") });
    } else if (/^#{1,6} /.test(line)) {
      const level = line.match(/^#+/)![0].length;
      blocks.push({
        kind: "heading",
        level,
        text: line.slice(level + 1).trim(),
      });
      i++;
    } else if (line.trim().startsWith("|")) {
      const rows: string[][] = [];
      while (i < lines.length && lines[i]!.trim().startsWith("|")) {
        const cells = splitRow(lines[i]!);
        if (!cells.every((c) => /^:?-{2,}:?$/.test(c))) rows.push(cells);
        i++;
      }
      blocks.push({ kind: "table", head: rows[0] ?? [], rows: rows.slice(1) });
    } else if (/^[-*] /.test(line)) {
      const items: string[] = [];
      while (
        i < lines.length &&
        (/^[-*] /.test(lines[i]!) ||
          (/^ {2,}\S/.test(lines[i]!) && items.length > 0))
      ) {
        if (/^[-*] /.test(lines[i]!)) items.push(lines[i]!.slice(2).trim());
        else items[items.length - 1] += ` ${lines[i]!.trim()}`;
        i++;
      }
      blocks.push({ kind: "list", items });
    } else {
      const text: string[] = [];
      while (
        i < lines.length &&
        lines[i]!.trim() !== "" &&
        !/^(#{1,6} |```|[-*] |\|)/.test(lines[i]!)
      )
        text.push(lines[i++]!.trim());
      blocks.push({ kind: "paragraph", text: text.join(" ") });
    }
  }
  return blocks;
}

let cached: GuideBlock[] | undefined;

/** The README's user part as blocks, parsed once. */
export function uploadGuide(): GuideBlock[] {
  cached ??= parseGuide(readme);
  return cached;
}
