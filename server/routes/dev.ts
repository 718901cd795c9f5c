import { ApiError } from '../errors';
import type { Mailbox } from '../mail/mailbox';
import type { ApiRoutes } from './define';

/** Development only (never in production): the mail the local SMTP stand-in captured. */
export function devRoutes(api: ApiRoutes, mailbox: Mailbox): void {
  api.open('get', '/dev/mailbox', (_req, res) => {
    res.json(mailbox.list());
  });

  api.open('get', '/dev/mailbox/:id', (req, res) => {
    const mail = mailbox.get(String(req.params['id']));
    if (!mail) throw new ApiError('not-found', 'No such mail in the mailbox');
    res.json(mail);
  });
}
