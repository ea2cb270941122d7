// The year at a glance: for every month a strip of daily ranges drawn to scale, springs and neaps
// lettered, the moon's quarters above, mean spring and neap ranges as reference lines.
import { inUnits } from '../locale/index.js';
import { clockGlyph, moonGlyph } from './glyphs.js';
import type { LogicalPage } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { DARK, INK, LIGHT, MID, RULE } from './style.js';
import { tag } from './tags.js';
import { paragraph, put, putFitted } from './text.js';

export function overviewPage(view: StationView): LogicalPage {
  const { model } = view;
  return {
    kind: 'overview',
    footer: { invented: model.invented, label: view.name },
    outline: { title: view.words.t('site.glance'), level: 1 },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      const units = ctx.settings.units;
      const w = view.words;
      let y = box.y + 14 * s;
      tag(doc, 'H1', {}, () => put(doc, w.t('book.yearGlance', { year: model.year }), box.x, y, { font: 'bold', size: 16 * s }));
      putFitted(doc, view.name, box.x + box.width, y - 5 * s, { font: 'bold', size: 8.5 * s }, box.width * 0.45, 5 * s, 'right');
      y += 6 * s;
      y = paragraph(doc, w.t('book.glanceHelp', { springs: w.height(model.meanSpringRange), neaps: w.height(model.meanNeapRange),
        springMark: w.t('tide.springMark'), neapMark: w.t('tide.neapMark') }),
      box.x, y + 8 * s, box.width, { font: 'narrow', size: 7.6 * s, color: DARK }, 9.6 * s) + 2 * s;

      const maxRange = Math.max(0.01, model.meanSpringRange, ...model.days.map((d) => d.range ?? 0)) * 1.05;
      const stripH = (box.y + box.height - y) / model.months.length;
      const labelW = 26 * s;
      const scaleW = 18 * s;
      const plotX = box.x + labelW;
      const plotW = box.width - labelW - scaleW;
      const slot = plotW / 31;
      const moonRow = 6 * s;
      const letterRow = 8 * s;
      const barTop = moonRow + 2 * s;
      const barH = stripH - moonRow - letterRow - 3 * s;
      tag(doc, 'Figure', { alt: w.t('book.glanceHelp', { springs: w.height(model.meanSpringRange), neaps: w.height(model.meanNeapRange),
        springMark: w.t('tide.springMark'), neapMark: w.t('tide.neapMark') }) }, () => {
        for (const m of model.months) {
          const base = y + barTop + barH;
          const yr = (r: number) => base - (r / maxRange) * barH;
          put(doc, w.monthShort(m.month), box.x, base - barH / 2 + 3 * s, { font: 'bold', size: 9 * s });
          doc.save().lineWidth(0.5 * s).strokeColor(INK).moveTo(plotX, base).lineTo(plotX + plotW, base).stroke();
          doc.lineWidth(0.5 * s).strokeColor(MID).dash(2 * s, { space: 1.5 * s });
          for (const r of [model.meanSpringRange, model.meanNeapRange]) {
            doc.moveTo(plotX, yr(r)).lineTo(plotX + plotW, yr(r)).stroke();
          }
          doc.undash().restore();
          const scaleStyle = { font: 'narrow' as const, size: 5.6 * s, color: MID };
          put(doc, w.number(inUnits(model.meanSpringRange, units), 1), plotX + plotW + 2 * s, yr(model.meanSpringRange) + 2 * s, scaleStyle);
          put(doc, w.number(inUnits(model.meanNeapRange, units), 1), plotX + plotW + 2 * s, yr(model.meanNeapRange) + 2 * s, scaleStyle);
          const monthDays = model.days.slice(m.firstDayIndex, m.firstDayIndex + m.dayCount);
          for (const [i, d] of monthDays.entries()) {
            const cx = plotX + (i + 0.5) * slot;
            if (d.range !== null) {
              const marked = d.springNeap !== null;
              doc.save().rect(cx - slot * 0.32, yr(d.range), slot * 0.64, base - yr(d.range))
                .fill(marked ? INK : d.offsetChange ? RULE : LIGHT).restore();
            }
            if (d.springNeap) {
              put(doc, w.t(d.springNeap === 'spring' ? 'tide.springMark' : 'tide.neapMark'), cx, base + letterRow, { font: 'bold', size: 7.4 * s }, 'center');
            } else if (d.offsetChange) {
              clockGlyph(doc, cx, base + letterRow - 2.6 * s, 2.6 * s);
            }
            y += stripH;
          }
          y += stripH;
        }
      });
      put(doc, w.unit(), plotX + plotW + 2 * s, box.y + box.height, { font: 'narrow', size: 5.6 * s, color: MID });
    },
  };
}
