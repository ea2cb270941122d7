// A tide staff drawn to scale beside the datums table: each datum a line at its true height, the
// chart datum heavy, labels spread apart where datums lie close together.
import { itemAt, type Datums } from '../../engine/index.js';
import type { Box } from './geometry.js';
import { inUnits, type Words } from '../locale/index.js';
import type { HeightUnits } from './options.js';
import { INK, MID, WHITE } from './style.js';
import { put, putFitted } from './text.js';

// The levels in height order, named in the reader's language by the catalogue (`datum.HAT` …).
export const DATUM_ROWS: { key: keyof Omit<Datums, 'epoch'> }[] = [
  { key: 'HAT' }, { key: 'MHWS' }, { key: 'MHWN' }, { key: 'MSL' }, { key: 'MLWN' }, { key: 'MLWS' }, { key: 'LAT' },
];

/** Spreads label positions (sorted top to bottom) so neighbours are at least `gap` apart. */
export function spreadLabels(ys: readonly number[], gap: number): number[] {
  const pushDown = (list: readonly number[]) => {
    let above = -Infinity;
    return list.map((y) => (above = Math.max(y, above + gap)));
  };
  const down = pushDown(ys);
  // pull the stack back up around its centre so it does not only grow downwards
  const shift = ((down.at(-1) ?? 0) - (ys.at(-1) ?? 0)) / 2;
  return shift > 0 ? pushDown(down.map((y) => y - shift)) : down;
}

function staffStep(span: number, units: HeightUnits): number {
  if (units === 'ft') return span > 24 ? 5 : span > 10 ? 2 : 1;
  return span > 8 ? 2 : span > 3 ? 1 : 0.5;
}

export function drawDatumScale(doc: PDFKit.PDFDocument, datums: Datums, datumLabel: string, words: Words,
  box: Box, s: number): void {
  const units = words.units;
  // every datum and the chart datum inside the staff, even if the model's datums are out of order
  const values = DATUM_ROWS.map((r) => inUnits(datums[r.key], units));
  const lo = Math.min(0, ...values);
  const hi = Math.max(0, ...values);
  const step = staffStep(Math.max(hi - lo, 1e-6), units);
  const bottom = Math.floor(lo / step - 0.5) * step;
  const top = Math.ceil(hi / step + 0.25) * step;
  const y = (v: number) => box.y + box.height - ((v - bottom) / (top - bottom)) * box.height;

  const staffX = box.x + 20 * s;
  const staffW = 8 * s;
  doc.save().lineWidth(0.5 * s).strokeColor(INK);
  for (let v = bottom, i = 0; v < top - 1e-9; v += step, i++) {
    doc.rect(staffX, y(v + step), staffW, y(v) - y(v + step)).fillAndStroke(i % 2 === 0 ? INK : WHITE, INK);
  }
  doc.restore();
  const tick = { font: 'narrow' as const, size: 6.5 * s, color: MID };
  for (let v = bottom; v <= top + 1e-9; v += step) {
    const label = Math.abs(v) < 1e-9 ? '0' : words.number(v, Number.isInteger(Math.round(v * 100) / 100) ? 0 : Number.isInteger(Math.round(v * 10) / 10) ? 1 : 2);
    put(doc, label, staffX - 3 * s, y(v) + 2.2 * s, tick, 'right');
  }

  const rows: { label: string; v: number; zero: boolean }[] = DATUM_ROWS.map((r) => ({ label: r.key as string, v: inUnits(datums[r.key], units), zero: false }));
  rows.push({ label: datumLabel, v: 0, zero: true });
  rows.sort((a, b) => b.v - a.v);
  const lineEnd = staffX + staffW + 14 * s;
  const labelX = lineEnd + 10 * s;
  const ys = spreadLabels(rows.map((r) => y(r.v)), 8.2 * s);
  rows.forEach((r, i) => {
    const isDatum = r.zero;
    const ly = y(r.v);
    const labelY = itemAt(ys, i, 'datum label positions'); // one position per row, by spreadLabels
    doc.save().lineWidth(isDatum ? 1.6 * s : 0.6 * s).strokeColor(INK)
      .moveTo(staffX - (isDatum ? 2 * s : 0), ly).lineTo(lineEnd, ly)
      .lineTo(lineEnd + 6 * s, labelY).lineTo(labelX - 1.5 * s, labelY).stroke().restore();
    putFitted(doc, r.label, labelX, labelY + 2.4 * s,
      { font: isDatum ? 'narrow-bold' : 'narrow', size: 7 * s }, box.x + box.width - labelX, 5 * s);
  });
  put(doc, words.unitName(), staffX + staffW / 2, box.y - 5 * s,
    { font: 'narrow', size: 6.5 * s, color: MID }, 'center');
}
