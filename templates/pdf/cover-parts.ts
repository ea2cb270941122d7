// Pieces shared by the covers (station book, combined book and its volumes, index volume). A cover reads,
// for a screen reader, in this order: its one heading (the small line above, the year, the title), the
// publisher's logo, what the book holds, the invented-data notice, the cover picture or the guide, the
// publisher and the caution. Bars, rules and the notice's black box are decoration.
import type { PageContext } from './page.js';
import { unit } from './page.js';
import { placePicture } from './place-picture.js';
import { DARK, INK, MID, WHITE } from './style.js';
import { fitLines, put, putFitted, spacedLines, wrapLines, type TextStyle } from './text.js';
import { fitted, type Picture } from './picture.js';
import { tag } from './tags.js';

/** The largest a logo prints on a cover, in design points (A5). */
export const LOGO_BOX = { width: 70, height: 44 };

export interface CoverHeading {
  kicker: string; // the small line at the top, printed in capitals
  kickerWidth: number; // room for it beside the logo
  year: string; // in large figures
  yearColor?: string; // the publisher's accent
  title: string;
  titleStyle: { size: number; lines: number; minSize: number; leading: number };
  gap: number; // design points from the year's baseline to the title's
  section?: boolean; // a station's title page inside a combined book: the heading is the station alone
}

/**
 * The cover's top as one H1: the kicker, the year and the title (a book's cover). On a station's title page
 * inside a combined book the kicker and year read as a paragraph and the H1 is the station's name, so that
 * moving by headings goes station by station. Returns the baseline after the title.
 */
export function coverHeading(ctx: PageContext, h: CoverHeading): number {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const words = ctx.settings.words;
  let y = box.y + 12 * s;
  const title = fitLines(doc, h.title, { font: 'bold', size: h.titleStyle.size * s }, box.width, h.titleStyle.lines, h.titleStyle.minSize * s);
  const top = () => {
    putFitted(doc, `${h.kicker.toLocaleUpperCase(words.tag)} `, box.x, y, { font: 'bold', size: 9 * s, color: MID }, h.kickerWidth, 6.5 * s);
    y += 62 * s;
    put(doc, `${h.year} `, box.x - 3 * s, y, { font: 'bold', size: 70 * s, color: h.yearColor ?? INK });
    y += h.gap * s;
  };
  const name = () => { for (const line of spacedLines(title.lines)) { put(doc, line, box.x, y, title.style); y += title.style.size * h.titleStyle.leading; } };
  if (h.section) {
    tag(doc, 'P', {}, top);
    tag(doc, 'H1', {}, name);
  } else {
    tag(doc, 'H1', {}, () => { top(); name(); });
  }
  return y;
}

/** The room the top line leaves beside the publisher's logo (top right of a cover). */
export function besideLogo(ctx: PageContext, logo: Picture | undefined): number {
  if (logo === undefined) return ctx.box.width;
  const s = unit(ctx);
  return ctx.box.width - fitted(logo.pixels, LOGO_BOX.width * s, LOGO_BOX.height * s).width - 8 * s;
}

/** The publisher's logo in the top right corner of a cover, as a figure named after the publisher. */
export function drawLogo(ctx: PageContext, logo: Picture | undefined, publisher?: string): void {
  if (logo === undefined) return;
  const { doc, box } = ctx;
  const s = unit(ctx);
  const size = fitted(logo.pixels, LOGO_BOX.width * s, LOGO_BOX.height * s);
  tag(doc, 'Figure', { alt: publisher ? `Logo of ${publisher}` : 'Logo of the publisher' },
    () => placePicture(doc, ctx.settings, logo, box.x + box.width - size.width, box.y, size.width, size.height));
}

/** A bar of the publisher's colour above the top line. */
export function accentBar(ctx: PageContext, accent: string | undefined): void {
  if (accent === undefined) return;
  const { doc, box } = ctx;
  const s = unit(ctx);
  doc.save().rect(box.x, box.y - 2 * s, 36 * s, 3.2 * s).fill(accent).restore();
}

/** The black "invented data" banner, its two lines one paragraph; returns the y below it. */
export function inventedBanner(ctx: PageContext, y: number): number {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const h = 30 * s;
  doc.save().rect(box.x, y, box.width, h).fill(INK).restore();
  tag(doc, 'P', {}, () => {
    putFitted(doc, `${ctx.settings.words.t('book.inventedBanner')} `, box.x + 10 * s, y + 13 * s, { font: 'bold', size: 11 * s, color: WHITE },
      box.width - 20 * s, 7 * s);
    putFitted(doc, ctx.settings.words.t('book.inventedBannerText'),
      box.x + 10 * s, y + 24 * s, { font: 'narrow', size: 7.5 * s, color: WHITE }, box.width - 20 * s, 5 * s);
  });
  return y + h;
}

/** The full caution at the foot of a cover with the publisher above it: where it starts, and drawing it. */
export interface CautionFoot { top: number; draw(): void }

/** Lays out the caution at the cover's foot; `draw` it after what reads before it (the picture above it). */
export function cautionFoot(ctx: PageContext, caution: string, publisher?: string): CautionFoot {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const style: TextStyle = { font: 'regular', size: 7.6 * s, color: DARK };
  const lead = 9.6 * s;
  const lines = wrapLines(doc, caution, style, box.width);
  const first = box.y + box.height - (lines.length - 1) * lead - 4 * s;
  const ruleY = first - 12 * s;
  return {
    top: publisher ? ruleY - 20 * s : ruleY,
    draw() {
      if (publisher) putFitted(doc, publisher, box.x, ruleY - 8 * s, { font: 'bold', size: 9.5 * s }, box.width, 6 * s);
      doc.save().lineWidth(0.6 * s).strokeColor(INK).moveTo(box.x, ruleY).lineTo(box.x + box.width, ruleY).stroke().restore();
      let y = first;
      tag(doc, 'P', {}, () => { for (const line of spacedLines(lines)) { put(doc, line, box.x, y, style); y += lead; } }); // one paragraph, however it wraps
    },
  };
}

/** The publisher's cover picture filling the free band from `top` to `bottom` (cropped to it, centred). */
export function coverImage(ctx: PageContext, picture: Picture, top: number, bottom: number, publisher?: string): void {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const h = Math.min(bottom - top, 190 * s);
  if (h < 40 * s) return; // no room worth a picture on this format
  const k = Math.max(box.width / picture.pixels.width, h / picture.pixels.height);
  const w = picture.pixels.width * k;
  const ih = picture.pixels.height * k;
  tag(doc, 'Figure', { alt: publisher ? `Cover picture of ${publisher}` : 'Cover picture' }, () => {
    doc.save().rect(box.x, top, box.width, h).clip();
    placePicture(doc, ctx.settings, picture, box.x - (w - box.width) / 2, top - (ih - h) / 2, w, ih); // of which the band shows a part
    doc.restore();
  });
}
