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

/** The current face's character map (pdfkit keeps the parsed font on `_font.font`), if it can be reached. */
function coverage(doc: PDFKit.PDFDocument): GlyphCoverage | null {
  const font = (doc as unknown as { _font?: { font?: Partial<GlyphCoverage> } })._font?.font;
  return typeof font?.hasGlyphForCodePoint === 'function' ? (font as GlyphCoverage) : null;
}

/** The text as it is drawn: control characters as spaces, characters the face lacks as U+FFFD. */
function drawable(doc: PDFKit.PDFDocument, text: string): string {
  return withReplacements(printable(text), coverage(doc));
}

export function widthOf(doc: PDFKit.PDFDocument, text: string, style: TextStyle): number {
  useFont(doc, style.font).fontSize(style.size);
  return doc.widthOfString(drawable(doc, text));
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
  const w = doc.widthOfString(s);
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
