// The book's typefaces: DejaVu (free licence, from the dejavu-fonts-ttf npm package), embedded as
// subsets. No system font and no PDF standard font is ever used.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

export type FontName = 'regular' | 'bold' | 'narrow' | 'narrow-bold' | 'oblique';

const FILES: Record<FontName, string> = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  narrow: 'DejaVuSansCondensed.ttf',
  'narrow-bold': 'DejaVuSansCondensed-Bold.ttf',
  oblique: 'DejaVuSans-Oblique.ttf',
};

let cache: Record<FontName, Buffer> | null = null;

function fontDir(): string {
  const pkg = createRequire(import.meta.url).resolve('dejavu-fonts-ttf/package.json');
  return join(dirname(pkg), 'ttf');
}

/** Path of the font the document is created with, so pdfkit never loads its built-in default. */
export function defaultFontPath(): string {
  return join(fontDir(), FILES.regular);
}

/** Font files read once per process (pdfkit parses them per document). */
export function fontBuffers(): Record<FontName, Buffer> {
  if (!cache) {
    const dir = fontDir();
    const out = {} as Record<FontName, Buffer>;
    for (const name of Object.keys(FILES) as FontName[]) out[name] = readFileSync(join(dir, FILES[name]));
    cache = out;
  }
  return cache;
}

export function registerFonts(doc: PDFKit.PDFDocument): void {
  const buffers = fontBuffers();
  for (const name of Object.keys(buffers) as FontName[]) {
    doc.registerFont(name, buffers[name]);
  }
}
