const textUrlPattern = /https?:\/\/[^\s<>"'`]+/gi;
const hrefPattern = /\bhref\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s>]+))/gi;

const namedEntities: Record<string, string> = { amp: '&', quot: '"', apos: "'", lt: '<', gt: '>' };

function decodeEntities(value: string): string {
  return value.replace(/&(#x[0-9a-f]+|#[0-9]+|[a-z]+);/gi, (whole, entity: string) => {
    if (entity.startsWith('#x') || entity.startsWith('#X'))
      return String.fromCodePoint(Number.parseInt(entity.slice(2), 16));
    if (entity.startsWith('#')) return String.fromCodePoint(Number.parseInt(entity.slice(1), 10));
    return namedEntities[entity.toLowerCase()] ?? whole;
  });
}

// A sentence ending in a link ("... at https://x/y.") must not carry its full stop into the link.
function trimTrailingPunctuation(url: string): string {
  let trimmed = url.replace(/[.,;:!?]+$/, '');
  for (const [open, close] of [
    ['(', ')'],
    ['[', ']'],
  ] as const) {
    while (trimmed.endsWith(close) && trimmed.split(close).length > trimmed.split(open).length) {
      trimmed = trimmed.slice(0, -1).replace(/[.,;:!?]+$/, '');
    }
  }
  return trimmed;
}

/** Every http(s) URL in the text body and in the HTML body's hrefs, first appearance first, no repeats. */
export function extractLinks(text: string, html: string | null): string[] {
  const found: string[] = [];
  for (const match of text.matchAll(textUrlPattern)) found.push(trimTrailingPunctuation(match[0]));
  if (html !== null) {
    for (const match of html.matchAll(hrefPattern)) {
      const href = decodeEntities(match[1] ?? match[2] ?? match[3] ?? '').trim();
      if (/^https?:\/\//i.test(href)) found.push(href);
    }
  }
  return [...new Set(found.filter((url) => url.length > 'https://'.length))];
}
