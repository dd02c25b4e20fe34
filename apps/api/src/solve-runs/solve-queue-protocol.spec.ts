import { decodeValue, encodeValue } from './solve-queue-protocol';

describe('solve queue encoding', () => {
  it('keeps what JSON would lose, as a worker thread receives it (Node.js v8.serialize: the HTML structured clone algorithm)', () => {
    const value = {
      bound: -Infinity,
      gap: Infinity,
      missing: undefined,
      roster: [
        ['e', null],
        [null, 'n'],
      ],
      at: new Date('2031-03-03T06:00:00Z'),
      weights: new Map([['cover', 10]]),
    };
    const text = encodeValue(value);
    expect(typeof text).toBe('string');
    // JSON.stringify turns Infinity into null and drops undefined; the encoding does not.
    expect(JSON.parse(JSON.stringify(value)).gap).toBeNull();
    expect(decodeValue(text)).toEqual(value);
    expect(decodeValue<typeof value>(text).at.getTime()).toBe(value.at.getTime());
  });
});
