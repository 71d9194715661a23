/**
 * Helvetica (a built-in PDF font) covers only the WinAnsi characters; the few Greek letters and
 * maths signs a report needs come from the built-in Symbol font, addressed by its own codes.
 */
const SYMBOL_CODES: Record<string, string> = {
  'Ω': 'W', 'τ': 't', 'σ': 's', 'δ': 'd', 'ε': 'e', 'α': 'a', 'β': 'b', 'γ': 'g', 'Δ': 'D', 'π': 'p',
  '≥': '\u00B3', '≤': '\u00A3', '≈': '\u00BB', '→': '\u00AE', '∞': '\u00A5', '√': '\u00D6', '−': '-', '‖': '\u00BD',
};

const PLAIN_SWAPS: Record<string, string> = { '‖': '||', '…': '...', '’': "'", '‘': "'", '“': '"', '”': '"', '–': '-', '³': '3', '¹': '1', '⁶': '6' };

/** Characters of Windows-1252 above 0x7F that Helvetica's encoding has. */
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ'.split(''));

const isWinAnsi = (ch: string) => {
  const code = ch.codePointAt(0)!;
  return (code >= 0x20 && code <= 0x7e) || (code >= 0xa0 && code <= 0xff) || WIN_ANSI_EXTRA.has(ch);
};

export interface TextRun {
  font: 'Helvetica' | 'Helvetica-Bold' | 'Symbol';
  text: string;
}

/** Splits text into runs Helvetica and Symbol can each draw; anything else becomes '?'. */
export function textRuns(text: string, bold = false): TextRun[] {
  const base = bold ? 'Helvetica-Bold' : 'Helvetica';
  const runs: TextRun[] = [];
  const push = (font: TextRun['font'], s: string) => {
    const last = runs.at(-1);
    if (last && last.font === font) last.text += s;
    else runs.push({ font, text: s });
  };
  for (const ch of text.replace(/\r?\n/g, ' ')) {
    if (ch === '‖') push(base, '||');
    else if (isWinAnsi(ch)) push(base, ch);
    else if (SYMBOL_CODES[ch]) push('Symbol', SYMBOL_CODES[ch]);
    else push(base, PLAIN_SWAPS[ch] ?? '?');
  }
  return runs;
}
