import { jsonDepthExceeds } from './body-limits';

const depth = (text: string, max: number) => jsonDepthExceeds(Buffer.from(text, 'utf8'), max);

describe('jsonDepthExceeds', () => {
  it('counts nested arrays and objects', () => {
    expect(depth('{"a":[{"b":[]}]}', 4)).toBe(false);
    expect(depth('{"a":[{"b":[[]]}]}', 4)).toBe(true);
    expect(depth('[[[[[]]]]]', 4)).toBe(true);
    expect(depth('[][][][][]', 1)).toBe(false); // siblings do not add up
  });

  it('ignores brackets inside strings, escaped quotes included', () => {
    expect(depth('{"a":"[[[[{{{{"}', 1)).toBe(false);
    expect(depth('{"a":"say \\"[[[[\\" twice","b":"\\\\"}', 1)).toBe(false);
    expect(depth('{"a":"\\\\","b":[[]]}', 2)).toBe(true); // an escaped backslash ends before the quote
    expect(depth('{"naïve ✓":"[[["}', 1)).toBe(false); // multi-byte UTF-8 never holds a bracket byte
  });
});
