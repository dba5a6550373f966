import nodemailer, { type Transporter } from 'nodemailer';

export interface SmtpSettings {
  host: string;
  port: number;
  from: string;
}

/** A nodemailer transport for the configured SMTP server (maildev on 127.0.0.1:1025 locally). */
export function createMailTransport(smtp: SmtpSettings): Transporter {
  return nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: false,
    // maildev offers no TLS; a real relay is configured with its own settings in production.
    ignoreTLS: smtp.host === '127.0.0.1' || smtp.host === 'localhost',
    // Bounded waits keep one send well inside the outbox's claim lease (outbox/dispatcher.ts);
    // nodemailer's own socket default is ten minutes.
    connectionTimeout: 5_000,
    greetingTimeout: 10_000,
    socketTimeout: 60_000,
  });
}
