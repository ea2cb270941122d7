// The small tide curve of one day: heights from the model's curve, night shaded from sunset to
// sunrise, chart datum dashed, water below chart datum filled solid.
import type { DayEntry } from '../../engine/index.js';
import { instant } from '../locale/index.js';
import { darkSpans } from '../night.js';
import type { Box } from './geometry.js';
import { INK, LIGHT, NIGHT } from './style.js';

export function dayStartMs(day: DayEntry): number {
  return instant(day.start);
}

/** Night intervals of the day as fractions [from, to] of the day. */
export function nightSpans(day: DayEntry): [number, number][] {
  const start = dayStartMs(day);
  const len = instant(day.end) - start;
  return darkSpans(day, (iso) => (instant(iso) - start) / len, 1);
}

export interface CurveScale { low: number; high: number }

export function drawDayCurve(doc: PDFKit.PDFDocument, day: DayEntry, box: Box, scale: CurveScale, u: number): void {
  const n = day.curve.length;
  if (n < 2) return;
  const y = (h: number) => box.y + box.height - ((h - scale.low) / (scale.high - scale.low)) * box.height;
  const x = (i: number) => box.x + (i / (n - 1)) * box.width;

  doc.save();
  for (const [a, b] of nightSpans(day)) {
    doc.rect(box.x + a * box.width, box.y, (b - a) * box.width, box.height).fill(NIGHT);
  }
  doc.lineWidth(0.3 * u).strokeColor(LIGHT);
  for (const f of [0.25, 0.5, 0.75]) {
    const gx = box.x + f * box.width;
    doc.moveTo(gx, box.y).lineTo(gx, box.y + box.height).stroke();
  }
  const zero = y(0);
  const showZero = scale.low < 0;
  if (showZero && day.curve.some((h) => h < 0)) {
    // water below chart datum: solid fill between the curve and the datum line
    doc.save().rect(box.x, zero, box.width, box.y + box.height - zero).clip();
    doc.moveTo(x(0), zero);
    day.curve.forEach((h, i) => doc.lineTo(x(i), y(h)));
    doc.lineTo(x(n - 1), zero).closePath().fill(INK);
    doc.restore();
  }
  if (showZero) {
    doc.lineWidth(0.4 * u).strokeColor(INK).dash(1.2 * u, { space: 1.2 * u })
      .moveTo(box.x, zero).lineTo(box.x + box.width, zero).stroke().undash();
  }
  day.curve.forEach((h, i) => (i === 0 ? doc.moveTo(x(i), y(h)) : doc.lineTo(x(i), y(h))));
  doc.lineWidth(0.9 * u).lineJoin('round').strokeColor(INK).stroke();
  doc.restore();
}
