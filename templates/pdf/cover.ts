// The cover of a station book, also used (as a section title page) for each station of a combined
// book: station, year, position, datum, the kind of port, a real fortnight of its tide, the caution.
import { firstOf, lastOf } from '../../engine/index.js';
import { accentBar, besideLogo, cautionFoot, coverHeading, coverImage, drawLogo, inventedBanner } from './cover-parts.js';
import { printable } from './format.js';
import type { LogicalPage, PageContext } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { DARK, INK, LIGHT, MID } from './style.js';
import { group, tag } from './tags.js';
import { paragraph, put, putFitted } from './text.js';
import type { Picture } from './picture.js';

export interface GuideEntry { label: string; page: number }

export interface CoverText {
  kicker: string; // the small line above the year
  publisher?: string;
  guide?: { parts: GuideEntry[]; months: GuideEntry[] }; // where things are, filled in once laid out
  logo?: Picture; // the publisher's logo, top right of the cover
  coverImage?: Picture; // the publisher's photo or drawing, in the cover's free space
  accent?: string; // the publisher's colour: the year and a bar above it
}

/** "In this book": the parts and the first page of each month, if the space allows. */
function drawGuide(ctx: PageContext, guide: NonNullable<CoverText['guide']>, top: number, bottom: number): void {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const line = 10.8 * s;
  const monthRows = Math.ceil(guide.months.length / 3);
  if (bottom - top < (2.2 + 1 + monthRows) * line) return;
  put(doc, ctx.settings.words.t('book.inThisBook').toLocaleUpperCase(ctx.settings.words.tag), box.x, top, { font: 'bold', size: 7.5 * s, color: MID });
  let y = top + line * 1.2;
  const colW = box.width / 3;
  // each entry, its name and page, one item of the book's table of contents
  const cell = (e: GuideEntry, i: number, yy: number) => tag(doc, 'TOCI', {}, () => {
    const x = box.x + (i % 3) * colW;
    put(doc, `${e.label} `, x, yy, { font: 'regular', size: 8.6 * s }); // read as "January 4", not "January4"
    put(doc, String(e.page), x + colW - 12 * s, yy, { font: 'bold', size: 8.6 * s }, 'right');
  });
  group(doc, 'TOC', {}, () => {
    guide.parts.forEach((e, i) => cell(e, i, y + Math.floor(i / 3) * line));
    y += Math.ceil(guide.parts.length / 3) * line + 3 * s;
    guide.months.forEach((e, i) => cell(e, i, y + Math.floor(i / 3) * line));
  });
}

/** Two weeks of the tide drawn wide: the station's own curve for its first fortnight. */
function drawFortnight(ctx: PageContext, view: StationView, x: number, y: number, w: number, h: number): void {
  const { doc } = ctx;
  const s = unit(ctx);
  const days = view.model.days.slice(0, 14);
  const heights = days.flatMap((d, i) => (i === 0 ? d.curve : d.curve.slice(1)));
  if (heights.length < 2) return;
  const { low, high } = view.curve;
  const px = (i: number) => x + (i / (heights.length - 1)) * w;
  const py = (v: number) => y + h - ((v - low) / (high - low)) * h;
  doc.save();
  doc.moveTo(px(0), y + h);
  heights.forEach((v, i) => doc.lineTo(px(i), py(v)));
  doc.lineTo(px(heights.length - 1), y + h).closePath().fill(LIGHT);
  doc.moveTo(px(0), py(firstOf(heights, 'fortnight heights')));
  heights.forEach((v, i) => doc.lineTo(px(i), py(v)));
  doc.lineWidth(1.1 * s).strokeColor(INK).stroke();
  doc.lineWidth(0.5 * s).strokeColor(INK).moveTo(x, y + h).lineTo(x + w, y + h).stroke();
  doc.restore();
  const first = firstOf(days, 'fortnight days').date;
  const last = lastOf(days, 'fortnight days').date;
  put(doc, view.words.t('book.fortnight', { from: view.words.date(first, { year: false }), to: view.words.date(last) }), x, y + h + 10 * s,
    { font: 'narrow', size: 7 * s, color: MID });
}

export function coverPage(view: StationView, text: CoverText, kind: 'cover' | 'section'): LogicalPage {
  const { model } = view;
  return {
    kind,
    footer: { invented: model.invented },
    outline: kind === 'section' ? { title: view.name, level: 0 } : undefined,
    anchor: kind === 'section' ? `station-${model.station.id}` : undefined,
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      const cover = kind === 'cover';
      if (cover) accentBar(ctx, text.accent);
      let y = coverHeading(ctx, { kicker: text.kicker, kickerWidth: cover ? besideLogo(ctx, text.logo) : box.width, year: String(model.year),
        ...(text.accent !== undefined && { yearColor: text.accent }), title: view.name, gap: 38, section: !cover,
        titleStyle: { size: 25, lines: 4, minSize: 9, leading: 1.16 } });
      if (cover) drawLogo(ctx, text.logo, text.publisher);
      y += 4 * s;
      const station = model.station;
      const kindLine = station.kind === 'secondary'
        ? view.words.t('book.secondaryFrom', { station: printable(model.reference?.name ?? station.reference) })
        : view.words.t('book.referenceOwn');
      putFitted(doc, kindLine, box.x, y, { font: 'regular', size: 10 * s, color: DARK }, box.width, 6 * s);
      y += 20 * s;

      const facts: [string, string][] = [
        [view.words.t('fact.position'), view.words.position(station.position)],
        [view.words.t('book.heightsAbove'), printable(station.datum)],
        [view.words.t('fact.localTime'), view.words.zoneSummary(model)],
      ];
      // read as a two-column table, each label the header of its row (as on the facts page)
      group(doc, 'Table', {}, () => {
        for (const [k, v] of facts) {
          group(doc, 'TR', {}, () => {
            tag(doc, 'TH', { scope: 'Row' }, () => putFitted(doc, k, box.x, y, { font: 'narrow', size: 8.5 * s, color: MID }, 58 * s, 5.5 * s));
            // the value wraps onto a second line rather than shrinking out of reach (a zone described in words)
            y = tag(doc, 'TD', {}, () => paragraph(doc, v, box.x + 62 * s, y, box.width - 62 * s, { font: 'regular', size: 9.5 * s }, 11.5 * s, 2)) + 2.5 * s;
          });
        }
      });

      y += 16 * s;
      tag(doc, 'Figure', { alt: `The predicted tide at ${view.name} over the first two weeks of ${model.year}, drawn as a curve.` },
        () => drawFortnight(ctx, view, box.x, y, box.width, 70 * s));
      y += 70 * s + 26 * s;

      if (model.invented) y = inventedBanner(ctx, y) + 20 * s;
      const foot = cautionFoot(ctx, view.words.caution, text.publisher);
      if (cover && text.coverImage) coverImage(ctx, text.coverImage, y - 6 * s, foot.top - 4 * s, text.publisher);
      else if (text.guide) drawGuide(ctx, text.guide, y, foot.top - 4 * s);
      foot.draw();
    },
  };
}
