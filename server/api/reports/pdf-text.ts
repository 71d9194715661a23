import { PDF_FONTS, type PdfFontName } from './pdf-fonts.js';

/**
 * The report is set in Source Sans 3, embedded from its Latin and Greek subsets (Ω, τ, σ, µ come from
 * Greek). The few maths signs neither subset holds are written out plainly.
 */
const PLAIN_SWAPS: Record<string, string> = {
  '≥': '>=', '≤': '<=', '≈': '~', '→': '->', '∞': 'inf', '√': 'sqrt', '⁶': '^6', '⁴': '^4', '⁵': '^5', '⁷': '^7', '⁸': '^8', '⁹': '^9', '⁰': '^0', 'ᵏ': '^k',
};

const isGreek = (code: number) => code >= 0x0370 && code <= 0x03ff;
const isLatin = (code: number) =>
  code <= 0xff || code === 0x131 || code === 0x152 || code === 0x153 || (code >= 0x2000 && code <= 0x206f) || code === 0x20ac || code === 0x2122 || code === 0x2212 || code === 0x2215;

export interface TextRun {
  font: PdfFontName;
  text: string;
}

/** Splits text into runs of the Latin and Greek fonts; anything neither holds is swapped or becomes '?'. */
export function textRuns(text: string, bold = false): TextRun[] {
  const latin = bold ? PDF_FONTS.bold : PDF_FONTS.regular;
  const greek = bold ? PDF_FONTS.greekBold : PDF_FONTS.greek;
  const runs: TextRun[] = [];
  const push = (font: PdfFontName, s: string) => {
    const last = runs.at(-1);
    if (last && last.font === font) last.text += s;
    else runs.push({ font, text: s });
  };
  for (const ch of text.replace(/\r?\n/g, ' ')) {
    const code = ch.codePointAt(0)!;
    if (code === 0xb5) push(greek, 'μ'); // micro sign drawn as Greek mu, the same glyph
    else if (isLatin(code) && code >= 0x20) push(latin, ch);
    else if (isGreek(code)) push(greek, ch);
    else push(latin, PLAIN_SWAPS[ch] ?? '?');
  }
  return runs;
}
