import type { MailDetail, MailSummary } from '../../shared/api';

/** Mail captured by the local SMTP stand-in, newest first, kept in memory (the last `capacity` messages). */
export class Mailbox {
  private readonly mails: MailDetail[] = [];
  private next = 1;

  constructor(private readonly capacity = 500) {}

  add(mail: Omit<MailDetail, 'id'>): MailDetail {
    const stored: MailDetail = { id: String(this.next++), ...mail };
    this.mails.unshift(stored);
    if (this.mails.length > this.capacity) this.mails.length = this.capacity;
    return stored;
  }

  list(): MailSummary[] {
    return this.mails.map(({ id, to, subject, date }) => ({ id, to, subject, date }));
  }

  get(id: string): MailDetail | undefined {
    return this.mails.find((m) => m.id === id);
  }
}
