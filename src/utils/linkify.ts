export type TextPiece = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
// Sentence punctuation right after a link belongs to the sentence, not the address.
const TRAILING = /[.,;:!?)\]]+$/;

/** Splits plain text into text and http(s) link pieces, so links render as anchors without v-html. */
export function linkify(text: string): TextPiece[] {
  const pieces: TextPiece[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    const raw = match[0];
    const href = raw.replace(TRAILING, '');
    if (start > last) pieces.push({ kind: 'text', text: text.slice(last, start) });
    pieces.push({ kind: 'link', text: href, href });
    last = start + href.length;
  }
  if (last < text.length) pieces.push({ kind: 'text', text: text.slice(last) });
  return pieces;
}

/** Links to this app stay in the tab; anything else opens apart from it. */
export function isSameOrigin(href: string): boolean {
  try {
    return new URL(href, window.location.href).origin === window.location.origin;
  } catch {
    return false;
  }
}
