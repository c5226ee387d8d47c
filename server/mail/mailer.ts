import nodemailer, { type Transporter } from 'nodemailer';
import type { Env } from '../env';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/** Sends one e-mail; the app only knows this interface, so tests and fakes can stand in. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
}

/** A mailer that speaks SMTP through nodemailer (to the local fake in development and test). */
export function createSmtpMailer(opts: {
  host: string;
  port: number | (() => Promise<number>);
  secure?: boolean;
  user?: string;
  pass?: string;
  from: string;
}): Mailer {
  let transport: Transporter | undefined;
  const local = opts.host === '127.0.0.1' || opts.host === 'localhost' || opts.host === '::1';
  async function getTransport() {
    if (transport) return transport;
    const port = typeof opts.port === 'function' ? await opts.port() : opts.port;
    transport = nodemailer.createTransport({
      host: opts.host,
      port,
      secure: opts.secure ?? false,
      // The loopback fake offers no TLS; a real relay must.
      ignoreTLS: local && !opts.secure,
      requireTLS: !local && !opts.secure,
      auth: opts.user && opts.pass ? { user: opts.user, pass: opts.pass } : undefined,
      connectionTimeout: 10_000,
    });
    return transport;
  }
  return {
    async send(message) {
      const t = await getTransport();
      await t.sendMail({ from: opts.from, ...message });
    },
  };
}

export function mailerFromEnv(env: Env): Mailer {
  return createSmtpMailer({
    host: env.SMTP_HOST ?? '127.0.0.1',
    // the mail-submission port (RFC 6409) when a relay is named without one
    port: env.SMTP_PORT ?? 587,
    secure: env.SMTP_SECURE === '1',
    user: env.SMTP_USER,
    pass: env.SMTP_PASS,
    from: env.MAIL_FROM,
  });
}
