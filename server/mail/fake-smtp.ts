// A local SMTP server that keeps every message it receives, for development, demos and tests.
// Each message is written to <dataDir>/mail/<id>.eml with a small JSON index beside it, so the
// admin mail page (and a test) can read what the product sent without a real mail server.
import { randomUUID } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { MailMessage, MailSummary } from '../../shared/api/workspaces';
import { makePrivate, privateDir, writePrivateFile } from '../private-files';

/** A message as received, every link in it intact. */
export type ReceivedMail = Omit<MailMessage, 'hiddenLinks'>;

export interface FakeSmtp {
  port: number;
  /** Newest first. */
  list(): MailSummary[];
  get(id: string): Promise<ReceivedMail | null>;
  close(): Promise<void>;
}

// A message larger than this is refused; the product only sends short notices.
const maxMessageBytes = 5 * 1024 * 1024;

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  if (!field) return [];
  const groups = Array.isArray(field) ? field : [field];
  return groups.flatMap((g) => g.value.map((a) => a.address ?? a.name)).filter((a) => a !== '');
}

export async function startFakeSmtp(dataDir: string, port = 0): Promise<FakeSmtp> {
  // Messages hold single-use links: the folder and its files are the server user's only.
  const mailDir = path.join(dataDir, 'mail');
  privateDir(mailDir);
  const indexFile = path.join(mailDir, 'index.json');
  makePrivate(...readdirSync(mailDir).map((name) => path.join(mailDir, name)));
  const index: MailSummary[] = existsSync(indexFile) ? (JSON.parse(readFileSync(indexFile, 'utf8')) as MailSummary[]) : [];

  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: maxMessageBytes,
    logger: false,
    banner: 'Eclipta local mail catcher',
    // Close() waits for open connections; ours are short-lived, so don't hold shutdown for 30 s.
    closeTimeout: 1000,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', (err: Error) => callback(err));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks);
        const id = randomUUID();
        simpleParser(raw)
          .then((parsed) => {
            writePrivateFile(path.join(mailDir, `${id}.eml`), raw);
            const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
            index.unshift({
              id,
              receivedAt: new Date().toISOString(),
              from: addresses(parsed.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
              to: envelopeTo.length > 0 ? envelopeTo : addresses(parsed.to),
              subject: parsed.subject ?? '',
            });
            writePrivateFile(indexFile, JSON.stringify(index, null, 1));
            // Answering only after the write means a sender that awaited sendMail finds the message.
            callback();
          })
          .catch((err: unknown) => callback(err instanceof Error ? err : new Error(String(err))));
      });
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  // smtp-server reports socket errors as events; without a listener they would crash the process.
  server.on('error', () => undefined);
  const address = server.server.address() as AddressInfo;

  return {
    port: address.port,
    list: () => index.map((m) => ({ ...m, to: [...m.to] })),
    async get(id) {
      const summary = index.find((m) => m.id === id);
      if (!summary) return null;
      const parsed = await simpleParser(readFileSync(path.join(mailDir, `${id}.eml`)));
      return { ...summary, text: parsed.text ?? '', html: typeof parsed.html === 'string' ? parsed.html : null };
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
