/*
 * Renders the upload guide (the user part of app/core/lab-data/README.md, parsed on the server into blocks).
 * Inline Markdown: **bold** and `code` only.
 */
export type GuideBlock =
  | { kind: "heading"; level: number; text: string }
  | { kind: "paragraph"; text: string }
  | { kind: "list"; items: string[] }
  | { kind: "table"; head: string[]; rows: string[][] }
  | { kind: "code"; text: string };

export function Inline({ text }: { text: string }) {
  const parts = text.split(/(`[^`]+`|\*\*[^*]+\*\*)/g).filter((p) => p !== "");
  return (
    <>
      {parts.map((p, k) =>
        p.startsWith("`") && p.endsWith("`") && p.length > 1 ? (
          <code
            key={k}
            className="rounded bg-surface px-1 font-mono text-[0.85em]"
          >
            {p.slice(1, -1)}
          </code>
        ) : p.startsWith("**") && p.endsWith("**") && p.length > 3 ? (
          <strong key={k}>{p.slice(2, -2)}</strong>
        ) : (
          <span key={k}>{p}</span>
        ),
      )}
    </>
  );
}

/** Splits the guide into its sections (level-2 headings); the title and the text before the first section form the intro. */
export function guideSections(blocks: GuideBlock[]): {
  intro: GuideBlock[];
  sections: { title: string; blocks: GuideBlock[] }[];
} {
  const intro: GuideBlock[] = [];
  const sections: { title: string; blocks: GuideBlock[] }[] = [];
  for (const b of blocks) {
    if (b.kind === "heading" && b.level === 1) continue;
    if (b.kind === "heading" && b.level === 2)
      sections.push({ title: b.text, blocks: [] });
    else if (sections.length > 0) sections[sections.length - 1]!.blocks.push(b);
    else intro.push(b);
  }
  return { intro, sections };
}

export function GuideBlocks({ blocks }: { blocks: GuideBlock[] }) {
  return (
    <div className="space-y-3 text-sm">
      {blocks.map((b, k) => {
        switch (b.kind) {
          case "heading":
            return (
              <h4 key={k} className="font-semibold">
                <Inline text={b.text} />
              </h4>
            );
          case "paragraph":
            return (
              <p key={k}>
                <Inline text={b.text} />
              </p>
            );
          case "list":
            return (
              <ul key={k} className="list-disc space-y-1 pl-5">
                {b.items.map((item, j) => (
                  <li key={j}>
                    <Inline text={item} />
                  </li>
                ))}
              </ul>
            );
          case "code":
            return (
              <pre
                key={k}
                className="relative overflow-x-auto rounded border border-line bg-surface p-3 font-mono text-xs leading-relaxed"
              >
                {b.text}
              </pre>
            );
          case "table":
            return (
              <div
                key={k}
                className="relative overflow-x-auto rounded border border-line"
              >
                <table className="w-full text-left text-xs">
                  <thead className="bg-surface">
                    <tr>
                      {b.head.map((h, j) => (
                        <th
                          key={j}
                          scope="col"
                          className="px-2 py-1.5 font-semibold"
                        >
                          <Inline text={h} />
                        </th>
                      ))}
                    </tr>
                  </thead>
                  <tbody>
                    {b.rows.map((row, j) => (
                      <tr key={j} className="border-t border-line align-top">
                        {row.map((cell, c) => (
                          <td key={c} className="px-2 py-1.5">
                            <Inline text={cell} />
                          </td>
                        ))}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            );
        }
      })}
    </div>
  );
}
