// The book's own vector marks: moon phases, spring and neap badges, the below-datum mark, lane
// triangles, sunrise/sunset and clock-change signs. All drawn as paths, none taken from a font.
import type { MoonPhaseName, SpringNeapKind } from '../../engine/index.js';
import { INK, WHITE } from './style.js';
import { put, putFitted } from './text.js';

/** Half of a disc as an SVG path: the left half when `left`, else the right half. */
function halfDisc(cx: number, cy: number, r: number, left: boolean): string {
  return `M ${cx} ${cy - r} A ${r} ${r} 0 0 ${left ? 0 : 1} ${cx} ${cy + r} Z`;
}

/**
 * The moon at a quarter as seen from the station's hemisphere (north: the waxing moon is lit on the
 * right; south: on the left). Dark part filled, lit part white, ring around.
 */
export function moonGlyph(doc: PDFKit.PDFDocument, phase: MoonPhaseName, cx: number, cy: number, r: number,
  southern = false): void {
  doc.save();
  const ring = Math.max(0.6, r * 0.16);
  doc.lineWidth(ring).strokeColor(INK);
  if (phase === 'new') {
    doc.circle(cx, cy, r).fillAndStroke(INK, INK);
  } else if (phase === 'full') {
    doc.circle(cx, cy, r).fillColor(WHITE).lineWidth(ring * 1.5).fillAndStroke(WHITE, INK);
  } else {
    const waxing = phase === 'first-quarter';
    const darkLeft = waxing !== southern; // first quarter in the north: left half dark
    doc.circle(cx, cy, r).fill(WHITE);
    doc.path(halfDisc(cx, cy, r, darkLeft)).fill(INK);
    doc.circle(cx, cy, r).stroke(INK);
  }
  doc.restore();
}

/** A spring (solid black, white S) or neap (white, black frame, N) badge centred on (cx, cy). */
export function springNeapBadge(doc: PDFKit.PDFDocument, kind: SpringNeapKind, cx: number, cy: number,
  width: number, height: number, letterSize: number, letter: string): void {
  const x = cx - width / 2;
  const y = cy - height / 2;
  const radius = Math.min(width, height) * 0.18;
  doc.save();
  if (kind === 'spring') {
    doc.roundedRect(x, y, width, height, radius).fill(INK);
  } else {
    const lw = Math.max(0.9, width * 0.09);
    doc.lineWidth(lw).roundedRect(x + lw / 2, y + lw / 2, width - lw, height - lw, radius).fillAndStroke(WHITE, INK);
  }
  doc.restore();
  putFitted(doc, letter, cx, cy + letterSize * 0.36, {
    font: 'bold', size: letterSize, color: kind === 'spring' ? WHITE : INK,
  }, width * 0.9, letterSize * 0.3, 'center');
}

/** A solid downward triangle: marks a height below chart datum (drawn after the number). */
export function belowDatumMark(doc: PDFKit.PDFDocument, x: number, baseline: number, size: number): void {
  const w = size * 0.62;
  const h = size * 0.58;
  const top = baseline - size * 0.66;
  doc.save().polygon([x, top], [x + w, top], [x + w / 2, top + h]).fill(INK).restore();
}

/** Small lane markers: a filled up-triangle for high water, an open down-triangle for low water. */
export function laneMark(doc: PDFKit.PDFDocument, type: 'high' | 'low', x: number, baseline: number,
  size: number): void {
  const w = size * 0.55;
  const h = size * 0.48;
  const bottom = baseline - size * 0.08;
  doc.save();
  if (type === 'high') {
    doc.polygon([x, bottom], [x + w, bottom], [x + w / 2, bottom - h]).fill(INK);
  } else {
    doc.lineWidth(Math.max(0.5, size * 0.07)).strokeColor(INK)
      .polygon([x, bottom - h], [x + w, bottom - h], [x + w / 2, bottom]).stroke();
  }
  doc.restore();
}

/** Sunrise or sunset: half a sun on the horizon with an arrow beside it, up for rising, down for setting. */
export function sunGlyph(doc: PDFKit.PDFDocument, rising: boolean, x: number, baseline: number, size: number): void {
  const r = size * 0.34;
  const cx = x + r;
  const horizon = baseline;
  doc.save().lineWidth(Math.max(0.45, size * 0.08)).strokeColor(INK);
  doc.path(`M ${cx - r} ${horizon} A ${r} ${r} 0 0 1 ${cx + r} ${horizon} Z`).fill(INK);
  doc.moveTo(x - size * 0.05, horizon).lineTo(x + 2 * r + size * 0.05, horizon).stroke();
  const ax = x + 2 * r + size * 0.33;
  const top = baseline - size * 0.78;
  const bottom = baseline;
  const head = size * 0.22;
  doc.moveTo(ax, rising ? bottom : top).lineTo(ax, rising ? top + head : bottom - head).stroke();
  const tip = rising ? top : bottom;
  const base = rising ? top + head * 1.4 : bottom - head * 1.4;
  doc.polygon([ax - head, base], [ax + head, base], [ax, tip]).fill(INK);
  doc.restore();
}

/** Width taken by sunGlyph at a given size. */
export function sunGlyphWidth(size: number): number {
  return size * 0.68 + size * 0.33 + size * 0.22;
}

/** A small clock face: marks a day on which the clocks change. */
export function clockGlyph(doc: PDFKit.PDFDocument, cx: number, cy: number, r: number): void {
  doc.save().lineWidth(Math.max(0.5, r * 0.18)).strokeColor(INK);
  doc.circle(cx, cy, r).fillAndStroke(WHITE, INK);
  doc.moveTo(cx, cy).lineTo(cx, cy - r * 0.7).stroke();
  doc.moveTo(cx, cy).lineTo(cx + r * 0.5, cy + r * 0.15).stroke();
  doc.restore();
}
