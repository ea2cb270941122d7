// The caution page: the model's caution in full, then a key to every mark used on the month pages,
// each drawn with the same code that draws it on the months.
import type { MoonPhaseName } from '../../engine/index.js';
import { firstOf } from '../../engine/index.js';
import { drawDayCurve } from './day-curve.js';
import { printable } from './format.js';
import { belowDatumMark, clockGlyph, laneMark, moonGlyph, springNeapBadge, sunGlyph, sunGlyphWidth } from './glyphs.js';
import { contentBox } from './geometry.js';
import { columns, monthUnit } from './month-layout.js';
import type { LogicalPage, PageContext } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { DARK, FAINT, INK } from './style.js';
import { artifact, group, tag } from './tags.js';
import { paragraph, put, spacedLines, wrapLines } from './text.js';

type KeyItem = { draw: (x: number, baseline: number) => void; text: string };

/**
 * What the spring mark means, with both numbers: the age of the tide from the constants and the mean
 * lag of this year's marks, which the Moon's distance (perigee) moves away from the age.
 */
export function springKeyText(view: Pick<StationView, 'model' | 'words'>, combined: boolean): string {
  const { ageOfTideHours: age, springLagHours: lag } = view.model;
  const w = view.words;
  if (combined || lag === null) return w.t('key.springEach');
  return w.t('key.springLag', { lag: w.hours(lag), age: w.hours(age) });
}

function keyItems(ctx: PageContext, view: StationView, mixed: boolean, combined: boolean): KeyItem[] {
  const { doc } = ctx;
  const s = unit(ctx);
  const words = ctx.settings.words;
  const t = (font: 'narrow' | 'narrow-bold', x: number, y: number, text: string, size = 9.4) =>
    x + put(doc, text, x, y, { font, size: size * s });
  const sampleLow = -0.12;
  const spring = view.model.days.find((d) => d.springNeap === 'spring') ?? firstOf(view.model.days, 'days of the year');
  const g = ctx.settings.geometry;
  const curves = columns(contentBox(g, 1), monthUnit(g)).curve !== null; // small pages leave the curve out
  const items: (KeyItem | null)[] = [
    { text: words.t('key.high'),
      draw: (x, y) => { laneMark(doc, 'high', x, y, 7.5 * s); t('narrow', t('narrow-bold', x + 8 * s, y, '06:29') + 2.5 * s, y, words.heightNumber(4.54), 8.6); } },
    { text: words.t('key.low'),
      draw: (x, y) => { laneMark(doc, 'low', x, y, 7.5 * s); t('narrow', t('narrow', x + 8 * s, y, '12:17') + 2.5 * s, y, words.heightNumber(0.19), 8.6); } },
    { text: words.t('key.below', { datum: printable(view.model.station.datum) }),
      draw: (x, y) => {
        laneMark(doc, 'low', x, y, 7.5 * s);
        const hx = t('narrow', x + 8 * s, y, '03:12') + 2.5 * s;
        const w = put(doc, words.heightNumber(sampleLow, true), hx, y, { font: 'narrow-bold', size: 8.9 * s });
        belowDatumMark(doc, hx + w + 0.8 * s, y, 8.6 * s);
        doc.save().lineWidth(0.7 * s).moveTo(hx, y + 1.4 * s).lineTo(hx + w, y + 1.4 * s).stroke(INK).restore();
      } },
    { text: springKeyText(view, combined),
      draw: (x, y) => springNeapBadge(doc, 'spring', x + 7 * s, y - 3.5 * s, 14 * s, 18 * s, 10.5 * s, words.t('tide.springMark')) },
    { text: words.t('key.neap'),
      draw: (x, y) => springNeapBadge(doc, 'neap', x + 7 * s, y - 3.5 * s, 14 * s, 18 * s, 10.5 * s, words.t('tide.neapMark')) },
    // A book with stations on both sides of the equator shows both hemispheres' glyphs, one line each.
    ...(mixed ? [false, true] : [view.southern]).map((southern) => ({
      text: words.t(southern ? 'key.moonSouth' : 'key.moonNorth'),
      draw: (x: number, y: number) => (['new', 'first-quarter', 'full', 'last-quarter'] as MoonPhaseName[]).forEach((p, i) =>
        moonGlyph(doc, p, x + 5 * s + i * 13 * s, y - 3.5 * s, 4.6 * s, southern)),
    })),
    curves ? { text: words.t('key.curve'),
      draw: (x: number, y: number) => drawDayCurve(doc, spring, { x, y: y - 14 * s, width: 48 * s, height: 20 * s }, view.curve, s) } : null,
    { text: words.t('key.sun', { up: words.t('sun.upAllDay'), down: words.t('sun.downAllDay') }),
      draw: (x, y) => { sunGlyph(doc, true, x, y, 7.4 * s); const w = sunGlyphWidth(7.4 * s); t('narrow', x + w + 1.5 * s, y, '07:12', 7.4);
        sunGlyph(doc, false, x + 34 * s, y, 7.4 * s); t('narrow', x + 34 * s + w + 1.5 * s, y, '19:03', 7.4); } },
    { text: words.t('key.clock'),
      draw: (x, y) => clockGlyph(doc, x + 5 * s, y - 3.5 * s, 4.8 * s) },
    { text: words.t('key.weekend'),
      draw: (x, y) => { doc.save().rect(x, y - 12 * s, 30 * s, 16 * s).fill(FAINT).restore(); put(doc, words.weekdayShort(6), x + 15 * s, y, { font: 'narrow-bold', size: 7 * s }, 'center'); } },
  ];
  return items.filter((item): item is KeyItem => item !== null);
}

/** For a combined book: `mixedHemispheres` when its stations lie both north and south of the equator. */
export interface CautionScope { combined: boolean; mixedHemispheres: boolean }

export function cautionPage(view: StationView, scope: CautionScope = { combined: false, mixedHemispheres: false }): LogicalPage {
  const { mixedHemispheres } = scope;
  const { model } = view;
  return {
    kind: 'caution',
    footer: { invented: model.invented },
    outline: { title: view.words.t('book.cautionAndKey'), level: 1 },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      let y = box.y + 14 * s;
      tag(doc, 'H1', {}, () => put(doc, view.words.t('caution.heading'), box.x, y, { font: 'bold', size: 16 * s }));
      y += 18 * s;
      const barTop = y - 10 * s;
      y = paragraph(doc, ctx.settings.words.caution, box.x + 9 * s, y, box.width - 9 * s, { font: 'regular', size: 10 * s }, 13.4 * s);
      if (model.invented) {
        y = paragraph(doc, view.words.t('book.inventedCaution'),
          box.x + 9 * s, y + 2 * s, box.width - 9 * s, { font: 'bold', size: 10 * s }, 13.4 * s);
      }
      doc.save().rect(box.x, barTop, 3 * s, y - barTop - 8 * s).fill(INK).restore();
      y += 4 * s;
      y = paragraph(doc, view.words.t('book.timesHeights', { unit: view.words.unitName(), datum: printable(model.station.datum) }),
      box.x, y, box.width, { font: 'regular', size: 8.4 * s, color: DARK }, 11 * s);

      const derived = model.station.kind === 'secondary' || scope.combined
        ? `${view.words.t('book.secondaryNote')} `
        : '';
      y = paragraph(doc, `${derived}${view.words.t('book.springNeapNote')}`,
      box.x, y + 3 * s, box.width, { font: 'regular', size: 8.4 * s, color: DARK }, 11 * s);

      y += 10 * s;
      tag(doc, 'H2', {}, () => put(doc, view.words.t('book.howToRead'), box.x, y, { font: 'bold', size: 11.5 * s }));
      y += 8 * s;
      const textX = box.x + 74 * s;
      const items = keyItems(ctx, view, mixedHemispheres, scope.combined);
      // the key must end above the footer: on small pages rows close up, then the type steps down
      const layout = (size: number, gap: number) => {
        const style = { font: 'narrow' as const, size, color: DARK };
        const rows = items.map((item) => ({ item, lines: wrapLines(doc, item.text, style, box.x + box.width - textX) }));
        const sized = rows.map((r) => ({ ...r, height: Math.max(17 * s, r.lines.length * size * 1.22 + gap) }));
        return { style, rows: sized, total: sized.reduce((a, r) => a + r.height, 0) };
      };
      const room = box.y + box.height - y - 6 * s;
      let plan = layout(8.2 * s, 10 * s);
      if (plan.total > room) plan = layout(8.2 * s, 4 * s);
      if (plan.total > room) plan = layout(7.2 * s, 3 * s);
      const lead = plan.style.size * 1.22;
      // a list: each item's sample mark is decoration, its words the item's body (one paragraph however it wraps)
      group(doc, 'L', {}, () => {
        for (const { item, lines, height } of plan.rows) {
          // the words and the sample both centred in the item's row, so a long item never rises into the one above
          const centre = y + height / 2;
          const base = centre + 0.35 * plan.style.size;
          group(doc, 'LI', {}, () => {
            artifact(doc, () => item.draw(box.x, base));
            tag(doc, 'LBody', {}, () => spacedLines(lines).forEach((line, i) => put(doc, line, textX, base + (i - (lines.length - 1) / 2) * lead, plan.style)));
          });
          y += height;
        }
      });
    },
  };
}
