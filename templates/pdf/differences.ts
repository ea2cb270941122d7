// The differences table of a secondary port: how its times and heights follow its reference port.
import type { SecondaryStation } from '../../engine/types.js';
import { formatSignedHeight, formatSignedMinutes, unitLabel } from './format.js';
import type { PageContext } from './page.js';
import { unit } from './page.js';
import { DARK, HAIRLINE, MID, RULE } from './style.js';
import { paragraph, put } from './text.js';

export function drawDifferences(ctx: PageContext, st: SecondaryStation, y: number): number {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const units = ctx.settings.units;
  const colW = (box.width - 70 * s) / 4;
  const col = (i: number) => box.x + 70 * s + colW * (i + 1) - 4 * s;
  const head = { font: 'narrow-bold' as const, size: 7.2 * s, color: MID };
  // each group label centred over its two columns (right-aligned cells about 0.6 of a column wide)
  put(doc, 'springs', (col(0) - colW * 0.6 + col(1)) / 2, y, head, 'center');
  put(doc, 'neaps', (col(2) - colW * 0.6 + col(3)) / 2, y, head, 'center');
  y += 10 * s;
  ['time', `height (${unitLabel(units)})`, 'time', `height (${unitLabel(units)})`].forEach((t, i) => {
    put(doc, t, col(i), y, { ...head, font: 'narrow' }, 'right');
  });
  y += 4 * s;
  doc.save().lineWidth(HAIRLINE).strokeColor(RULE).moveTo(box.x, y).lineTo(box.x + box.width, y).stroke().restore();
  y += 10 * s;
  const d = st.differences;
  for (const [label, pair] of [['High water', d.high_water], ['Low water', d.low_water]] as const) {
    put(doc, label, box.x, y, { font: 'narrow-bold', size: 8.2 * s });
    const cells = [formatSignedMinutes(pair.springs.time), formatSignedHeight(pair.springs.height, units),
      formatSignedMinutes(pair.neaps.time), formatSignedHeight(pair.neaps.height, units)];
    cells.forEach((c, i) => put(doc, c, col(i), y, { font: 'regular', size: 8.4 * s }, 'right'));
    y += 12 * s;
  }
  return paragraph(doc, 'Each event of the reference port is moved by these differences, interpolated between '
    + 'springs and neaps by that tide\u2019s range; a + time is later. Times are shifted on the instant, so clock '
    + 'changes never double or drop an event.', box.x, y + 1 * s, box.width,
  { font: 'narrow', size: 7.2 * s, color: DARK }, 9 * s) + 4 * s;
}
