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

/** Polls maildev until a message to `address` satisfies `matches` (SMTP is asynchronous). */
export async function waitForEmailWhere(
  address: string,
  matches: (mail: CapturedEmail) => boolean,
  timeoutMs = 10_000,
): Promise<CapturedEmail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const found = (await listEmails()).find(
      (m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()) && matches(m),
    );
    if (found) return found;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no matching e-mail to ${address} within ${timeoutMs} ms`);
}

/** Polls maildev until a message to `address` matching `subject` arrives. */
export async function waitForEmail(
  address: string,
  subject: RegExp,
  timeoutMs = 10_000,
): Promise<CapturedEmail> {
  return waitForEmailWhere(address, (m) => subject.test(m.subject), timeoutMs);
}
