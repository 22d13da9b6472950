import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { CapturedMail } from '../../shared/api/dev';
import { parseMail } from './parse-mail';

/** Keeps memory bounded when a dev instance runs for days. */
const MAX_MAILS = 200;

export interface FakeSmtp {
  port: number;
  /** Newest first. */
  mails(): CapturedMail[];
  close(): Promise<void>;
}

/**
 * Starts an SMTP server on 127.0.0.1 that accepts every message and keeps it in memory, so sign-up and
 * password mails can be read at /api/dev/mails without a real mail service. Port 0 picks a free port.
 */
export async function startFakeSmtp(port: number): Promise<FakeSmtp> {
  const captured: CapturedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'Shedwright local mail catcher',
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        // The sender hears back only once the mail is in the list, so a test that sent one can read it.
        parseMail(Buffer.concat(chunks)).then(
          (mail) => {
            captured.unshift({
              id: randomUUID(),
              to: mail.to,
              subject: mail.subject,
              text: mail.text,
              ...(mail.html === undefined ? {} : { html: mail.html }),
              date: mail.date ?? new Date().toISOString(),
            });
            captured.length = Math.min(captured.length, MAX_MAILS);
            callback();
          },
          (error: Error) => callback(error),
        );
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
  return {
    port: (server.server.address() as AddressInfo).port,
    mails: () => captured.slice(),
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
