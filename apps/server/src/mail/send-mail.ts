import type { Transporter } from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<{ messageId: string }>;
}

/** Wraps a transport so the rest of the server only knows `send`. */
export function createMailer(transport: Transporter, from: string): Mailer {
  return {
    async send(mail) {
      const info = (await transport.sendMail({ from, ...mail })) as { messageId: string };
      return { messageId: info.messageId };
    },
  };
}
