// Draws a laid-out book: each logical page on its own PDF page, or two-up on sheets in saddle-stitch
// order. Pages are drawing callbacks, so the same page draws anywhere on any sheet.
import type { DocumentMeta } from './document.js';
import { createDocument, finish } from './document.js';
import { drawFooter } from './footer.js';
import { contentBox } from './geometry.js';
import { saddleStitchOrder } from './imposition.js';
import type { BookSettings, LogicalPage, PageContext } from './page.js';
import { RULE } from './style.js';

function drawLogical(doc: PDFKit.PDFDocument, settings: BookSettings, page: LogicalPage, number: number,
  dx: number, interactive: boolean): void {
  const g = settings.geometry;
  const ctx: PageContext = { doc, settings, number, box: contentBox(g, number), interactive };
  doc.save();
  if (dx !== 0) doc.translate(dx, 0);
  doc.rect(0, 0, g.size.width, g.size.height).clip();
  page.draw(ctx);
  drawFooter(ctx, page);
  doc.restore();
}

function addOutline(doc: PDFKit.PDFDocument, page: LogicalPage, parent: { current: PDFKit.PDFOutline | null }): void {
  if (!page.outline) return;
  if (page.outline.level === 0 || !parent.current) {
    const item = doc.outline.addItem(page.outline.title);
    if (page.outline.level === 0) parent.current = item;
  } else {
    parent.current.addItem(page.outline.title);
  }
}

export async function renderBook(pages: LogicalPage[], settings: BookSettings, meta: DocumentMeta,
  imposition: 'none' | 'saddle-stitch', filler: () => LogicalPage): Promise<Buffer> {
  const doc = createDocument(meta);
  const g = settings.geometry;
  if (imposition === 'none') {
    const parent = { current: null as PDFKit.PDFOutline | null };
    pages.forEach((page, i) => {
      doc.addPage({ size: [g.size.width, g.size.height], margin: 0 });
      if (page.anchor) doc.addNamedDestination(page.anchor);
      addOutline(doc, page, parent);
      drawLogical(doc, settings, page, i + 1, 0, true);
    });
    return finish(doc);
  }
  const plan = saddleStitchOrder(pages.length);
  const all = [...pages];
  while (all.length < plan.paddedCount) all.push(filler());
  const offset = (g.sheet.width - 2 * g.size.width) / 2; // A5 pair on A4 leaves half a millimetre each side
  for (const sheet of plan.sheets) {
    for (const side of [sheet.front, sheet.back]) {
      doc.addPage({ size: [g.sheet.width, g.sheet.height], margin: 0 });
      drawLogical(doc, settings, all[side.left - 1], side.left, offset, false);
      drawLogical(doc, settings, all[side.right - 1], side.right, offset + g.size.width, false);
      // fold marks at the top and bottom edge, outside the type area
      const fx = offset + g.size.width;
      doc.save().lineWidth(0.4).strokeColor(RULE)
        .moveTo(fx, 0).lineTo(fx, 12).stroke()
        .moveTo(fx, g.sheet.height - 12).lineTo(fx, g.sheet.height).stroke().restore();
    }
  }
  return finish(doc);
}
