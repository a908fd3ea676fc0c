// The frame every HTML mail shares: plain, readable in any mail program, no images, no remote parts.

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ESCAPES[c]!);

/** One block of an HTML mail: a paragraph, a list, or a link. Text is escaped here, never by the caller. */
export type Block = { p: string } | { list: string[] } | { link: { href: string; text: string } };

export function htmlMail(title: string, blocks: Block[]): string {
  const body = blocks
    .map((b) => {
      if ('p' in b) return `<p>${escapeHtml(b.p)}</p>`;
      if ('list' in b) return `<ul>${b.list.map((i) => `<li>${escapeHtml(i)}</li>`).join('')}</ul>`;
      return `<p><a href="${escapeHtml(b.link.href)}">${escapeHtml(b.link.text)}</a></p>`;
    })
    .join('\n');
  return `<!doctype html><html><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>` +
    `<body style="font-family: system-ui, sans-serif; color: #1d2731; line-height: 1.5">\n${body}\n</body></html>`;
}
