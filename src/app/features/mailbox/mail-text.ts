/** A piece of a mail's plain text: words, or a link. */
export type MailPart = { text: string } | { text: string; href: string };

const URL_PATTERN = /https?:\/\/[^\s<>"')]+/g;

/**
 * Splits mail text into text and links. A link to one of this app's own pages (invitation, password reset, a
 * design) is made relative, so that it opens in the app that is running here whatever host the server wrote.
 */
export function mailParts(text: string): MailPart[] {
  const parts: MailPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    const url = match[0].replace(/[.,;:]+$/, '');
    if (start > last) parts.push({ text: text.slice(last, start) });
    parts.push({ text: url, href: appHref(url) });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ text: text.slice(last) });
  return parts;
}

function appHref(url: string): string {
  try {
    const u = new URL(url);
    if (/^\/(invite|reset|designs|workspaces)(\/|$)/.test(u.pathname)) return u.pathname + u.search + u.hash;
  } catch {
    // not a URL after all: keep as written
  }
  return url;
}

export function isLink(part: MailPart): part is { text: string; href: string } {
  return 'href' in part;
}
