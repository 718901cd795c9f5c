import type { ServerConfig } from '../config';
import { startLocalSmtp } from './local-smtp';
import { Mailbox } from './mailbox';
import { Mailer } from './mailer';

export interface MailSystem {
  mailer: Mailer;
  mailbox: Mailbox;
  /** Where mail goes: the configured SMTP server, or the local stand-in's address. */
  smtpUrl: string;
  /** Waits for mail still being sent, then stops the transport and the local stand-in. */
  close(): Promise<void>;
}

/** Mail through SMTP_URL when set; otherwise through a local SMTP stand-in on loopback that keeps what it gets. */
export async function startMail(config: ServerConfig): Promise<MailSystem> {
  const mailbox = new Mailbox();
  const local = config.smtpUrl ? null : await startLocalSmtp(mailbox);
  const smtpUrl = config.smtpUrl ?? local!.url;
  const mailer = Mailer.smtp(smtpUrl, config.mailFrom);
  return {
    mailer,
    mailbox,
    smtpUrl,
    async close() {
      await mailer.idle();
      mailer.close();
      await local?.close();
    },
  };
}
