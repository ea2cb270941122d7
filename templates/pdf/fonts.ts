// The book's typefaces: DejaVu (free licence, from the dejavu-fonts-ttf npm package), embedded as
// subsets. No system font and no PDF standard font is ever used.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { create, type Font } from 'fontkit';

export type FontName = 'regular' | 'bold' | 'narrow' | 'narrow-bold' | 'oblique';

const FILES: Record<FontName, string> = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  narrow: 'DejaVuSansCondensed.ttf',
  'narrow-bold': 'DejaVuSansCondensed-Bold.ttf',
  oblique: 'DejaVuSans-Oblique.ttf',
};

let cache: Record<FontName, Buffer> | null = null;
let parsed: Record<FontName, Font> | null = null;

function fontDir(): string {
  const pkg = createRequire(import.meta.url).resolve('dejavu-fonts-ttf/package.json');
  return join(dirname(pkg), 'ttf');
}

/** Font files read once per process. */
export function fontBuffers(): Record<FontName, Buffer> {
  if (!cache) {
    const dir = fontDir();
    const out = {} as Record<FontName, Buffer>;
    for (const name of Object.keys(FILES) as FontName[]) out[name] = readFileSync(join(dir, FILES[name]));
    cache = out;
  }
  return cache;
}

/**
 * The faces, parsed once per thread and handed to every document. pdfkit parses a font file again for
 * each document it is given as bytes (measured: 8 % of a worker's time at national scale); given the
 * parsed face, a document only starts its own subset of it, so what each document embeds is unchanged.
 */
export function fontFaces(): Record<FontName, Font> {
  if (!parsed) {
    const buffers = fontBuffers();
    const out = {} as Record<FontName, Font>;
    for (const name of Object.keys(buffers) as FontName[]) out[name] = create(buffers[name]);
    parsed = out;
  }
  return parsed;
}

/** Registers every face under its name and selects the regular one. */
export function registerFonts(doc: PDFKit.PDFDocument): void {
  const faces = fontFaces();
  // pdfkit's declarations take a file or bytes; it takes a parsed face too (one that can lay out text)
  for (const name of Object.keys(faces) as FontName[]) doc.registerFont(name, faces[name] as unknown as Buffer);
  useFont(doc, 'regular');
}

/** Selects a face. */
export function useFont(doc: PDFKit.PDFDocument, name: FontName): PDFKit.PDFDocument {
  doc.font(name);
  shareLayouts(doc, name);
  return doc;
}

// pdfkit shapes each word once per document and keeps the result on its font object. Shaping is much
// of the cost of a book, and the result depends only on the face and the word, so the documents of a
// thread share one store per face (pdfkit 0.20 keeps it in `layoutCache`). A shaped word refers to the
// parsed face, which every document of the thread shares (fontFaces), so the store keeps nothing of
// any one document; it grows with the distinct words printed (times, heights, names), not with books.
const layouts = new Map<FontName, Record<string, unknown>>();

interface FontWithLayouts { layoutCache?: Record<string, unknown> | null }

function shareLayouts(doc: PDFKit.PDFDocument, name: FontName): void {
  const font = (doc as unknown as { _font?: FontWithLayouts })._font;
  if (!font || !font.layoutCache) return;
  let store = layouts.get(name);
  if (font.layoutCache === store) return;
  // the face's first use in this document
  if (!store) {
    store = Object.create(null) as Record<string, unknown>;
    layouts.set(name, store);
  }
  font.layoutCache = store;
}
