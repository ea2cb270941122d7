// Draws a laid-out book: each logical page on its own PDF page, or two-up on sheets in saddle-stitch
// order. Pages are drawing callbacks, so the same page draws anywhere on any sheet.
import { itemAt } from '../../engine/index.js';
import type { DocumentMeta } from './document.js';
import { createDocument, finish } from './document.js';
import { drawFooter } from './footer.js';
import { contentBox } from './geometry.js';
import { saddleStitchOrder } from './imposition.js';
import { addTrimmedPage, useBlackInk } from './press.js';
import { beginTaggedPage, sections, within } from './tags.js';
import type { BookSettings, LogicalPage, PageContext } from './page.js';
import { RULE } from './style.js';

/** Sides of a page on which its colour may run into the bleed: all but a spine shared with a neighbour. */
interface Edges { left: boolean; right: boolean }

function drawLogical(doc: PDFKit.PDFDocument, settings: BookSettings, page: LogicalPage, number: number,
  dx: number, dy: number, interactive: boolean, bleed: number, edges: Edges = { left: true, right: true }): void {
  const g = settings.geometry;
  const ctx: PageContext = { doc, settings, number, box: contentBox(g, number), interactive, bleed };
  beginTaggedPage(doc);
  doc.save();
  if (dx !== 0 || dy !== 0) doc.translate(dx, dy);
  const left = edges.left ? bleed : 0;
  const right = edges.right ? bleed : 0;
  doc.rect(-left, -bleed, g.size.width + left + right, g.size.height + 2 * bleed).clip();
  page.draw(ctx);
  drawFooter(ctx, page);
  doc.restore();
}

function addOutline(doc: PDFKit.PDFDocument, page: LogicalPage, parent: { current: PDFKit.PDFOutline | null },
  pageNumber?: number): void {
  if (!page.outline) return;
  // pdfkit reads pageNumber (0-based) from the options, though its published types leave it out
  const options = (pageNumber === undefined ? {} : { pageNumber }) as { expanded?: boolean };
  if (page.outline.level === 0 || !parent.current) {
    const item = doc.outline.addItem(page.outline.title, options);
    if (page.outline.level === 0) parent.current = item;
  } else {
    parent.current.addItem(page.outline.title, options);
  }
}

function sectionTitle(page: LogicalPage): string | undefined {
  return page.outline?.title;
}

export async function renderBook(pages: LogicalPage[], settings: BookSettings, meta: DocumentMeta,
  imposition: 'none' | 'saddle-stitch', filler: () => LogicalPage): Promise<Buffer> {
  const doc = createDocument(meta);
  const press = settings.press === true;
  if (press) useBlackInk(doc);
  const g = settings.geometry;
  if (imposition === 'none') {
    const parent = { current: null as PDFKit.PDFOutline | null };
    const sects = sections(doc, pages.map(sectionTitle));
    pages.forEach((page, i) => {
      const at = addTrimmedPage(doc, g.size.width, g.size.height, press);
      if (page.anchor) doc.addNamedDestination(page.anchor);
      addOutline(doc, page, parent);
      within(doc, itemAt(sects, i, 'page sections'), () => drawLogical(doc, settings, page, i + 1, at.dx, at.dy, true, at.bleed));
    });
    return finish(doc);
  }
  const plan = saddleStitchOrder(pages.length);
  const all = [...pages];
  while (all.length < plan.paddedCount) all.push(filler());
  // the structure reads in book order although the sheets carry the pages out of order
  const sects = sections(doc, all.map(sectionTitle));
  const sheetOf: number[] = []; // 0-based PDF page of each logical page, for the bookmarks
  let sheetPage = 0;
  const offset = (g.sheet.width - 2 * g.size.width) / 2; // A5 pair on A4 leaves half a millimetre each side
  for (const sheet of plan.sheets) {
    for (const side of [sheet.front, sheet.back]) {
      const at = addTrimmedPage(doc, g.sheet.width, g.sheet.height, press);
      for (const [n, x, edges] of [[side.left, at.dx + offset, { left: true, right: false }],
        [side.right, at.dx + offset + g.size.width, { left: false, right: true }]] as const) {
        const page = itemAt(all, n - 1, 'pages of the booklet'); // the plan numbers the padded pages 1…paddedCount
        sheetOf[n - 1] = sheetPage;
        // links and their targets work wherever a page lands on a sheet
        if (page.anchor) doc.addNamedDestination(page.anchor, 'XYZ', x, at.dy, null);
        within(doc, itemAt(sects, n - 1, 'page sections'), () => drawLogical(doc, settings, page, n, x, at.dy, true, at.bleed, edges));
      }
      sheetPage++;
      // fold marks at the top and bottom edge, outside the type area
      const fx = at.dx + offset + g.size.width;
      doc.save().lineWidth(0.4).strokeColor(RULE)
        .moveTo(fx, at.dy).lineTo(fx, at.dy + 12).stroke()
        .moveTo(fx, at.dy + g.sheet.height - 12).lineTo(fx, at.dy + g.sheet.height).stroke().restore();
    }
  }
  // bookmarks in book order, each opening the sheet side that carries its page
  const parent = { current: null as PDFKit.PDFOutline | null };
  all.forEach((page, i) => addOutline(doc, page, parent, sheetOf[i]));
  return finish(doc);
}
