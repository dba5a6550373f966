import { testEnv } from './test-env.ts';

/** The fields of maildev's REST API (GET /api/email) that tests read. */
export interface CapturedEmail {
  id: string;
  subject: string;
  text?: string;
  html?: string;
  to: { address: string; name?: string }[];
  from: { address: string; name?: string }[];
}

export async function listEmails(): Promise<CapturedEmail[]> {
  const res = await fetch(`${testEnv.maildevApiUrl}/api/email`);
  if (!res.ok) throw new Error(`maildev answered ${res.status}`);
  return (await res.json()) as CapturedEmail[];
}

/** Polls maildev until a message to `address` matching `subject` arrives (SMTP is asynchronous). */
export async function waitForEmail(address: string, subject: RegExp, timeoutMs = 10_000): Promise<CapturedEmail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const found = (await listEmails()).find(
      (m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()) && subject.test(m.subject),
    );
    if (found) return found;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no e-mail to ${address} matching ${String(subject)} within ${timeoutMs} ms`);
}
