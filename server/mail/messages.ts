import type { Role } from '../../shared/api';
import type { OutgoingMail } from './mailer';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** Plain paragraphs plus one link, as text and as simple HTML. */
function compose(to: string, subject: string, paragraphs: string[], link: { label: string; url: string }): OutgoingMail {
  const text = [...paragraphs, `${link.label}: ${link.url}`, '-- Osmolane'].join('\n\n');
  const html = [
    ...paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    `<p><a href="${escapeHtml(link.url)}">${escapeHtml(link.label)}</a></p>`,
    `<p style="color:#666">Osmolane</p>`,
  ].join('\n');
  return { to, subject, text, html };
}

export function invitationMail(args: {
  to: string;
  inviter: string;
  workspace: string;
  role: Role;
  url: string;
  expiresAt: Date;
}): OutgoingMail {
  return compose(
    args.to,
    `${args.inviter} invited you to ${args.workspace} on Osmolane`,
    [
      `${args.inviter} invited you to the workspace "${args.workspace}" as ${args.role === 'owner' || args.role === 'editor' ? 'an' : 'a'} ${args.role}.`,
      `The link works once, until ${args.expiresAt.toUTCString()}. If you did not expect this, ignore the mail.`,
    ],
    { label: 'Accept the invitation', url: args.url },
  );
}

export function resetMail(args: { to: string; name: string; url: string; expiresAt: Date }): OutgoingMail {
  return compose(
    args.to,
    'Reset your Osmolane password',
    [
      `Hello ${args.name}, someone (we hope you) asked to reset the password of this Osmolane account.`,
      `The link works once, until ${args.expiresAt.toUTCString()}. Setting a new password signs the account out everywhere. If you did not ask, ignore the mail; the password stays as it is.`,
    ],
    { label: 'Choose a new password', url: args.url },
  );
}

export function reviewMail(args: {
  to: string;
  requester: string;
  design: string;
  workspace: string;
  version: number;
  revision: number | null;
  url: string;
}): OutgoingMail {
  const what = args.revision === null ? `version ${args.version}` : `version ${args.version}, latest revision ${args.revision}`;
  return compose(
    args.to,
    `In review: ${args.design}`,
    [`${args.requester} put the design "${args.design}" (${what}) of ${args.workspace} in review.`],
    { label: 'Open the design', url: args.url },
  );
}
