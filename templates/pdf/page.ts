// A book is laid out first as a list of logical pages, each a drawing callback; the renderer then
// draws page k at any position on any sheet (one per PDF page, or two-up for saddle stitching).
import type { Box, PageGeometry } from './geometry.js';
import type { Words } from '../locale/index.js';
import type { HeightUnits } from './options.js';
import type { ImageWarningSink } from './image-resolution.js';

export interface BookSettings {
  units: HeightUnits;
  geometry: PageGeometry;
  title: string;
  publisher?: string;
  words: Words; // the reader's language and the one formatter
  press?: boolean; // bleed, crop marks, page boxes, black ink (templates/pdf/press.ts)
  warn?: ImageWarningSink; // told of every picture that would print below 300 dpi (image-resolution.ts)
}

export interface PageContext {
  doc: PDFKit.PDFDocument;
  settings: BookSettings;
  number: number; // 1-based page number in the book
  box: Box; // content box in page coordinates (binding margin applied)
  interactive: boolean; // links and named destinations allowed (not on imposed sheets)
  bleed: number; // how far colour that runs to the page's edge continues past it (press output), else 0
}

export interface FooterInfo {
  invented: boolean; // demo data: the footer says so
  label?: string; // running foot, e.g. the station's name
}

export type PageKind = 'own' | 'cover' | 'contents' | 'caution' | 'section' | 'facts' | 'month' | 'overview' | 'notes' | 'imprint'
  | 'windows' | 'hours'; // pages after a month: its access windows, its heights hour by hour

export interface LogicalPage {
  kind: PageKind;
  footer: FooterInfo;
  outline?: { title: string; level: 0 | 1 }; // bookmark in the reader's sidebar
  anchor?: string; // named destination the contents page links to
  draw(ctx: PageContext): void;
}

/** The scale factor of the current format: every size in the layouts is design points × s. */
export function unit(ctx: PageContext): number {
  return ctx.settings.geometry.scale;
}
