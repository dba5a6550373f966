/**
 * One message in both forms every Biasproof e-mail carries: plain text and HTML built from the
 * same parts, so the two never say different things. Text is escaped for HTML here; callers
 * pass plain strings.
 */
export interface MailLink {
  url: string;
  /** The words of the link (in text: `label: url`). */
  label: string;
}

export interface MailParts {
  /** e.g. `Hello Ada Marsh,` */
  greeting: string;
  /** Paragraphs; a paragraph that is an array is a bulleted list, whose items may be links. */
  paragraphs: (string | (string | MailLink)[])[];
  /** The one link the message is about, shown as a button. */
  link?: MailLink;
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

/** Only web links become anchors; anything else (javascript:, data:) stays visible text. */
const isWebUrl = (url: string) => /^https?:\/\//i.test(url);

function htmlLink(link: MailLink, style = ''): string {
  if (!isWebUrl(link.url)) return `${escapeHtml(link.label)}: ${escapeHtml(link.url)}`;
  return `<a href="${escapeHtml(link.url)}"${style ? ` style="${style}"` : ''}>${escapeHtml(link.label)}</a>`;
}

const textItem = (i: string | MailLink) => (typeof i === 'string' ? i : `${i.label}: ${i.url}`);
const htmlItem = (i: string | MailLink) => (typeof i === 'string' ? escapeHtml(i) : htmlLink(i));

const BUTTON =
  'display:inline-block;padding:8px 16px;background:#1d4ed8;color:#ffffff;border-radius:4px;text-decoration:none';

export function composeMail(parts: MailParts): { text: string; html: string } {
  const textBlocks = [
    parts.greeting,
    ...parts.paragraphs.map((p) =>
      Array.isArray(p) ? p.map((i) => `- ${textItem(i)}`).join('\n') : p,
    ),
    ...(parts.link ? [`${parts.link.label}: ${parts.link.url}`] : []),
    ...(parts.footer ? [parts.footer] : []),
  ];
  const htmlBlocks = [
    `<p>${escapeHtml(parts.greeting)}</p>`,
    ...parts.paragraphs.map((p) =>
      Array.isArray(p)
        ? `<ul>${p.map((i) => `<li>${htmlItem(i)}</li>`).join('')}</ul>`
        : `<p>${escapeHtml(p)}</p>`,
    ),
    ...(parts.link ? [`<p>${htmlLink(parts.link, BUTTON)}</p>`] : []),
    ...(parts.footer
      ? [`<p style="color:#555555;font-size:12px">${escapeHtml(parts.footer)}</p>`]
      : []),
  ];
  return {
    text: textBlocks.join('\n\n') + '\n',
    html:
      '<!doctype html><html lang="en"><head><meta charset="utf-8"></head>' +
      '<body style="font-family:sans-serif;line-height:1.4">' +
      `<div style="max-width:600px">${htmlBlocks.join('')}</div></body></html>`,
  };
}
