import { parseEventStream } from './event-stream';

describe('parseEventStream', () => {
  it('reads complete events, skips comments and leaves a partial event for later', () => {
    const text = 'event: snapshot\ndata: {"a":1}\n\n: still here\n\nevent: point\ndata: {"b"';
    const { events, consumed } = parseEventStream(text);
    expect(events).toEqual([{ event: 'snapshot', data: '{"a":1}' }]);
    expect(text.slice(consumed)).toBe('event: point\ndata: {"b"');
    const more = parseEventStream(text.slice(consumed) + ':2}\n\n');
    expect(more.events).toEqual([{ event: 'point', data: '{"b":2}' }]);
  });

  it('joins data lines, defaults the event name and reads CRLF streams', () => {
    expect(parseEventStream('data: one\ndata: two\n\n').events).toEqual([{ event: 'message', data: 'one\ntwo' }]);
    const crlf = 'event: x\r\ndata: 1\r\n\r\nevent: y\r\n';
    const r = parseEventStream(crlf);
    expect(r.events).toEqual([{ event: 'x', data: '1' }]);
    expect(crlf.slice(r.consumed)).toBe('event: y\r\n');
  });
});
