/**
 * Where a link found in running text ends, by the GitHub Flavored Markdown rules for extended
 * autolinks: trailing ? ! . , : * _ ~ are punctuation, not link; a trailing ")" belongs to the link
 * only while it closes a "(" inside the link.
 */
export function trimLinkEnd(candidate: string): string {
  let url = candidate;
  for (;;) {
    const trimmed = url.replace(/[?!.,:*_~]+$/, '');
    if (trimmed.endsWith(')')) {
      const opens = (trimmed.match(/\(/g) ?? []).length;
      const closes = (trimmed.match(/\)/g) ?? []).length;
      if (closes > opens) {
        url = trimmed.slice(0, -1);
        continue;
      }
    }
    return trimmed;
  }
}

/** The web links in a message's plain-text body, in order of appearance, without duplicates. */
export function linksInText(text: string): string[] {
  const found = text.match(/https?:\/\/[^\s<>"]+/gi) ?? [];
  const cleaned = found.map(trimLinkEnd);
  return [...new Set(cleaned)].filter((url) => {
    try {
      const parsed = new URL(url);
      return parsed.protocol === 'http:' || parsed.protocol === 'https:';
    } catch {
      return false;
    }
  });
}

/**
 * The HTML body prepared for a sandboxed iframe: links open in a new browsing context (the sandbox
 * allows popups only), and a strict content policy stops scripts, forms and remote loads.
 */
export function sandboxDocument(html: string): string {
  const head =
    '<meta charset="utf-8">' +
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; img-src data:; style-src 'unsafe-inline'">` +
    '<base target="_blank">';
  if (/<head[^>]*>/i.test(html)) return html.replace(/<head[^>]*>/i, (match) => `${match}${head}`);
  return `<!doctype html><html><head>${head}</head><body>${html}</body></html>`;
}
