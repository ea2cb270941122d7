// Sets a publisher's Markdown blocks on book pages: words wrapped in their own faces, list items hung
// from their markers, tables sized to their content, pictures fitted to the width. Measured once with
// a scratch document before the book is drawn, since the book's page count must be known up front;
// every position is relative to the content box, so a page draws on a recto or a verso alike.
import { itemAt, lastOf } from '../../engine/index.js';
import type { Align, Block, Piece } from './markdown-blocks.js';
import { fitted, loadPicture, type Picture } from './picture.js';
import { widthOf, type TextStyle } from './text.js';

export interface Run {
  text: string;
  x: number;
  y: number; // baseline
  style: TextStyle;
  link?: string;
  width: number;
}

export type Placed =
  | { kind: 'text'; tag: 'H1' | 'H2' | 'H3' | 'P' | 'LI'; runs: Run[]; first?: boolean } // first LI of a list on this page
  | { kind: 'table'; rows: { header: boolean; cells: Run[][] }[]; rules: { y: number; x1: number; x2: number; heavy: boolean }[] }
  | { kind: 'image'; picture: Picture; x: number; y: number; width: number; height: number; alt: string; caption: Run[] }
  | { kind: 'rule'; y: number; width: number };

export interface MarkdownStyle {
  scale: number;
  width: number; // of the content box
  height: number;
  color?: string; // of the headings (the publisher's accent), else black
}

const SIZES = { body: 9.2, h1: 13, h2: 11, h3: 10, table: 8.2, caption: 7.6 };

/** A word with its face and the space before it. */
interface Word { text: string; font: Piece['font']; link?: string; space: boolean; br: boolean }

function words(pieces: Piece[]): Word[] {
  const out: Word[] = [];
  let space = false;
  for (const p of pieces) {
    let br = p.br === true;
    for (const part of p.text.split(/(\s+)/)) {
      if (part === '') continue;
      if (/^\s+$/.test(part)) { space = true; continue; }
      out.push({ text: part, font: p.font, ...(p.link !== undefined && { link: p.link }), space: space && !br, br });
      space = false;
      br = false;
    }
    if (br) out.push({ text: '', font: p.font, space: false, br: true });
  }
  return out;
}

/** Lines of runs (x from 0) at most `width` wide; a word longer than a line is cut by characters. */
export function wrapPieces(doc: PDFKit.PDFDocument, pieces: Piece[], size: number, width: number, color?: string): Run[][] {
  const lines: Run[][] = [];
  let line: Run[] = [];
  let x = 0;
  const style = (w: Word): TextStyle => ({ font: w.font, size, ...(color !== undefined && { color }) });
  const place = (w: Word, text: string, gap: number): void => {
    const st = style(w);
    const wd = widthOf(doc, text, st);
    const last = line[line.length - 1];
    if (last && gap > 0 && last.style.font === st.font && last.link === w.link) {
      last.text += ` ${text}`;
      last.width = x + gap + wd - last.x;
    } else if (last && gap === 0 && last.style.font === st.font && last.link === w.link) {
      last.text += text;
      last.width += wd;
    } else {
      line.push({ text, x: x + gap, y: 0, style: st, width: wd, ...(w.link !== undefined && { link: w.link }) });
    }
    x += gap + wd;
  };
  const newLine = (): void => { lines.push(line); line = []; x = 0; };
  for (const w of words(pieces)) {
    if (w.br && line.length > 0) newLine();
    if (w.text === '') continue;
    const gap = w.space && line.length > 0 ? widthOf(doc, ' ', style(w)) : 0;
    const wd = widthOf(doc, w.text, style(w));
    if (line.length > 0 && x + gap + wd > width) newLine();
    let text = w.text;
    while (widthOf(doc, text, style(w)) > width && text.length > 1) {
      let cut = text.length - 1;
      while (cut > 1 && widthOf(doc, text.slice(0, cut), style(w)) > width) cut--;
      place(w, text.slice(0, cut), 0);
      newLine();
      text = text.slice(cut);
    }
    place(w, text, line.length > 0 ? gap : 0);
  }
  if (line.length > 0) lines.push(line);
  return lines;
}

function shift(lines: Run[][], dx: number, y0: number, leading: number): Run[] {
  return lines.flatMap((line, i) => line.map((r) => ({ ...r, x: r.x + dx, y: y0 + i * leading })));
}

/** Places the blocks on as many pages as they need (always at least one), below `top` on the first. */
export function layoutMarkdown(doc: PDFKit.PDFDocument, blocks: Block[], images: Record<string, string>, style: MarkdownStyle,
  top: number): Placed[][] {
  const s = style.scale;
  const pages: Placed[][] = [[]];
  let y = top;
  const page = (): Placed[] => lastOf(pages, 'pages');
  const room = (h: number): void => {
    if (y + h > style.height && page().length > 0) { pages.push([]); y = 0; }
  };
  const pictures = new Map<string, Picture>();
  const textBlock = (tag: 'H1' | 'H2' | 'H3' | 'P' | 'LI', pieces: Piece[], size: number, indent: number, before: number,
    after: number, color?: string, marker?: string, first?: boolean): void => {
    const leading = size * 1.34;
    const lines = wrapPieces(doc, pieces, size, style.width - indent, color);
    if (lines.length === 0) return;
    y += before;
    // a heading keeps two lines of what follows; a paragraph may break between its lines
    const keep = tag.startsWith('H') ? lines.length * leading + 2.5 * SIZES.body * s : Math.min(lines.length, 2) * leading;
    room(keep);
    let start = 0;
    while (start < lines.length) {
      const fit = Math.max(1, Math.floor((style.height - y) / leading) + 0);
      const part = lines.slice(start, start + fit);
      const runs = shift(part, indent, y + size, leading);
      if (marker !== undefined && start === 0) runs.unshift({ text: marker, x: indent - 11 * s, y: y + size, style: { font: 'regular', size }, width: 0 });
      page().push({ kind: 'text', tag, runs, ...(first && start === 0 && { first: true }) });
      y += part.length * leading;
      start += part.length;
      if (start < lines.length) { pages.push([]); y = 0; }
    }
    y += after;
  };
  for (const block of blocks) {
    switch (block.kind) {
      case 'heading': {
        const size = (block.level === 1 ? SIZES.h1 : block.level === 2 ? SIZES.h2 : SIZES.h3) * s;
        textBlock(`H${block.level}`, block.pieces.map((p) => ({ ...p, font: 'bold' })), size, 0, (block.level === 1 ? 8 : 6) * s, 2 * s, style.color);
        break;
      }
      case 'paragraph': textBlock('P', block.pieces, SIZES.body * s, block.indent * 14 * s, 0, 5 * s); break;
      case 'item': textBlock('LI', block.pieces, SIZES.body * s, (block.depth + 1) * 14 * s, 0, 2.5 * s, undefined, block.marker, block.first); break;
      case 'rule': room(10 * s); y += 5 * s; page().push({ kind: 'rule', y, width: style.width }); y += 7 * s; break;
      case 'image': {
        const path = images[block.src];
        if (path === undefined) break;
        let picture = pictures.get(path);
        if (!picture) { picture = loadPicture(path, style.width); pictures.set(path, picture); }
        // a PNG or JPEG at 96 pixels to the inch (its size on a screen), an SVG at its own size; never wider than the page
        const natural = { width: picture.pixels.width * 0.75, height: picture.pixels.height * 0.75 };
        const captionLines = block.caption ? wrapPieces(doc, [{ text: block.caption, font: 'oblique' }], SIZES.caption * s, style.width) : [];
        const captionH = captionLines.length * SIZES.caption * 1.3 * s;
        let box = fitted(picture.pixels, Math.min(style.width, natural.width), style.height * 0.7);
        if (y + box.height + captionH > style.height && style.height - y > style.height * 0.4) {
          box = fitted(picture.pixels, box.width, style.height - y - captionH - 4 * s);
        }
        room(box.height + captionH + 4 * s);
        y += 3 * s;
        const caption = shift(captionLines, 0, y + box.height + SIZES.caption * 1.3 * s, SIZES.caption * 1.3 * s);
        page().push({ kind: 'image', picture, x: 0, y, width: box.width, height: box.height, alt: block.alt || block.caption, caption });
        y += box.height + captionH + 8 * s;
        break;
      }
      case 'table': layoutTable(doc, block, style, () => y, (v) => { y = v; }, page, () => { pages.push([]); y = 0; });
    }
  }
  return pages;
}

function layoutTable(doc: PDFKit.PDFDocument, block: Extract<Block, { kind: 'table' }>, style: MarkdownStyle,
  getY: () => number, setY: (y: number) => void, page: () => Placed[], newPage: () => void): void {
  const s = style.scale;
  const size = SIZES.table * s;
  const leading = size * 1.3;
  const pad = 4 * s;
  const columns = Math.max(block.head.length, ...block.rows.map((r) => r.length));
  if (columns === 0) return;
  const all = [block.head, ...block.rows];
  const natural = Array.from({ length: columns }, (_, c) => Math.max(12 * s, ...all.map((row, r) => {
    const pieces = row[c] ?? [];
    return pieces.reduce((w, p) => w + widthOf(doc, p.text, { font: r === 0 ? 'bold' : p.font, size }), 0) + 2 * pad + s; // a point of slack for rounding
  })));
  const total = natural.reduce((a, b) => a + b, 0);
  const widths = total <= style.width ? natural : natural.map((w) => (w / total) * style.width);
  const lefts = widths.map((_, c) => widths.slice(0, c).reduce((a, b) => a + b, 0));
  const tableWidth = widths.reduce((a, b) => a + b, 0);
  const rowOf = (row: Piece[][], header: boolean) => {
    const cells = Array.from({ length: columns }, (_, c) => {
      const pieces = (row[c] ?? []).map((p) => (header ? { ...p, font: 'bold' as const } : p));
      return wrapPieces(doc, pieces, size, itemAt(widths, c, 'column widths') - 2 * pad);
    });
    return { cells, height: Math.max(1, ...cells.map((l) => l.length)) * leading + pad };
  };
  const head = block.head.length > 0 ? rowOf(block.head, true) : null;
  let placed: Extract<Placed, { kind: 'table' }> | null = null;
  const start = (): void => {
    placed = { kind: 'table', rows: [], rules: [] };
    page().push(placed);
    if (head) put(head, true);
  };
  const put = (row: { cells: Run[][][]; height: number }, header: boolean): void => {
    const y = getY();
    const cells = row.cells.map((lines, c) => {
      const align: Align = block.align[c] ?? 'left';
      return lines.flatMap((line, i) => {
        const w = line.reduce((m, r) => Math.max(m, r.x + r.width), 0);
        const room = itemAt(widths, c, 'column widths') - 2 * pad - w;
        const dx = itemAt(lefts, c, 'column lefts') + pad + (align === 'right' ? room : align === 'center' ? room / 2 : 0);
        return line.map((r) => ({ ...r, x: r.x + dx, y: y + pad / 2 + size + i * leading }));
      });
    });
    placed!.rows.push({ header, cells });
    setY(y + row.height);
    placed!.rules.push({ y: getY(), x1: 0, x2: tableWidth, heavy: header });
  };
  setY(getY() + 4 * s);
  if (getY() + (head?.height ?? 0) + leading * 2 > style.height) newPage();
  start();
  for (const r of block.rows) {
    const row = rowOf(r, false);
    if (getY() + row.height > style.height) { newPage(); start(); }
    put(row, false);
  }
  setY(getY() + 8 * s);
}
