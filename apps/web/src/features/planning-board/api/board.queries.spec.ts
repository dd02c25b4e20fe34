import type { Page } from '@rotaplex/contracts';
import { parseEventBlocks, readAllPages } from './board.queries';

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

describe('reading every page of a list', () => {
  // A list served like the API's: 1-based pages of at most `size` items with the total count.
  const source = (items: number[], size: number) => {
    const asked: number[] = [];
    const fetchPage = async (page: number): Promise<Page<number>> => {
      asked.push(page);
      return {
        items: items.slice((page - 1) * size, page * size),
        total: items.length,
        page,
        pageSize: size,
      };
    };
    return { asked, fetchPage };
  };
  it('reads 250 people in three pages of 100, in order', async () => {
    const people = Array.from({ length: 250 }, (_, i) => i);
    const { asked, fetchPage } = source(people, 100);
    expect(await readAllPages(fetchPage)).toEqual(people);
    expect(asked).toEqual([1, 2, 3]);
  });
  it('stops after one page when everything fits, and on an empty list', async () => {
    const one = source([1, 2, 3], 100);
    expect(await readAllPages(one.fetchPage)).toEqual([1, 2, 3]);
    expect(one.asked).toEqual([1]);
    const none = source([], 100);
    expect(await readAllPages(none.fetchPage)).toEqual([]);
    expect(none.asked).toEqual([1]);
  });
  it('ends when a page comes back empty before the total is reached (the list shrank meanwhile)', async () => {
    const fetchPage = async (page: number): Promise<Page<number>> => ({
      items: page === 1 ? [1, 2] : [],
      total: 5,
      page,
      pageSize: 2,
    });
    expect(await readAllPages(fetchPage)).toEqual([1, 2]);
  });
});
