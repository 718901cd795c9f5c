import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Mailbox } from './mailbox';

export interface LocalSmtp {
  /** `smtp://127.0.0.1:<port>` for nodemailer. */
  url: string;
  close(): Promise<void>;
}

/**
 * A local SMTP server on loopback that accepts every message and keeps it in the mailbox: the stand-in for a
 * hosted mail service during development and tests. The message is in the mailbox before the client's send
 * completes, so a test can read it right after the request that sent it.
 */
export function startLocalSmtp(mailbox: Mailbox, port = 0): Promise<LocalSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    banner: 'Osmolane local mail stand-in',
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const html = typeof parsed.html === 'string' ? parsed.html : '';
          mailbox.add({
            to: session.envelope.rcptTo.map((r) => r.address),
            from: parsed.from?.text ?? '',
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html,
            date: (parsed.date ?? new Date()).toISOString(),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    const listening = server.listen(port, '127.0.0.1', () => {
      const { port: actual } = listening.address() as AddressInfo;
      resolve({
        url: `smtp://127.0.0.1:${actual}`,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
