import { createRequire } from 'node:module';
import fs from 'node:fs';

const require = createRequire(import.meta.url);
/**
 * The complete Source Sans 3 (not a web subset): one file holds every sign the product prints, Latin, Greek and
 * the maths signs (Ω, µ, ±, ², ·, →, ×, ≤, ≥, ‰, −), so no run changes font mid-line and nothing is swapped.
 */
const file = (weight: '400Regular' | '700Bold') =>
  require.resolve(`@expo-google-fonts/source-sans-3/${weight}/SourceSans3_${weight}.ttf`);

/** Registered names of the embedded fonts. */
export const PDF_FONTS = {
  regular: 'Sans',
  bold: 'Sans-Bold',
} as const;
export type PdfFontName = (typeof PDF_FONTS)[keyof typeof PDF_FONTS];

let cache: Record<PdfFontName, Buffer> | null = null;

/** The font files, read once per process. */
export function pdfFontFiles(): Record<PdfFontName, Buffer> {
  cache ??= {
    [PDF_FONTS.regular]: fs.readFileSync(file('400Regular')),
    [PDF_FONTS.bold]: fs.readFileSync(file('700Bold')),
  } as Record<PdfFontName, Buffer>;
  return cache;
}
