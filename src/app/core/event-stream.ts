/**
 * Server-sent events (the text/event-stream format) read from a growing text: the app reads the stream with
 * fetch through the API client, since EventSource cannot send the bearer token.
 */
export interface StreamEvent {
  event: string;
  data: string;
}

/**
 * The complete events at the start of `text` (each ends with a blank line) and how many characters they took;
 * the rest is an event still arriving. Comment lines (": ...") are skipped; several data lines join with "\n".
 */
export function parseEventStream(text: string): { events: StreamEvent[]; consumed: number } {
  const events: StreamEvent[] = [];
  let consumed = 0;
  const normal = text.replace(/\r\n?/g, '\n');
  for (;;) {
    const end = normal.indexOf('\n\n', consumed);
    if (end < 0) break;
    let event = 'message';
    const data: string[] = [];
    for (const line of normal.slice(consumed, end).split('\n')) {
      if (line === '' || line.startsWith(':')) continue;
      const colon = line.indexOf(':');
      const field = colon < 0 ? line : line.slice(0, colon);
      const value = colon < 0 ? '' : line.slice(colon + 1).replace(/^ /, '');
      if (field === 'event') event = value;
      else if (field === 'data') data.push(value);
    }
    if (data.length > 0) events.push({ event, data: data.join('\n') });
    consumed = end + 2;
  }
  return { events, consumed: text.includes('\r') ? consumedInOriginal(text, consumed) : consumed };
}

/** Maps a position in the text with CRLF turned into LF back to the original text. */
function consumedInOriginal(text: string, normalPosition: number): number {
  let n = 0;
  for (let k = 0; k < text.length; k++) {
    if (n === normalPosition) return k;
    if (text[k] === '\r' && text[k + 1] === '\n') k++;
    n++;
  }
  return text.length;
}
