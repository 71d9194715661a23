/** A, B, … Z, AA, AB, …: the letter after `letter` (spreadsheet-column order). */
export function nextRevisionLetter(letter: string | null): string {
  if (!letter) return 'A';
  const chars = letter.split('');
  for (let i = chars.length - 1; i >= 0; i--) {
    if (chars[i] !== 'Z') {
      chars[i] = String.fromCharCode(chars[i].charCodeAt(0) + 1);
      return chars.join('');
    }
    chars[i] = 'A';
  }
  return `A${chars.join('')}`;
}

/** Orders letters as revisions were made: shorter first, then alphabetical. */
export const compareLetters = (a: string, b: string): number => a.length - b.length || a.localeCompare(b);
