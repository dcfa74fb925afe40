import { GuideBlocks, guideSections, Inline, type GuideBlock } from "./guide";

/**
 * "How to lay out the file": the guide's intro, then one folded section per heading. Before a preview is shown,
 * the sections about the layouts start open.
 */
export function UploadLayoutGuide({
  blocks,
  openLayouts,
}: {
  blocks: GuideBlock[];
  openLayouts: boolean;
}) {
  const { intro, sections } = guideSections(blocks);
  return (
    <section aria-labelledby="guide-heading" className="mt-10">
      <h2 id="guide-heading" className="text-lg font-semibold">
        How to lay out the file
      </h2>
      <div className="mt-2 max-w-4xl space-y-2">
        {intro.map((b, k) =>
          b.kind === "paragraph" ? (
            <p key={k} className="text-sm text-ink-muted">
              <Inline text={b.text} />
            </p>
          ) : null,
        )}
        {sections.map((s) => (
          <details
            key={s.title}
            className="rounded-lg border border-line bg-panel px-4 py-3"
            open={openLayouts && /layout/i.test(s.title)}
          >
            <summary className="cursor-pointer font-semibold">
              {s.title}
            </summary>
            <div className="mt-3">
              <GuideBlocks blocks={s.blocks} />
            </div>
          </details>
        ))}
      </div>
    </section>
  );
}
