const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) =>
      ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[
        c
      ]!,
  );

/** Wraps paragraphs and one call-to-action link into the plain-text and HTML bodies of a message. */
export function renderMessage(
  paragraphs: string[],
  link: { label: string; url: string },
  footer: string,
) {
  const text = [...paragraphs, `${link.label}: ${link.url}`, footer].join(
    "\n\n",
  );
  const html = `<!doctype html><html><body style="font-family: sans-serif; color: #1c2733; line-height: 1.5">
${paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join("\n")}
<p><a href="${escapeHtml(link.url)}" style="color: #0f6e6a; font-weight: 600">${escapeHtml(link.label)}</a></p>
<p style="color: #55636f; font-size: 0.9em">${escapeHtml(footer)}</p>
</body></html>`;
  return { text, html };
}
