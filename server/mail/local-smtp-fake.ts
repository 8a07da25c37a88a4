import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/database';
import { insertOutboxMessage } from '../db/repositories/outbox';

export interface LocalSmtpFake {
  port: number;
  close(): Promise<void>;
}

const addressText = (a: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(a) ? a : a ? [a] : []).map((x) => x.text).join(', ');

/**
 * A real SMTP server on loopback that keeps every mail in SQLite, so the app sends over real
 * SMTP in development and tests without an outside mail service.
 */
export async function startLocalSmtpFake(db: Db, port = 0): Promise<LocalSmtpFake> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Falsetrace local mail fake',
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          await insertOutboxMessage(db, {
            to_addr: addressText(mail.to),
            from_addr: addressText(mail.from),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : '',
            created_at: new Date().toISOString(),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: boundPort,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
