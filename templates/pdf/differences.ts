// The differences table of a secondary port: how its times and heights follow its reference port.
import type { SecondaryStation } from '../../engine/index.js';
import type { PageContext } from './page.js';
import { unit } from './page.js';
import { DARK, HAIRLINE, MID, RULE } from './style.js';
import { paragraph, put } from './text.js';

export function drawDifferences(ctx: PageContext, st: SecondaryStation, y: number): number {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const w = ctx.settings.words;
  const colW = (box.width - 70 * s) / 4;
  const col = (i: number) => box.x + 70 * s + colW * (i + 1) - 4 * s;
  const head = { font: 'narrow-bold' as const, size: 7.2 * s, color: MID };
  // each group label centred over its two columns (right-aligned cells about 0.6 of a column wide)
  put(doc, w.t('tide.springsLower'), (col(0) - colW * 0.6 + col(1)) / 2, y, head, 'center');
  put(doc, w.t('tide.neapsLower'), (col(2) - colW * 0.6 + col(3)) / 2, y, head, 'center');
  y += 10 * s;
  [w.t('diff.time'), w.t('diff.height', { unit: w.unit() }), w.t('diff.time'), w.t('diff.height', { unit: w.unit() })].forEach((t, i) => {
    put(doc, t, col(i), y, { ...head, font: 'narrow' }, 'right');
  });
  y += 4 * s;
  doc.save().lineWidth(HAIRLINE).strokeColor(RULE).moveTo(box.x, y).lineTo(box.x + box.width, y).stroke().restore();
  y += 10 * s;
  const d = st.differences;
  for (const [label, pair] of [[w.eventName('high'), d.high_water], [w.eventName('low'), d.low_water]] as const) {
    put(doc, label, box.x, y, { font: 'narrow-bold', size: 8.2 * s });
    const cells = [w.minutesSigned(pair.springs.time), w.heightSigned(pair.springs.height),
      w.minutesSigned(pair.neaps.time), w.heightSigned(pair.neaps.height)];
    cells.forEach((c, i) => put(doc, c, col(i), y, { font: 'regular', size: 8.4 * s }, 'right'));
    y += 12 * s;
  }
  return paragraph(doc, w.t('book.differencesNote'), box.x, y + 1 * s, box.width,
  { font: 'narrow', size: 7.2 * s, color: DARK }, 9 * s) + 4 * s;
}
