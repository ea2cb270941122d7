// What a publisher adds to every book: the logo and cover picture (made ready once per book), the
// accent colour, and their own pages before and after the tide tables.
import { pagesAt } from '../pages/types.js';
import type { OwnPlaces } from './compose.js';
import { LOGO_BOX } from './cover.js';
import { contentBox, type PageGeometry } from './geometry.js';
import type { ImprintText } from './imprint.js';
import type { BookOptions } from './options.js';
import { ownPages } from './own-pages.js';
import { loadPicture, type Picture } from './picture.js';

export interface PublisherParts {
  logo?: Picture;
  coverImage?: Picture;
  accent?: string;
  own: OwnPlaces;
}

/** The publisher's parts of a book; `level` is the outline level of their pages (0 beside stations' sections). */
export function publisherParts(options: BookOptions, g: PageGeometry, invented: boolean, level: 0 | 1): PublisherParts {
  const accent = options.press ? undefined : options.accent;
  const own = { geometry: g, invented, level, accent };
  return {
    ...(options.logo !== undefined && { logo: loadPicture(options.logo, LOGO_BOX.width * g.scale) }),
    ...(options.coverImage !== undefined && { coverImage: loadPicture(options.coverImage, contentBox(g, 1).width) }),
    ...(accent !== undefined && { accent }),
    own: {
      front: ownPages(pagesAt(options.pages, 'book', 'front'), own),
      back: ownPages(pagesAt(options.pages, 'book', 'back'), own),
    },
  };
}

export function imprintText(options: BookOptions): ImprintText {
  return { publisher: options.publisher, contact: options.contact, stamp: options.stamp, accent: options.press ? undefined : options.accent };
}
