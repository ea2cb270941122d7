// A pdfkit document that is byte-for-byte reproducible: fixed dates and metadata, so pdfkit's file
// identifier (an MD5 of the info dictionary and creation date) is fixed too; no clock is read.
import { defaultFontPath, registerFonts } from './fonts.js';
import { PDFDocument } from './pdfkit.js';

export interface DocumentMeta {
  title: string;
  author?: string;
  subject: string;
  keywords: string;
  date: Date; // stands for both creation and modification date
  lang: string;
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
    font: defaultFontPath(), // otherwise pdfkit loads a standard font as its default
    pdfVersion: '1.7',
    compress: true,
    lang: meta.lang,
    displayTitle: true,
    info,
  });
  registerFonts(doc);
  return doc;
}

/** Ends the document and collects its bytes. */
export function finish(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}

/** The books' fixed date: 1 January of the (earliest) edition year, 00:00 UTC. */
export function editionDate(year: number): Date {
  return new Date(Date.UTC(year, 0, 1));
}
