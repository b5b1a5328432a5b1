const URL_PATTERN = /https?:\/\/[^\s<>"'`]+/gi;
// Sentence punctuation right after a link belongs to the sentence, not the link.
const TRAILING_PUNCTUATION = /[.,;:!?)\]}]+$/;

export type TextPart = { kind: 'text' | 'url'; value: string };

/** Splits plain text into runs of text and http(s) URLs, in order. */
export function splitUrls(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    const url = match[0].replace(TRAILING_PUNCTUATION, '');
    if (start > last) parts.push({ kind: 'text', value: text.slice(last, start) });
    parts.push({ kind: 'url', value: url });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ kind: 'text', value: text.slice(last) });
  return parts;
}

/** All http(s) URLs in plain text, in order of appearance. */
export function findUrls(text: string): string[] {
  return splitUrls(text)
    .filter((part) => part.kind === 'url')
    .map((part) => part.value);
}

/** Replaces the few HTML entities that appear in generated hrefs with their characters. */
export function decodeEntities(value: string): string {
  return value.replace(/&(#x[0-9a-f]+|#\d+|amp|lt|gt|quot|apos);/gi, (whole, name: string) => {
    const lower = name.toLowerCase();
    if (lower.startsWith('#x')) return String.fromCodePoint(parseInt(lower.slice(2), 16));
    if (lower.startsWith('#')) return String.fromCodePoint(parseInt(lower.slice(1), 10));
    const named: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };
    return named[lower] ?? whole;
  });
}

/** The href targets of `<a>` tags in an HTML body, entity-decoded. */
export function findHrefs(html: string): string[] {
  const hrefs: string[] = [];
  for (const match of html.matchAll(/<a\b[^>]*?\shref\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s>]+))/gi)) {
    hrefs.push(decodeEntities(match[1] ?? match[2] ?? match[3] ?? ''));
  }
  return hrefs;
}
