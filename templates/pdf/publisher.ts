// What a publisher adds to every book: the logo and cover picture (made ready once per book), the
// accent colour, and their own pages before and after the tide tables.
import { pagesAt } from '../pages/types.js';
import type { OwnPlaces } from './compose.js';
import { LOGO_BOX } from './cover-parts.js';
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

/** The publisher's logo made ready for a cover of this format, if there is one. */
export function publisherLogo(options: BookOptions, g: PageGeometry): Picture | undefined {
  return options.logo === undefined ? undefined : loadPicture(options.logo, LOGO_BOX.width * g.scale);
}

/** The publisher's colour, except in press output (black ink only). */
export function publisherAccent(options: BookOptions): string | undefined {
  return options.press ? undefined : options.accent;
}

/** The publisher's parts of a book; `level` is the outline level of their pages (0 beside stations' sections). */
export function publisherParts(options: BookOptions, g: PageGeometry, invented: boolean, level: 0 | 1): PublisherParts {
  const accent = publisherAccent(options);
  const own = { geometry: g, invented, level, accent };
  const logo = publisherLogo(options, g);
  return {
    ...(logo && { logo }),
    ...(options.coverImage !== undefined && { coverImage: loadPicture(options.coverImage, contentBox(g, 1).width) }),
    ...(accent !== undefined && { accent }),
    own: {
      front: ownPages(pagesAt(options.pages, 'book', 'front'), own),
      back: ownPages(pagesAt(options.pages, 'book', 'back'), own),
    },
  };
}

export function imprintText(options: BookOptions): ImprintText {
  return { publisher: options.publisher, contact: options.contact, stamp: options.stamp, accent: publisherAccent(options) };
}
