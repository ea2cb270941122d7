// A pdfkit document that is byte-for-byte reproducible: fixed dates and metadata, so pdfkit's file
// identifier (an MD5 of the info dictionary and creation date) is fixed too; no clock is read.
import { registerFonts } from './fonts.js';
import { PDFDocument } from './pdfkit.js';
import { startTagging } from './tags.js';

export interface DocumentMeta {
  title: string;
  author?: string;
  subject: string;
  keywords: string;
  date: Date; // stands for both creation and modification date
  lang: string;
  tagged?: boolean; // a structure tree for screen readers (default true)
}

export function createDocument(meta: DocumentMeta): PDFKit.PDFDocument {
  const info: PDFKit.DocumentInfo = {
    Title: meta.title,
    Subject: meta.subject,
    Keywords: meta.keywords,
    Creator: 'tidewright',
    Producer: 'tidewright with pdfkit',
    CreationDate: meta.date,
    ModDate: meta.date,
  };
  if (meta.author) info.Author = meta.author;
  const doc = new PDFDocument({
    autoFirstPage: false,
    font: null as unknown as string, // no default: pdfkit would load a standard font; registerFonts selects ours
    pdfVersion: '1.7',
    compress: true,
    lang: meta.lang,
    displayTitle: true,
    tagged: meta.tagged !== false,
    info,
  });
  collectOutput(doc);
  registerFonts(doc);
  if (meta.tagged !== false) startTagging(doc);
  return doc;
}

interface Output { chunks: Uint8Array[]; ended: boolean; done: (() => void) | null }

const outputs = new WeakMap<PDFKit.PDFDocument, Output>();

interface DocumentStream {
  _buffer: Uint8Array[];
  _offset: number; // bytes written so far (the cross-reference table's offsets count from it)
  push(chunk: Uint8Array | null): boolean;
  _write(data: Uint8Array | string): void;
}

/**
 * Takes the document's bytes as pdfkit writes them. Its platform-neutral build queues them in an array
 * it empties with shift(), which grows quadratic in the number of objects (a tagged combined book has
 * hundreds of thousands), so the chunks are taken at the source instead. pdfkit also turns each line of
 * the file into bytes of its own (several per object); lines are kept as text here and turned into bytes
 * once per run of them: the same bytes (one per character, each line ending in a newline), far fewer arrays.
 */
function collectOutput(doc: PDFKit.PDFDocument): void {
  const stream = doc as unknown as DocumentStream;
  // what the constructor wrote (the header) is already queued
  const out: Output = { chunks: stream._buffer.splice(0), ended: false, done: null };
  outputs.set(doc, out);
  let lines: string[] = [];
  const flushLines = (): void => {
    if (lines.length === 0) return;
    lines.push('');
    out.chunks.push(Buffer.from(lines.join('\n'), 'latin1'));
    lines = [];
  };
  stream._write = (data) => {
    if (data instanceof Uint8Array) {
      flushLines();
      out.chunks.push(data);
      stream._offset += data.length;
      return;
    }
    const line = String(data);
    lines.push(line);
    stream._offset += line.length + 1;
  };
  stream.push = (chunk) => {
    flushLines();
    if (chunk === null) { out.ended = true; out.done?.(); } else out.chunks.push(chunk);
    return true;
  };
}

/** Ends the document and collects its bytes. */
export function finish(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const out = outputs.get(doc);
  if (!out) throw new Error('finish() needs a document made by createDocument()');
  return new Promise((resolve) => {
    out.done = () => resolve(Buffer.concat(out.chunks));
    doc.end();
    if (out.ended) out.done();
  });
}

/** The books' fixed date: 1 January of the (earliest) edition year, 00:00 UTC. */
export function editionDate(year: number): Date {
  return new Date(Date.UTC(year, 0, 1));
}
