// pdfkit from its platform-neutral build. pdfkit's Node build (0.20 too) deflates every stream with
// node's zlib, whose native handle aborts the whole process ("close before init") when a worker thread
// is terminated in the middle of a call. The platform-neutral build is the same release and API; it
// deflates with fflate (pure JavaScript) and reads only the files registered with it, never the disk.
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';

type PDFDocumentClass = typeof import('pdfkit');

interface NeutralBuild {
  default: PDFDocumentClass;
  registerFile(path: string, data: Uint8Array | undefined): void;
}

// the package exports only its Node build to Node; the neutral one sits beside it in the same folder
const nodeBuild = createRequire(import.meta.url).resolve('pdfkit');
const neutral = await import(pathToFileURL(join(dirname(nodeBuild), 'pdfkit.browser.mjs')).href) as NeutralBuild;

export const PDFDocument: PDFDocumentClass = neutral.default;

/** Makes bytes readable by pdfkit under a path (fonts, images): the neutral build reads nothing else. */
export function registerFile(path: string, data: Uint8Array): void {
  neutral.registerFile(path, data);
}
