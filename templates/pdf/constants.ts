// The main harmonic constants of a reference port, largest first: what its predictions are made of.
import type { ReferenceStation } from '../../engine/index.js';
import type { PageContext } from './page.js';
import { unit } from './page.js';
import { DARK, MID } from './style.js';
import { put } from './text.js';

export function drawConstants(ctx: PageContext, st: ReferenceStation, y: number, maxCount: number): number {
  const { doc, box } = ctx;
  const s = unit(ctx);
  const w = ctx.settings.words;
  const list = Object.entries(st.constituents)
    .sort((a, b) => b[1].amplitude - a[1].amplitude || a[0].localeCompare(b[0]))
    .slice(0, maxCount);
  const perRow = 3;
  const cellW = box.width / perRow;
  list.forEach(([name, c], i) => {
    const x = box.x + (i % perRow) * cellW;
    const yy = y + Math.floor(i / perRow) * 11.5 * s;
    put(doc, name, x, yy, { font: 'narrow-bold', size: 8 * s });
    put(doc, w.height(c.amplitude), x + cellW * 0.55, yy, { font: 'narrow', size: 8 * s }, 'right');
    put(doc, `${c.phase.toFixed(1)}\u00b0`, x + cellW - 14 * s, yy, { font: 'narrow', size: 8 * s, color: DARK }, 'right');
  });
  const rows = Math.ceil(list.length / perRow);
  const total = Object.keys(st.constituents).length;
  const note = w.t('book.constantsNote', { shown: list.length, count: total, level: w.height(st.mean_level) });
  put(doc, note, box.x, y + rows * 11.5 * s + 1 * s, { font: 'narrow', size: 7 * s, color: MID });
  return y + rows * 11.5 * s + 14 * s;
}
