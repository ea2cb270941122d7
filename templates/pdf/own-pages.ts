// The publisher's own pages in a book: a Markdown page set on as many pages as it needs, a page that is
// one picture (a sponsor's advertisement), or up to four pictures sharing a page in a grid of halves and
// quarters. Their places (before or after the tide tables) are the composer's; this makes the pages.
import type { PageImage, PublisherPage } from '../pages/types.js';
import { createDocument } from './document.js';
import { markdownBlocks } from './markdown-blocks.js';
import { layoutMarkdown, type Placed, type Run } from './markdown-layout.js';
import type { LogicalPage, PageContext } from './page.js';
import { unit } from './page.js';
import { placePicture } from './place-picture.js';
import type { PageGeometry } from './geometry.js';
import { contentBox } from './geometry.js';
import { fitted, loadPicture, type Picture } from './picture.js';
import { DARK, HAIRLINE, INK, RULE } from './style.js';
import { group, linked, tag, type TagOptions, type TagType } from './tags.js';
import { put } from './text.js';

export interface OwnPagesContext {
  geometry: PageGeometry;
  invented: boolean;
  level: 0 | 1; // of the pages' bookmarks
  accent?: string | undefined; // the publisher's colour, for the pages' titles
}

const TITLE_SIZE = 16;

function drawRun(ctx: PageContext, r: Run): void {
  put(ctx.doc, r.text, ctx.box.x + r.x, ctx.box.y + r.y, r.style);
}

/** A link's words with their underline; the annotation is placed by the caller. */
function drawLinkRun(ctx: PageContext, r: Run & { link: string }): void {
  const { doc, box } = ctx;
  const x = box.x + r.x;
  const y = box.y + r.y;
  drawRun(ctx, r);
  doc.save().lineWidth(HAIRLINE).strokeColor(r.style.color ?? INK).moveTo(x, y + 1.2).lineTo(x + r.width, y + 1.2).stroke().restore();
}

function annotateLink(ctx: PageContext, r: Run & { link: string }, structParent: PDFKit.PDFStructureElement | undefined): void {
  if (!ctx.interactive) return;
  const x = ctx.box.x + r.x;
  const y = ctx.box.y + r.y;
  ctx.doc.link(x, y - r.style.size, r.width, r.style.size * 1.25, r.link, structParent ? { structParent } : {});
}

const isLink = (r: Run): r is Run & { link: string } => r.link !== undefined;

/**
 * A block of runs as one structure element: a leaf when it holds no link; else a container whose plain
 * runs are spans and whose links are Link elements with their annotations as object references, so a
 * screen reader announces each link in its place.
 */
function drawBlock(ctx: PageContext, type: TagType, runs: Run[], options: TagOptions = {}): void {
  const { doc } = ctx;
  if (!runs.some(isLink)) {
    tag(doc, type, options, () => { for (const r of runs) drawRun(ctx, r); });
    return;
  }
  group(doc, type, options, () => {
    for (const r of runs) {
      if (isLink(r)) linked(doc, () => drawLinkRun(ctx, r), (parent) => annotateLink(ctx, r, parent));
      else tag(doc, 'Span', {}, () => drawRun(ctx, r));
    }
  });
}

function drawPlaced(ctx: PageContext, items: Placed[]): void {
  const { doc, box } = ctx;
  let list: Placed[] = []; // consecutive list items, drawn as one L
  const endList = (): void => {
    const items = list;
    list = [];
    if (items.length > 0) group(doc, 'L', {}, () => { for (const li of items) if (li.kind === 'text') drawBlock(ctx, 'LI', li.runs); });
  };
  for (const item of items) {
    if (item.kind === 'text' && item.tag === 'LI') {
      list.push(item);
      continue;
    }
    endList();
    if (item.kind === 'text') {
      drawBlock(ctx, item.tag, item.runs);
    } else if (item.kind === 'rule') {
      doc.save().lineWidth(0.6 * unit(ctx)).strokeColor(RULE).moveTo(box.x, box.y + item.y).lineTo(box.x + item.width, box.y + item.y).stroke().restore();
    } else if (item.kind === 'image') {
      tag(doc, 'Figure', { alt: item.alt || 'Picture' },
        () => placePicture(doc, ctx.settings, item.picture, box.x + item.x, box.y + item.y, item.width, item.height));
      if (item.caption.length > 0) drawBlock(ctx, 'Caption', item.caption);
    } else {
      for (const rule of item.rules) {
        doc.save().lineWidth((rule.heavy ? 0.8 : HAIRLINE) * unit(ctx)).strokeColor(rule.heavy ? INK : RULE)
          .moveTo(box.x + rule.x1, box.y + rule.y).lineTo(box.x + rule.x2, box.y + rule.y).stroke().restore();
      }
      group(doc, 'Table', {}, () => {
        for (const row of item.rows) {
          group(doc, 'TR', {}, () => {
            for (const cell of row.cells) {
              drawBlock(ctx, row.header ? 'TH' : 'TD', cell, row.header ? { scope: 'Column' } : {});
            }
          });
        }
      });
    }
  }
  endList();
}

/** A Markdown page: its title, then its text, over as many book pages as it takes. */
function markdownPages(page: PublisherPage, c: OwnPagesContext): LogicalPage[] {
  const g = c.geometry;
  const s = g.scale;
  const box = contentBox(g, 1);
  const doc = createDocument({ title: '', subject: '', keywords: '', date: new Date(0), lang: 'en', tagged: false });
  const top = (TITLE_SIZE + 14) * s;
  const laid = layoutMarkdown(doc, markdownBlocks(page.markdown), page.images,
    { scale: s, width: box.width, height: box.height, ...(c.accent !== undefined && { color: c.accent }) }, top);
  doc.end();
  return laid.map((items, i) => ({
    kind: 'own',
    footer: { invented: c.invented, label: page.title },
    ...(i === 0 && { outline: { title: page.title, level: c.level } }),
    draw(ctx) {
      if (i === 0) {
        tag(ctx.doc, 'H1', {}, () => put(ctx.doc, page.title, ctx.box.x, ctx.box.y + TITLE_SIZE * s,
          { font: 'bold', size: TITLE_SIZE * s, color: c.accent ?? INK }));
      }
      drawPlaced(ctx, items);
    },
  }));
}

function drawPicture(ctx: PageContext, picture: Picture, image: PageImage, x: number, y: number, w: number, h: number): void {
  const size = fitted(picture.pixels, w, h);
  tag(ctx.doc, 'Figure', { alt: image.alt || 'Picture' },
    () => placePicture(ctx.doc, ctx.settings, picture, x + (w - size.width) / 2, y + (h - size.height) / 2, size.width, size.height));
}

/** One picture filling the page, or a grid of halves (the full width) and quarters (half of it). */
function picturePage(page: PublisherPage, c: OwnPagesContext): LogicalPage {
  const box = contentBox(c.geometry, 1);
  const gap = 8 * c.geometry.scale;
  const cellW = (box.width - gap) / 2;
  const cellH = (box.height - gap) / 2;
  const list = page.image ? [{ ...page.image, size: 'full' as const }] : page.grid ?? [];
  // quarters take the first free cell of a 2 × 2 grid, halves the first free row
  const taken = [false, false, false, false];
  const cellOf = (p: (typeof list)[number]): { col: number; row: number; w: number; h: number } => {
    if (p.size === 'full') return { col: 0, row: 0, w: box.width, h: box.height };
    if (p.size === 'half') {
      const row = taken[0] || taken[1] ? 1 : 0;
      taken[2 * row] = taken[2 * row + 1] = true;
      return { col: 0, row, w: box.width, h: cellH };
    }
    const at = taken.indexOf(false);
    taken[at] = true;
    return { col: at % 2, row: Math.floor(at / 2), w: cellW, h: cellH };
  };
  const placed = list.map((p) => ({ p, picture: loadPicture(p.path, p.size === 'quarter' ? cellW : box.width), cell: cellOf(p) }));
  return {
    kind: 'own',
    footer: { invented: c.invented, label: page.title },
    outline: { title: page.title, level: c.level },
    draw(ctx) {
      for (const { p, picture, cell } of placed) {
        drawPicture(ctx, picture, p, ctx.box.x + cell.col * (cellW + gap), ctx.box.y + cell.row * (cellH + gap), cell.w, cell.h);
      }
      if (list.length === 0) put(ctx.doc, page.title, ctx.box.x, ctx.box.y + 12, { font: 'bold', size: 12, color: DARK });
    },
  };
}

/** The book pages of the publisher's pages, in the order given. */
export function ownPages(pages: readonly PublisherPage[], c: OwnPagesContext): LogicalPage[] {
  return pages.flatMap((page) => (page.image || page.grid ? [picturePage(page, c)] : markdownPages(page, c)));
}
