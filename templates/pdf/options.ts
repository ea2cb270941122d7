// Options of a printed tide book, and their defaults.

import type { PublisherPage } from '../pages/types.js';
import type { ImageWarningSink } from './image-resolution.js';

export type PageSizeName = 'a5' | 'a6' | 'a4' | 'letter' | 'half-letter';
export type HeightUnits = 'm' | 'ft';

export interface BookOptions {
  units: HeightUnits;
  page: PageSizeName;
  imposition?: 'none' | 'saddle-stitch';
  press?: boolean; // bleed, crop marks, TrimBox/BleedBox, black ink only
  tagged?: boolean; // a structure tree for screen readers (default true; false only to measure its cost)
  title?: string;
  publisher?: string;
  locale?: string; // BCP 47 tag: the language of the book (templates/locale)
  caution?: string; // the publisher's own caution, replacing the catalogue's
  hourly?: boolean; // a page of heights on every hour after each month
  stamp?: number; // UTC ms: the creation date of the file (default 1 January of the year)
  contact?: string; // who to call, printed on the imprint page (lines)
  logo?: string; // path of the publisher's logo (SVG, PNG or JPEG): top right of the covers
  coverImage?: string; // path of the publisher's cover picture: in the covers' free space
  accent?: string; // #rrggbb: the covers' year and bar, the titles of the publisher's pages (not in press output)
  pages?: readonly PublisherPage[]; // the publisher's own pages (templates/pages/types.ts)
  warn?: ImageWarningSink; // told of each placed picture that would print below 300 dpi (image-resolution.ts)
}

export const PAGE_SIZE_NAMES: readonly PageSizeName[] = ['a5', 'a6', 'a4', 'letter', 'half-letter'];

/** Rejects option values the renderer cannot honour (the CLI validates earlier; this guards direct callers). */
export function checkBookOptions(options: BookOptions): void {
  if (!PAGE_SIZE_NAMES.includes(options.page)) {
    throw new RangeError(`page size "${String(options.page)}" is not one of ${PAGE_SIZE_NAMES.join(', ')}`);
  }
  if (options.units !== 'm' && options.units !== 'ft') {
    throw new RangeError(`units "${String(options.units)}" must be m or ft`);
  }
  const imp = options.imposition ?? 'none';
  if (imp !== 'none' && imp !== 'saddle-stitch') {
    throw new RangeError(`imposition "${String(imp)}" must be none or saddle-stitch`);
  }
}
