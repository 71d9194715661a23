/**
 * Turning names people typed into text a C compiler takes without a warning, whatever they hold. C99 reads
 * trigraphs (??/ is a backslash) and joins a line ending in a backslash to the next before it sees comments or
 * strings (5.1.1.2, phases 1–2), so those are broken up as well as the comment and string delimiters.
 */

/** Longest name kept in a comment; C99 5.2.4.1 only promises 4095 characters per logical line. */
const COMMENT_NAME_MAX = 160;
/** Longest string kept in a literal, in characters (≤ 4 bytes each, ≤ 4 escape characters per byte). */
const STRING_MAX = 250;

/**
 * One line of text that stays inside a block comment: diacritics dropped, anything outside printable ASCII and
 * every backslash shown as '?', no two '?' adjacent (no trigraph), no slash-star or star-slash, at most 160
 * characters. The caller puts it between characters other than '/' and '*'.
 */
export function commentText(name: string): string {
  let text = name.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').replace(/[^\x20-\x5b\x5d-\x7e]/gu, '?');
  if (text.length > COMMENT_NAME_MAX) text = `${text.slice(0, COMMENT_NAME_MAX - 3)}...`;
  text = text.replace(/\?(?=\?)/g, '? ');
  while (/\/\*|\*\//.test(text)) text = text.replace(/\/\*/g, '/ *').replace(/\*\//g, '* /');
  return text;
}

/**
 * A C string literal holding the UTF-8 bytes of the text: quote, backslash and '?' escaped (so no trigraph), other
 * bytes outside printable ASCII as three-digit octal escapes (which, unlike hex escapes, cannot swallow a following
 * digit). At most 250 characters are kept, well inside the 4095 a C99 compiler must accept.
 */
export function stringLiteral(text: string): string {
  const kept = [...text].slice(0, STRING_MAX).join('');
  let out = '';
  for (const byte of Buffer.from(kept, 'utf8')) {
    if (byte === 0x22 || byte === 0x5c || byte === 0x3f) out += `\\${String.fromCharCode(byte)}`;
    else if (byte >= 0x20 && byte < 0x7f) out += String.fromCharCode(byte);
    else out += `\\${byte.toString(8).padStart(3, '0')}`;
  }
  return `"${out}"`;
}

/** Upper-case letters, digits and single underscores, never empty; the caller adds a prefix that starts with a letter. */
export function identifierPart(text: string): string {
  return text.toUpperCase().replace(/[^A-Z0-9]+/g, '_').replace(/^_|_$/g, '') || 'X';
}

/**
 * A float constant: nine significant digits give back the same single-precision value; a value that rounds to
 * zero in single precision is written 0.0f (a smaller literal is an overflow warning).
 * @throws Error when the value is beyond the single-precision range
 */
export function floatLiteral(value: number): string {
  const single = Math.fround(value);
  if (!Number.isFinite(single)) throw new Error(`${value} is beyond the range of a float`);
  if (single === 0) return '0.0f';
  const text = value.toPrecision(9);
  return `${/[.eE]/.test(text) ? text : `${text}.0`}f`;
}
