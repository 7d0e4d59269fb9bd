import nodemailer, { type Transporter } from 'nodemailer';
import type { DataSource } from 'typeorm';
import { startFakeSmtp, type FakeSmtp } from './fake-smtp.js';

/** One outgoing message. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Sends mail through nodemailer; with no SMTP URL, to the built-in fake server. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  /** Whether mail is caught by the built-in fake server (and so shown on the outbox page). */
  readonly catching: boolean;
  close(): Promise<void>;
}

/** Starts the mailer: a transport to `smtpUrl`, or a fake SMTP server on loopback that stores what it gets. */
export async function startMailer(ds: DataSource, smtpUrl: string | null, from: string): Promise<Mailer> {
  let fake: FakeSmtp | null = null;
  let transport: Transporter;
  if (smtpUrl) {
    transport = nodemailer.createTransport(smtpUrl);
  } else {
    fake = await startFakeSmtp(ds);
    transport = nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, secure: false, ignoreTLS: true });
  }
  return {
    catching: fake !== null,
    async send(mail) {
      await transport.sendMail({ from, ...mail });
    },
    async close() {
      transport.close();
      await fake?.close();
    },
  };
}
