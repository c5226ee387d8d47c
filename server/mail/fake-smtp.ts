import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/client';
import { recordOutboxMessages } from '../services/dev/record-outbox-messages';

export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

/**
 * A real SMTP server on loopback that accepts every message and files it in the dev_outbox
 * table (development and test only; `GET /api/dev/outbox` reads it back).
 */
export async function startFakeSmtp(opts: { db: Db; port?: number; host?: string }): Promise<FakeSmtp> {
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Sixfold local mail fake; nothing leaves this machine',
    size: 5 * 1024 * 1024,
    async onData(stream, session, callback) {
      try {
        const parsed = await simpleParser(stream);
        const recipients = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        await recordOutboxMessages(opts.db, {
          recipients,
          from,
          subject: parsed.subject ?? '',
          text: parsed.text ?? '',
          html: typeof parsed.html === 'string' ? parsed.html : '',
        });
        callback();
      } catch (err) {
        callback(err instanceof Error ? err : new Error(String(err)));
      }
    },
  });
  const host = opts.host ?? '127.0.0.1';
  await new Promise<void>((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once('error', onError);
    server.listen(opts.port ?? 0, host, () => {
      server.off('error', onError);
      server.on('error', (err) => console.error('[mail] fake SMTP error:', err.message));
      resolve();
    });
  });
  const { port } = server.server.address() as AddressInfo;
  return {
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
