import { SMTPServer } from 'smtp-server';
import type { AddressObject } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { EventEmitter } from 'node:events';
import type { Db } from '../db/knex';

// The local SMTP sink for development and tests: it listens on loopback only,
// accepts every message and stores it in the dev_mail table, where /dev/mail
// shows it. Nothing it receives goes anywhere else.

/** One message as the sink stored it. */
export interface CaughtMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface MailSink {
  url: string;
  /** Called with each message once it is stored (tests wait on this instead of sleeping); returns the unsubscribe function. */
  onMessage(listener: (message: CaughtMessage) => void): () => void;
  close(): Promise<void>;
}

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((o) => o.value.map((v) => v.address ?? '')).filter(Boolean);

export async function startMailSink(db: Db, port = 0): Promise<MailSink> {
  // mailparser is large; only a process that runs the sink loads it.
  const { simpleParser } = await import('mailparser');
  const events = new EventEmitter().setMaxListeners(0);
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const message: CaughtMessage = {
            to: addresses(mail.to).join(', '),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : '',
          };
          await db('dev_mail').insert({ to_addresses: message.to, from_address: addresses(mail.from)[0] ?? '', subject: message.subject, text_body: message.text, html_body: message.html });
          events.emit('message', message);
        })
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const { port: bound } = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${bound}`,
    onMessage(listener) {
      events.on('message', listener);
      return () => events.off('message', listener);
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
