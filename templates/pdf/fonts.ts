// The book's typefaces: DejaVu (free licence, from the dejavu-fonts-ttf npm package), embedded as
// subsets. No system font and no PDF standard font is ever used.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { registerFile } from './pdfkit.js';

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
let regularPath: string | null = null;

export function defaultFontPath(): string {
  if (regularPath === null) {
    regularPath = join(fontDir(), FILES.regular);
    registerFile(regularPath, fontBuffers().regular);
  }
  return regularPath;
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
    if (name !== 'regular') doc.registerFont(name, buffers[name]);
  }
}

/**
 * Selects a face. The regular face is the document's default, opened from its path; pdfkit keeps it
 * under that path, and selecting it by any other key would parse the font file again on every call.
 */
export function useFont(doc: PDFKit.PDFDocument, name: FontName): PDFKit.PDFDocument {
  doc.font(name === 'regular' ? defaultFontPath() : name);
  shareLayouts(doc, name);
  return doc;
}

// pdfkit shapes each word once per document and keeps the result on the font object. Shaping is
// most of the cost of a book, and the result depends only on the face and the word, so documents of
// this process share one store per face (pdfkit 0.20 keeps it in `layoutCache`). Each shaped word
// holds on to the font object of the document that shaped it (the parsed face, ~0.5 MiB), so a store
// shared by every book of a worker kept every book's fonts (measured: ~2 MiB more per book, 1 GiB
// over 500 books); a store therefore serves LAYOUT_DOCUMENTS documents, then starts again: at most
// ~100 MiB of fonts kept per thread, for about 1.5 s of shaping anew each time (measured on 20 books).
const layouts = new Map<FontName, { store: Record<string, unknown>; documents: number }>();
export const LAYOUT_DOCUMENTS = 48;

interface FontWithLayouts { layoutCache?: Record<string, unknown> | null }

function shareLayouts(doc: PDFKit.PDFDocument, name: FontName): void {
  const font = (doc as unknown as { _font?: FontWithLayouts })._font;
  if (!font || !font.layoutCache) return;
  let shared = layouts.get(name);
  if (shared && font.layoutCache === shared.store) return;
  // the face's first use in this document
  if (!shared || shared.documents >= LAYOUT_DOCUMENTS) {
    shared = { store: Object.create(null) as Record<string, unknown>, documents: 0 };
    layouts.set(name, shared);
  }
  shared.documents++;
  font.layoutCache = shared.store;
}
