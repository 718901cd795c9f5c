/** The development mailbox (not in production). */
import type { Timestamp } from './common';

export interface MailSummary {
  id: string;
  to: string[];
  subject: string;
  date: Timestamp;
}

export interface MailDetail extends MailSummary {
  from: string;
  text: string;
  html: string;
}
