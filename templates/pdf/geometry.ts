// Page sizes, margins and the type scale of each book format. All lengths in PostScript points.
import type { PageSizeName } from './options.js';

const MM = 72 / 25.4;

export interface Size { width: number; height: number }

// ISO 216 sizes in millimetres; US sizes in inches (ANSI Y14.1 letter, half letter, tabloid).
const SIZES: Record<PageSizeName | 'a3' | 'tabloid', Size> = {
  a3: { width: 297 * MM, height: 420 * MM },
  a4: { width: 210 * MM, height: 297 * MM },
  a5: { width: 148 * MM, height: 210 * MM },
  a6: { width: 105 * MM, height: 148 * MM },
  letter: { width: 612, height: 792 },
  'half-letter': { width: 396, height: 612 },
  tabloid: { width: 792, height: 1224 },
};

/** The sheet a page is printed two-up on for saddle stitching: exactly two pages side by side. */
const SHEET_FOR: Record<PageSizeName, keyof typeof SIZES> = {
  a5: 'a4', a6: 'a5', a4: 'a3', 'half-letter': 'letter', letter: 'tabloid',
};

export interface Margins {
  top: number;
  bottom: number; // the footer lives inside the bottom margin
  inner: number; // binding side: left on odd (recto) pages, right on even (verso) pages
  outer: number;
}

export interface PageGeometry {
  name: PageSizeName;
  size: Size;
  sheet: Size; // landscape sheet for two-up imposition
  margins: Margins;
  scale: number; // type and element scale relative to the A5 design
}

// Per format: margins in millimetres and a type scale. A5 is the reference design; A6 is the pocket
// edition (smaller type), A4/letter the large-print edition.
const FORMATS: Record<PageSizeName, { margins: Margins; scale: number }> = {
  a5: { margins: { top: 10, bottom: 14, inner: 15, outer: 9 }, scale: 1 },
  'half-letter': { margins: { top: 10, bottom: 14, inner: 14, outer: 8 }, scale: 0.96 },
  a6: { margins: { top: 7, bottom: 11, inner: 10, outer: 6 }, scale: 0.74 },
  a4: { margins: { top: 13, bottom: 17, inner: 20, outer: 13 }, scale: 1.34 },
  letter: { margins: { top: 13, bottom: 17, inner: 20, outer: 13 }, scale: 1.34 },
};

export function pageGeometry(name: PageSizeName): PageGeometry {
  const f = FORMATS[name];
  const size = SIZES[name];
  const sheetPortrait = SIZES[SHEET_FOR[name]];
  const m = f.margins;
  return {
    name,
    size,
    sheet: { width: sheetPortrait.height, height: sheetPortrait.width },
    margins: { top: m.top * MM, bottom: m.bottom * MM, inner: m.inner * MM, outer: m.outer * MM },
    scale: f.scale,
  };
}

export interface Box { x: number; y: number; width: number; height: number }

/** The content box of page `number` (1-based): odd pages are rectos, bound on their left edge. */
export function contentBox(g: PageGeometry, number: number): Box {
  const recto = number % 2 === 1;
  const left = recto ? g.margins.inner : g.margins.outer;
  const right = recto ? g.margins.outer : g.margins.inner;
  return {
    x: left,
    y: g.margins.top,
    width: g.size.width - left - right,
    height: g.size.height - g.margins.top - g.margins.bottom,
  };
}
