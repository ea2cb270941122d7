// A ruled page for the reader's notes: fills the space before a month that must open on a spread,
// and pads a saddle-stitched booklet to a multiple of four pages.
import type { FooterInfo, LogicalPage } from './page.js';
import { unit } from './page.js';
import { LIGHT } from './style.js';
import { tag } from './tags.js';
import { put } from './text.js';

export function notesPage(footer: FooterInfo): LogicalPage {
  return {
    kind: 'notes',
    footer,
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      tag(doc, 'H1', {}, () => put(doc, ctx.settings.words.t('book.notes'), box.x, box.y + 14 * s, { font: 'bold', size: 14 * s }));
      doc.save().lineWidth(0.4 * s).strokeColor(LIGHT);
      for (let y = box.y + 42 * s; y < box.y + box.height - 4 * s; y += 20 * s) {
        doc.moveTo(box.x, y).lineTo(box.x + box.width, y).stroke();
      }
      doc.restore();
    },
  };
}
