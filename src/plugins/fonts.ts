// Bundled with the app; no font CDN (the CSP allows only our own origin).
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/400-italic.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
import '@/styles/base.css';

/** Font and base styles load as a side effect of importing this module; the call keeps main.ts explicit. */
export function installFonts(): void {}
