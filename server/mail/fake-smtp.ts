import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { DataSource } from 'typeorm';
import { MailMessage } from './mail-message.entity.js';

/** The built-in fake SMTP server: listens on loopback only and keeps every message it receives. */
export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

/** Largest message accepted, bytes. */
const MAX_SIZE = 5 * 1024 * 1024;

export async function startFakeSmtp(ds: DataSource): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_SIZE,
    logger: false,
    onData(stream, _session, callback) {
      // The message is stored before the SMTP "250 OK", so a sent mail is in the outbox when send() resolves.
      simpleParser(stream)
        .then((parsed) =>
          ds.getRepository(MailMessage).insert({
            sender: addresses(parsed.from),
            recipients: addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          }),
        )
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}
