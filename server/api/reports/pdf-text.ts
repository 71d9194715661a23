import { PDF_FONTS, type PdfFontName } from './pdf-fonts.js';

export interface TextRun {
  font: PdfFontName;
  text: string;
}

/**
 * The text as one run of the embedded font (kept as a list so a caller can still join runs). The complete
 * Source Sans 3 draws every sign the product prints (the report glyph test checks the font covers them), so
 * nothing is swapped and no line changes font part-way, which is what made "63 µV" overlap its digits.
 */
export function textRuns(text: string, bold = false): TextRun[] {
  return [{ font: bold ? PDF_FONTS.bold : PDF_FONTS.regular, text: text.replace(/\r?\n/g, ' ') }];
}
