import { SMTPServer } from 'smtp-server';
import type { AddressObject } from 'mailparser';
import type { AddressInfo } from 'node:net';
import type { Db } from '../db/knex';

// The local SMTP sink for development and tests: it listens on loopback only,
// accepts every message and stores it in the dev_mail table, where /dev/mail
// shows it. Nothing it receives goes anywhere else.

export interface MailSink {
  url: string;
  close(): Promise<void>;
}

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((o) => o.value.map((v) => v.address ?? '')).filter(Boolean);

export async function startMailSink(db: Db, port = 0): Promise<MailSink> {
  // mailparser is large; only a process that runs the sink loads it.
  const { simpleParser } = await import('mailparser');
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) =>
          db('dev_mail').insert({
            to_addresses: addresses(mail.to).join(', '),
            from_address: addresses(mail.from)[0] ?? '',
            subject: mail.subject ?? '',
            text_body: mail.text ?? '',
            html_body: typeof mail.html === 'string' ? mail.html : '',
          }),
        )
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
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
