// pdfkit from its platform-neutral build. pdfkit's Node build (0.20 too) deflates every stream with
// node's zlib, whose native handle aborts the whole process ("close before init") when a worker thread
// is terminated in the middle of a call. The platform-neutral build is the same release and API; it
// deflates with fflate (pure JavaScript) and reads no file itself: the fonts and pictures are handed to it as bytes or parsed faces.
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';

type PDFDocumentClass = typeof import('pdfkit');

interface NeutralBuild {
  default: PDFDocumentClass;
}

// the package exports only its Node build to Node; the neutral one sits beside it in the same folder
const nodeBuild = createRequire(import.meta.url).resolve('pdfkit');
const neutral = await import(pathToFileURL(join(dirname(nodeBuild), 'pdfkit.browser.mjs')).href) as NeutralBuild;

export const PDFDocument: PDFDocumentClass = neutral.default;


// pdfkit turns every operator of a content stream into bytes of its own as it is written (a small
// array each, tens of thousands per book), then joins them when the stream ends. Lines written as text
// are kept as text here and turned into bytes once per run of them, in the same order and with the same
// bytes (each line and its newline, one byte per character as pdfkit's own conversion gives).
interface StreamObject {
  write(chunk: Uint8Array | string): void;
  finalize(): void;
  pendingLines?: string[];
}

function patchStreamObjects(): void {
  const probe = new PDFDocument({ autoFirstPage: false, font: null as unknown as string });
  const proto = Object.getPrototypeOf(probe.ref({})) as StreamObject;
  const writeBytes = proto.write;
  const finalize = proto.finalize;
  const flush = (ref: StreamObject): void => {
    const lines = ref.pendingLines;
    if (!lines || lines.length === 0) return;
    ref.pendingLines = [];
    lines.push('');
    writeBytes.call(ref, Buffer.from(lines.join('\n'), 'latin1'));
  };
  proto.write = function write(this: StreamObject, chunk: Uint8Array | string): void {
    if (typeof chunk === 'string') {
      (this.pendingLines ??= []).push(chunk);
      return;
    }
    flush(this);
    writeBytes.call(this, chunk);
  };
  proto.finalize = function finalizeWithLines(this: StreamObject): void {
    flush(this);
    finalize.call(this);
  };
}
patchStreamObjects();
