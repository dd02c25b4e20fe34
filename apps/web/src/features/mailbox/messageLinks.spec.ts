import { linksInText, sandboxDocument, trimLinkEnd } from './messageLinks';

// GitHub Flavored Markdown spec 0.29, section 6.9 "Autolinks (extension)": trailing punctuation
// and unbalanced closing parentheses are not part of a link. Examples from that section (from
// memory), written with "https://" in front, which the spec's extended URL autolinks share.
describe('links in a plain-text message', () => {
  it.each([
    ['https://www.commonmark.org.', 'https://www.commonmark.org'],
    ['https://www.commonmark.org/a.b.', 'https://www.commonmark.org/a.b'],
    [
      'https://www.google.com/search?q=Markup+(business)',
      'https://www.google.com/search?q=Markup+(business)',
    ],
    [
      'https://www.google.com/search?q=Markup+(business)))',
      'https://www.google.com/search?q=Markup+(business)',
    ],
    ['https://www.google.com/search?q=(business))+ok', 'https://www.google.com/search?q=(business))+ok'],
  ])('ends %s at the right place', (raw, expected) => {
    expect(trimLinkEnd(raw)).toBe(expected);
  });

  it('finds every link once, in order', () => {
    const text = [
      'You have been invited to Rotaplex.',
      'Set your password: http://127.0.0.1:4321/accept-invitation?token=abc_DEF-123.',
      'Help (https://example.org/help) and again http://127.0.0.1:4321/accept-invitation?token=abc_DEF-123',
    ].join('\n');
    expect(linksInText(text)).toEqual([
      'http://127.0.0.1:4321/accept-invitation?token=abc_DEF-123',
      'https://example.org/help',
    ]);
  });

  it('ignores schemes other than http and https', () => {
    expect(linksInText('javascript:alert(1) ftp://example.org mailto:a@example.org')).toEqual([]);
  });
});

describe('HTML shown in the sandbox', () => {
  it('opens links in a new tab and forbids scripts and remote loads', () => {
    const doc = sandboxDocument('<p><a href="https://example.org">x</a></p>');
    expect(doc).toContain('<base target="_blank">');
    expect(doc).toContain("default-src 'none'");
  });

  it('adds to an existing head instead of nesting documents', () => {
    const doc = sandboxDocument('<html><head><title>t</title></head><body>b</body></html>');
    expect(doc.match(/<head/g)).toHaveLength(1);
    expect(doc.indexOf('<base')).toBeLessThan(doc.indexOf('<title>'));
  });
});
