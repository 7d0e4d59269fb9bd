/** A run of mail text: plain words, or a web address to show as a link. */
export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

/** http(s) addresses up to whitespace or a character that cannot end one in prose. */
const URL_PATTERN = /https?:\/\/[^\s<>"'`]+/g;
/** Punctuation that ends a sentence rather than the address ("…/invitation/abc."). */
const TRAILING_PUNCTUATION = /[.,;:!?)\]}]+$/;

/**
 * Splits plain mail text into text and http(s) links, so a template can render links as <a>
 * without ever parsing the mail as HTML. Other schemes (javascript:, data:) stay plain text.
 */
export function linkify(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    const href = match[0].replace(TRAILING_PUNCTUATION, '');
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', text: href, href });
    last = start + href.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}
