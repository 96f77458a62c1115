// Sends the product's mail through nodemailer: to SMTP_URL when set, otherwise to the local fake
// SMTP server, whose inbox the admin mail routes read.
import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';
import type { Logger } from '../logger';
import { startFakeSmtp, type FakeSmtp } from './fake-smtp';

export const mailFrom = 'Eclipta <no-reply@eclipta.local>';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  /** The fake server's inbox, or null when mail goes to a real SMTP server. */
  inbox: FakeSmtp | null;
  close(): Promise<void>;
}

export function createMailer(transport: Transporter, inbox: FakeSmtp | null, logger: Logger): Mailer {
  return {
    inbox,
    async send(mail) {
      await transport.sendMail({ from: mailFrom, ...mail });
      // The subject is logged, never the body: bodies hold single-use links.
      logger.info('mail sent', { to: mail.to, subject: mail.subject });
    },
    async close() {
      transport.close();
      if (inbox) await inbox.close();
    },
  };
}

export async function startMailer(config: Config, logger: Logger): Promise<Mailer> {
  if (config.smtpUrl) {
    return createMailer(nodemailer.createTransport(config.smtpUrl), null, logger);
  }
  const inbox = await startFakeSmtp(config.dataDir, config.fakeSmtpPort);
  logger.info('fake SMTP server started', { port: inbox.port, folder: 'mail/' });
  const transport = nodemailer.createTransport({
    host: '127.0.0.1',
    port: inbox.port,
    secure: false,
    ignoreTLS: true,
  });
  return createMailer(transport, inbox, logger);
}
