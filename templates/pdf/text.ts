// Text placed by baseline with explicit alignment, fitting and wrapping. pdfkit's own flowing text
// adds pages when it runs past the margin; every line here is positioned by us, so it never does.
import type { FontName } from './fonts.js';
import { useFont } from './fonts.js';
import { printable } from './format.js';
import { needsBidi, visualPieces, withReplacements, type GlyphCoverage } from './script.js';
import { tag } from './tags.js';

export interface TextStyle {
  font: FontName;
  size: number;
  color?: string;
}

export type Align = 'left' | 'right' | 'center';

interface Face extends GlyphCoverage {
  layout(text: string, features?: unknown, onlyWidth?: boolean): { advanceWidth: number };
}

/** The current face as pdfkit holds it (`_font`: its own wrapper; `_font.font`: the parsed face). */
function currentFace(doc: PDFKit.PDFDocument): { wrapper: Face; parsed: GlyphCoverage } | null {
  const wrapper = (doc as unknown as { _font?: Partial<Face> & { font?: Partial<GlyphCoverage> } })._font;
  const parsed = wrapper?.font;
  if (typeof parsed?.hasGlyphForCodePoint !== 'function' || typeof wrapper?.layout !== 'function') return null;
  return { wrapper: wrapper as Face, parsed: parsed as GlyphCoverage };
}

// Every document of a thread shares the parsed faces (fonts.ts), and a book measures and draws the same
// strings (times, heights, day names) thousands of times: what each string becomes in a face and its
// width there are kept per face. Both depend only on the face and the string.
interface Measured { drawable: Map<string, string>; advance: Map<string, number> }
const measured = new WeakMap<object, Measured>();
const MEASURED_MAX = 100_000; // strings kept per face before starting afresh (a few MiB)

function measuredFor(face: object): Measured {
  let m = measured.get(face);
  if (!m || m.drawable.size > MEASURED_MAX || m.advance.size > MEASURED_MAX) {
    m = { drawable: new Map(), advance: new Map() };
    measured.set(face, m);
  }
  return m;
}

/** The text as it is drawn: control characters as spaces, characters the face lacks as U+FFFD. */
function drawable(doc: PDFKit.PDFDocument, text: string): string {
  const face = currentFace(doc);
  if (!face) return printable(text);
  const m = measuredFor(face.parsed);
  let s = m.drawable.get(text);
  if (s === undefined) {
    s = withReplacements(printable(text), face.parsed);
    m.drawable.set(text, s);
  }
  return s;
}

/** What doc.widthOfString(s) gives (the same arithmetic, so the same number), from the face's kept advance. */
function widthOfDrawn(doc: PDFKit.PDFDocument, s: string): number {
  const face = currentFace(doc);
  if (!face) return doc.widthOfString(s);
  const m = measuredFor(face.parsed);
  let advance = m.advance.get(s);
  if (advance === undefined) {
    advance = face.wrapper.layout(s, undefined, true).advanceWidth;
    m.advance.set(s, advance);
  }
  const size = (doc as unknown as { _fontSize: number })._fontSize;
  return (advance * (size / 1000) + 0 * (s.length - 1)) * 100 / 100;
}

export function widthOf(doc: PDFKit.PDFDocument, text: string, style: TextStyle): number {
  useFont(doc, style.font).fontSize(style.size);
  return widthOfDrawn(doc, drawable(doc, text));
}

/** Draws one line with its baseline at y; returns the drawn width. */
export function put(doc: PDFKit.PDFDocument, text: string, x: number, y: number, style: TextStyle,
  align: Align = 'left'): number {
  if (printable(text).length === 0) return 0;
  // text a layout has not tagged otherwise reads as a paragraph of its own
  return tag(doc, 'P', {}, () => putUntagged(doc, text, x, y, style, align));
}

function putUntagged(doc: PDFKit.PDFDocument, text: string, x: number, y: number, style: TextStyle, align: Align): number {
  useFont(doc, style.font).fontSize(style.size).fillColor(style.color ?? '#000000');
  // a right-to-left line keeps no unseen end space (spacedLines): it would land at its left end
  const s = needsBidi(text) ? drawable(doc, text).trimEnd() : drawable(doc, text);
  const w = widthOfDrawn(doc, s);
  const left = align === 'left' ? x : align === 'right' ? x - w : x - w / 2;
  if (!needsBidi(s)) {
    doc.text(s, left, y, { lineBreak: false, baseline: 'alphabetic' });
    return w;
  }
  // Right-to-left words: each piece placed by us in visual order (see script.ts).
  let at = left;
  for (const piece of visualPieces(s)) {
    if (!piece.space) doc.text(piece.text, at, y, { lineBreak: false, baseline: 'alphabetic' });
    at += doc.widthOfString(piece.text);
  }
  return at - left;
}

/** The largest size ≤ style.size (down to minSize) at which the text fits maxWidth. */
export function fitStyle(doc: PDFKit.PDFDocument, text: string, style: TextStyle, maxWidth: number,
  minSize: number): TextStyle {
  const w = widthOf(doc, text, style);
  if (w <= maxWidth) return style;
  return { ...style, size: Math.max(minSize, (style.size * maxWidth) / w) };
}

/** Shortens text with an ellipsis until it fits (after shrinking to the minimum size failed). */
export function clipText(doc: PDFKit.PDFDocument, text: string, style: TextStyle, maxWidth: number): string {
  const s = printable(text);
  if (widthOf(doc, s, style) <= maxWidth) return s;
  let lo = 0;
  let hi = s.length;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (widthOf(doc, `${s.slice(0, mid).trimEnd()}…`, style) <= maxWidth) lo = mid; else hi = mid - 1;
  }
  return `${s.slice(0, lo).trimEnd()}…`;
}

/** Fits one line: shrink to minSize, then clip; draws it and returns the style used. */
export function putFitted(doc: PDFKit.PDFDocument, text: string, x: number, y: number, style: TextStyle,
  maxWidth: number, minSize: number, align: Align = 'left'): TextStyle {
  const fitted = fitStyle(doc, text, style, maxWidth, minSize);
  put(doc, clipText(doc, text, fitted, maxWidth), x, y, fitted, align);
  return fitted;
}

/** Greedy word wrap; a word longer than the line is broken by characters. */
export function wrapLines(doc: PDFKit.PDFDocument, text: string, style: TextStyle, width: number): string[] {
  const lines: string[] = [];
  for (const para of text.split('\n').map(printable)) {
    let line = '';
    for (const word of para.split(/\s+/).filter(Boolean)) {
      const candidate = line ? `${line} ${word}` : word;
      if (widthOf(doc, candidate, style) <= width) { line = candidate; continue; }
      if (line) lines.push(line);
      line = word;
      while (widthOf(doc, line, style) > width && line.length > 1) {
        let cut = line.length - 1;
        while (cut > 1 && widthOf(doc, line.slice(0, cut), style) > width) cut--;
        // prefer to break a long word just after a hyphen or slash
        const soft = Math.max(line.lastIndexOf('-', cut - 1), line.lastIndexOf('/', cut - 1));
        if (soft > cut / 2) cut = soft + 1;
        lines.push(line.slice(0, cut));
        line = line.slice(cut);
      }
    }
    if (line) lines.push(line);
  }
  return lines;
}

/**
 * Lines of one piece of text, each but the last ending in a space that is never seen: text read out of the
 * PDF (a screen reader, copying) then keeps the word breaks that fell at the ends of lines.
 */
export function spacedLines(lines: readonly string[]): string[] {
  return lines.map((line, i) => (i < lines.length - 1 ? `${line} ` : line));
}

/** Draws a wrapped paragraph from the first baseline y; returns the baseline after the last line. */
export function paragraph(doc: PDFKit.PDFDocument, text: string, x: number, y: number, width: number,
  style: TextStyle, leading = style.size * 1.3, maxLines = Infinity): number {
  const lines = wrapLines(doc, text, style, width);
  const shown = lines.slice(0, maxLines);
  if (lines.length > shown.length) shown[shown.length - 1] = clipText(doc, `${shown[shown.length - 1]} …`, style, width);
  let yy = y;
  tag(doc, 'P', {}, () => { for (const line of spacedLines(shown)) { put(doc, line, x, yy, style); yy += leading; } });
  return yy;
}

/**
 * The largest size (from style.size down to minSize) at which the text wraps into at most maxLines
 * without breaking a word; at the minimum size words may break and extra lines are clipped.
 */
export function fitLines(doc: PDFKit.PDFDocument, text: string, style: TextStyle, width: number, maxLines: number,
  minSize: number): { style: TextStyle; lines: string[] } {
  // a word may break after a hyphen without looking broken
  const words = printable(text).split(/\s+|(?<=-)/).filter(Boolean);
  for (let size = style.size; size > minSize; size *= 0.94) {
    const st = { ...style, size };
    if (words.some((w) => widthOf(doc, w, st) > width)) continue;
    const lines = wrapLines(doc, text, st, width);
    if (lines.length <= maxLines) return { style: st, lines };
  }
  const st = { ...style, size: minSize };
  const lines = wrapLines(doc, text, st, width);
  if (lines.length > maxLines) {
    lines.length = maxLines;
    lines[maxLines - 1] = clipText(doc, `${lines[maxLines - 1]} …`, st, width);
  }
  return { style: st, lines };
}
