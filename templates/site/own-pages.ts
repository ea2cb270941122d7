// The publisher's own pages as pages of the site: their Markdown rendered by markdown-it with raw HTML
// off (a <script> written in a page shows as text, never runs), pictures copied beside each page.
import { extname } from 'node:path';
import { markdownReader } from '../pages/markdown.js';
import { pagesAt, type PagePlace, type PublisherPage } from '../pages/types.js';

export interface SiteOwnPage {
  url: string; // /pages/<slug>/
  slug: string;
  title: string;
  place: PagePlace;
  html: string; // rendered by markdown-it from the publisher's Markdown, raw HTML escaped
  pictures: { src: string; alt: string; size: 'full' | 'half' | 'quarter' }[]; // a page of pictures
  files: { from: string; name: string }[]; // pictures to copy into the page's folder
}

export const ownPageUrl = (slug: string): string => `/pages/${slug}/`;

/** A picture's name in the page's folder: its place in the page and its own extension. */
function fileName(n: number, path: string): string {
  return `picture-${n}${extname(path).toLowerCase()}`;
}

function toSite(page: PublisherPage): SiteOwnPage {
  const files: { from: string; name: string }[] = [];
  const nameOf = (path: string): string => {
    const known = files.find((f) => f.from === path);
    if (known) return known.name;
    const name = fileName(files.length + 1, path);
    files.push({ from: path, name });
    return name;
  };
  const md = markdownReader();
  const tokens = md.parse(page.markdown, {});
  for (const token of tokens) {
    // a table column's alignment as a class of the stylesheet, not an inline style
    const align = /text-align:(left|right|center)/.exec(token.attrGet('style') ?? '')?.[1];
    if (align !== undefined) token.attrs = [['class', `align-${align}`]];
    for (const child of token.children ?? []) {
      if (child.type !== 'image') continue;
      const path = page.images[child.attrGet('src') ?? ''];
      if (path !== undefined) child.attrSet('src', nameOf(path));
    }
  }
  const pictures = page.image
    ? [{ src: nameOf(page.image.path), alt: page.image.alt, size: 'full' as const }]
    : (page.grid ?? []).map((g) => ({ src: nameOf(g.path), alt: g.alt, size: g.size }));
  return {
    url: ownPageUrl(page.slug), slug: page.slug, title: page.title, place: page.place,
    html: md.renderer.render(tokens, md.options, {}), pictures, files,
  };
}

/** The site's own pages: those before the tide tables first, each place in its order. */
export function siteOwnPages(pages: readonly PublisherPage[] | undefined): SiteOwnPage[] {
  return [...pagesAt(pages, 'site', 'front'), ...pagesAt(pages, 'site', 'back')].map(toSite);
}
