// A publisher's own page (a Markdown file in the folder `pages:` names), as checked by the build and
// read by both renderers: the site makes it a page of the site, the books typeset it.

export const PAGE_PLACES = ['front', 'back'] as const;
export const PAGE_TARGETS = ['both', 'site', 'book'] as const;
export const GRID_SIZES = ['half', 'quarter'] as const;

export type PagePlace = (typeof PAGE_PLACES)[number];
export type PageTarget = (typeof PAGE_TARGETS)[number];
export type GridSize = (typeof GRID_SIZES)[number];

export interface PageImage {
  path: string; // absolute path of a checked SVG, PNG or JPEG file
  alt: string; // what it shows, for readers who cannot see it
}

export interface PublisherPage {
  file: string; // absolute path of the .md file
  slug: string; // from the file name: the page's folder in the site, /pages/<slug>/
  title: string;
  order: number; // pages of one place run in this order, then by file name
  place: PagePlace; // before the tide tables or after them
  in: PageTarget;
  markdown: string; // the text after the front matter
  images: Record<string, string>; // an image's src as written in the Markdown → its absolute path (checked)
  image?: PageImage; // a page that is one picture, the whole page (a sponsor's advertisement)
  grid?: (PageImage & { size: GridSize })[]; // pictures sharing one page: a half is the full width, a quarter half of it
}

/** The pages for one renderer and place, in their order. */
export function pagesAt(pages: readonly PublisherPage[] | undefined, where: 'site' | 'book', place: PagePlace): PublisherPage[] {
  return (pages ?? []).filter((p) => p.place === place && (p.in === 'both' || p.in === where))
    .sort((a, b) => a.order - b.order || a.slug.localeCompare(b.slug, 'en'));
}

/** Quarter-page cells a grid fills (a page has four): a half takes two. */
export function gridCells(grid: readonly { size: GridSize }[]): number {
  return grid.reduce((n, g) => n + (g.size === 'half' ? 2 : 1), 0);
}
