/** The fields of maildev's REST API (`GET /api/email`) that tests read. */
export interface CapturedEmail {
  id: string;
  subject: string;
  text?: string;
  to: { address: string }[];
}

function maildevUrl(): string {
  const url = process.env.MAILDEV_API_URL;
  if (!url) throw new Error('MAILDEV_API_URL is not set: run browser tests through `npm test`');
  return url;
}

/** Polls maildev until a message to `address` whose subject matches arrives (SMTP is asynchronous). */
export async function waitForEmail(
  address: string,
  subject: RegExp,
  timeoutMs = 15_000,
): Promise<CapturedEmail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const res = await fetch(`${maildevUrl()}/api/email`);
    if (!res.ok) throw new Error(`maildev answered ${res.status}`);
    const found = ((await res.json()) as CapturedEmail[]).find(
      (m) =>
        m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()) &&
        subject.test(m.subject),
    );
    if (found) return found;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no e-mail to ${address} matching ${String(subject)} within ${timeoutMs} ms`);
}

/** The first link in a message's text whose path matches `path`. */
export function linkIn(message: CapturedEmail, path: RegExp): URL {
  const link = (message.text ?? '')
    .match(/https?:\/\/\S+/g)
    ?.map((l) => new URL(l))
    .find((u) => path.test(u.pathname));
  if (!link) throw new Error(`no link matching ${String(path)} in "${message.subject}"`);
  return link;
}
