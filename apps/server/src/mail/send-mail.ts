import type { Transporter } from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /**
   * A key naming this message for good (the outbox row's id). The Message-ID is made from it,
   * so sending the message again gives the same Message-ID: a recognizable copy, not a new
   * message. Without it the transport makes a random one.
   */
  stableKey?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<{ messageId: string }>;
}

/** The domain of the sender's address, which Message-IDs end in (RFC 5322 §3.6.4). */
export function senderDomain(from: string): string {
  const address = /<([^>]+)>/.exec(from)?.[1] ?? from;
  return address.split('@')[1]?.trim() || 'biasproof.invalid';
}

export function messageIdFor(stableKey: string, from: string): string {
  return `<${stableKey}@${senderDomain(from)}>`;
}

/** Wraps a transport so the rest of the server only knows `send`. */
export function createMailer(transport: Transporter, from: string): Mailer {
  return {
    async send({ stableKey, ...mail }) {
      const info = (await transport.sendMail({
        from,
        ...mail,
        ...(stableKey ? { messageId: messageIdFor(stableKey, from) } : {}),
      })) as { messageId: string };
      return { messageId: info.messageId };
    },
  };
}
