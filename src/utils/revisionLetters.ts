/** Letter value with A = 1 … Z = 26, AA = 27, like spreadsheet columns. */
function letterValue(letter: string): number {
  return [...letter.toUpperCase()].reduce((sum, ch) => sum * 26 + (ch.charCodeAt(0) - 64), 0);
}

function valueLetter(value: number): string {
  let text = '';
  for (let n = value; n > 0; n = Math.floor((n - 1) / 26)) text = String.fromCharCode(65 + ((n - 1) % 26)) + text;
  return text;
}

/** The letter the next revision will get (what the server gives), for button labels. */
export function nextLetter(letters: readonly string[]): string {
  return valueLetter(Math.max(0, ...letters.map(letterValue)) + 1);
}
