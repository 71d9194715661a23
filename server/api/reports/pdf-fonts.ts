import { createRequire } from 'node:module';
import fs from 'node:fs';

const require = createRequire(import.meta.url);
const file = (subset: 'latin' | 'greek', weight: 400 | 700) =>
  require.resolve(`@fontsource/source-sans-3/files/source-sans-3-${subset}-${weight}-normal.woff`);

/** Registered names of the embedded fonts: our own Source Sans 3, its Latin and Greek subsets. */
export const PDF_FONTS = {
  regular: 'Sans',
  bold: 'Sans-Bold',
  greek: 'Sans-Greek',
  greekBold: 'Sans-Greek-Bold',
} as const;
export type PdfFontName = (typeof PDF_FONTS)[keyof typeof PDF_FONTS];

let cache: Record<PdfFontName, Buffer> | null = null;

/** The font files, read once per process. */
export function pdfFontFiles(): Record<PdfFontName, Buffer> {
  cache ??= {
    [PDF_FONTS.regular]: fs.readFileSync(file('latin', 400)),
    [PDF_FONTS.bold]: fs.readFileSync(file('latin', 700)),
    [PDF_FONTS.greek]: fs.readFileSync(file('greek', 400)),
    [PDF_FONTS.greekBold]: fs.readFileSync(file('greek', 700)),
  } as Record<PdfFontName, Buffer>;
  return cache;
}
