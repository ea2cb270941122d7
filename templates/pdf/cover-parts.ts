// Pieces shared by the station cover and the combined book's cover.
import type { PageContext } from './page.js';
import { unit } from './page.js';
import { checkImageResolution } from './image-resolution.js';
import { DARK, INK, WHITE } from './style.js';
import { put, putFitted, wrapLines } from './text.js';
import type { Picture } from './picture.js';
import { tag } from './tags.js';

/** The black "invented data" banner; returns the y below it. */
export function inventedBanner(ctx: PageContext, y: number): number {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const h = 30 * s;
  doc.save().rect(box.x, y, box.width, h).fill(INK).restore();
  putFitted(doc, ctx.settings.words.t('book.inventedBanner'), box.x + 10 * s, y + 13 * s, { font: 'bold', size: 11 * s, color: WHITE },
    box.width - 20 * s, 7 * s);
  putFitted(doc, ctx.settings.words.t('book.inventedBannerText'),
    box.x + 10 * s, y + 24 * s, { font: 'narrow', size: 7.5 * s, color: WHITE }, box.width - 20 * s, 5 * s);
  return y + h;
}

/** The full caution at the foot of a cover, with the publisher above it; returns its top. */
export function cautionBlock(ctx: PageContext, caution: string, publisher?: string): number {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const style = { font: 'regular' as const, size: 7.6 * s, color: DARK };
  const lead = 9.6 * s;
  const lines = wrapLines(doc, caution, style, box.width);
  let y = box.y + box.height - (lines.length - 1) * lead - 4 * s;
  const ruleY = y - 12 * s;
  if (publisher) putFitted(doc, publisher, box.x, ruleY - 8 * s, { font: 'bold', size: 9.5 * s }, box.width, 6 * s);
  doc.save().lineWidth(0.6 * s).strokeColor(INK).moveTo(box.x, ruleY).lineTo(box.x + box.width, ruleY).stroke().restore();
  tag(doc, 'P', {}, () => { for (const line of lines) { put(doc, line, box.x, y, style); y += lead; } }); // one paragraph, however it wraps
  return publisher ? ruleY - 20 * s : ruleY;
}

/** The publisher's cover picture filling the free band from `top` to `bottom` (cropped to it, centred). */
export function coverImage(ctx: PageContext, picture: Picture, top: number, bottom: number): void {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const h = Math.min(bottom - top, 190 * s);
  if (h < 40 * s) return; // no room worth a picture on this format
  const k = Math.max(box.width / picture.pixels.width, h / picture.pixels.height);
  const w = picture.pixels.width * k;
  const ih = picture.pixels.height * k;
  checkImageResolution(ctx.settings.warn, picture, w, ih); // printed at w × ih, of which the band shows a part
  tag(doc, 'Figure', { alt: 'Cover picture' }, () => {
    doc.save().rect(box.x, top, box.width, h).clip();
    doc.image(picture.data, box.x - (w - box.width) / 2, top - (ih - h) / 2, { width: w, height: ih });
    doc.restore();
  });
}
