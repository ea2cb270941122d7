// The foot of every page: the short caution, "invented data" for demo stations, the page number.
import type { LogicalPage, PageContext } from './page.js';
import { unit } from './page.js';
import { INK, MID } from './style.js';
import { artifact } from './tags.js';
import { clipText, put, widthOf, wrapLines } from './text.js';


/** The running foot is decoration to a screen reader: the caution is read in full on the cover and caution page. */
export function drawFooter(ctx: PageContext, page: LogicalPage): void {
  artifact(ctx.doc, () => drawFooterMarks(ctx, page));
}

function drawFooterMarks(ctx: PageContext, page: LogicalPage): void {
  const { doc, box, number } = ctx;
  const s = unit(ctx);
  const recto = number % 2 === 1;
  const top = box.y + box.height + 5 * s;
  doc.save().lineWidth(0.4).strokeColor(MID)
    .moveTo(box.x, top).lineTo(box.x + box.width, top).stroke().restore();

  const numStyle = { font: 'bold' as const, size: 9 * s, color: INK };
  const numWidth = 26 * s;
  put(doc, String(number), recto ? box.x + box.width : box.x, top + 11 * s, numStyle, recto ? 'right' : 'left');

  const size = Math.max(5, 6.2 * s);
  const leading = size * 1.22;
  const textX = recto ? box.x : box.x + numWidth;
  const width = box.width - numWidth;
  const regular = { font: 'narrow' as const, size, color: MID };
  const bold = { font: 'narrow-bold' as const, size, color: INK };
  let y = top + 4 * s + size;

  const label = page.footer.label ? `${clipText(doc, page.footer.label, regular, width * 0.4)} · ` : '';
  const lead = page.footer.invented ? `${ctx.settings.words.t('book.inventedFooter')} ` : '';
  // first line: the bold notice, then the caution continuing on the same line
  const leadWidth = lead ? widthOf(doc, lead, bold) : 0;
  const words = `${label}${ctx.settings.words.cautionShort}`;
  const firstLines = wrapLines(doc, words, regular, width - leadWidth);
  if (lead) put(doc, lead, textX, y, bold);
  const first = firstLines[0] ?? '';
  put(doc, first, textX + leadWidth, y, regular);
  const rest = words.slice(words.indexOf(first) + first.length).trim();
  for (const line of rest ? wrapLines(doc, rest, regular, width) : []) {
    y += leading;
    put(doc, line, textX, y, regular);
  }
}
