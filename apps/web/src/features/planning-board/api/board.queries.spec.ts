import { parseEventBlocks } from './board.queries';

// The event stream format of the WHATWG HTML Living Standard, "Server-sent events", section
// "Interpreting an event stream": blocks end at a blank line, lines starting with ':' are comments,
// one space after the colon is dropped, several data lines join with a newline, and an
// unfinished block waits for more text.
describe('server-sent event parsing', () => {
  it('reads named events, skips comments and keeps an unfinished block for later', () => {
    const seen: [string, string][] = [];
    const rest = parseEventBlocks(
      ': keep-alive\n\nevent: progress\ndata: {"elapsedSeconds":1}\n\ndata: a\ndata:b\n\nevent: end\ndata: {',
      (event, data) => seen.push([event, data]),
    );
    expect(seen).toEqual([
      ['progress', '{"elapsedSeconds":1}'],
      ['message', 'a\nb'],
    ]);
    expect(rest).toBe('event: end\ndata: {');
    parseEventBlocks(`${rest}}\r\n\r\n`, (event, data) => seen.push([event, data]));
    expect(seen[2]).toEqual(['end', '{}']);
  });
});
