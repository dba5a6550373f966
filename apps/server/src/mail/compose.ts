/**
 * One message in both forms every Biasproof e-mail carries: plain text and HTML built from the
 * same parts, so the two never say different things. Text is escaped for HTML here; callers
 * pass plain strings.
 */
export interface MailParts {
  /** e.g. `Hello Ada Marsh,` */
  greeting: string;
  /** Paragraphs; a paragraph that is an array is a bulleted list. */
  paragraphs: (string | string[])[];
  /** The one link the message is about, with the words on its button. */
  link: { url: string; label: string };
  /** Small print under the link. */
  footer?: string;
}

const escapeHtml = (s: string) =>
  s
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');

export function composeMail(parts: MailParts): { text: string; html: string } {
  const textBlocks = [
    parts.greeting,
    ...parts.paragraphs.map((p) => (Array.isArray(p) ? p.map((i) => `- ${i}`).join('\n') : p)),
    `${parts.link.label}: ${parts.link.url}`,
    ...(parts.footer ? [parts.footer] : []),
  ];
  const htmlBlocks = [
    `<p>${escapeHtml(parts.greeting)}</p>`,
    ...parts.paragraphs.map((p) =>
      Array.isArray(p)
        ? `<ul>${p.map((i) => `<li>${escapeHtml(i)}</li>`).join('')}</ul>`
        : `<p>${escapeHtml(p)}</p>`,
    ),
    `<p><a href="${escapeHtml(parts.link.url)}">${escapeHtml(parts.link.label)}</a></p>`,
    ...(parts.footer ? [`<p><small>${escapeHtml(parts.footer)}</small></p>`] : []),
  ];
  return {
    text: textBlocks.join('\n\n') + '\n',
    html: `<!doctype html><html><body style="font-family:sans-serif">${htmlBlocks.join('')}</body></html>`,
  };
}
