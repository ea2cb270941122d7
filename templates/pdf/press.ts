// Press-ready pages: 3 mm bleed beyond the trim on every side, crop marks outside the bleed, TrimBox
// and BleedBox set, and every colour written as black ink only (DeviceCMYK 0/0/0/K): the book's
// palette is greys, so a print shop's conversion never turns a grey into a four-ink mix.

const MM = 72 / 25.4;
export const BLEED = 3 * MM;
const MARK_GAP = 0 * MM; // crop marks start at the bleed's edge, never inside it
const MARK_LENGTH = 5 * MM;
/** Room beyond the trim on every side: the bleed, then the crop marks. */
export const SLUG = BLEED + MARK_GAP + MARK_LENGTH + 1 * MM;

export interface PagePlacement {
  dx: number; // where the trimmed page's top-left corner sits on the PDF page
  dy: number;
  bleed: number; // how far colour that runs to the edge should run past it (0 without press)
}

/** A grey '#rrggbb' (r = g = b) as black ink: [0, 0, 0, K] with K = 1 − grey, in pdfkit's 0…1 form. */
export function blackInk(color: string): number[] {
  const grey = /^#([0-9a-f]{2})\1\1$/i.exec(color)?.[1];
  if (grey === undefined) throw new RangeError(`colour ${color} is not a grey of the book's palette, so it has no black-ink equivalent`);
  return [0, 0, 0, Math.round((1 - parseInt(grey, 16) / 255) * 1000) / 1000];
}

interface ColorNormalizer { _normalizeColor(color: unknown): unknown }

/** Makes the document write every colour it is given as black ink (pdfkit turns colours into numbers in one place). */
export function useBlackInk(doc: PDFKit.PDFDocument): void {
  const target = doc as unknown as ColorNormalizer;
  const rgb = target._normalizeColor.bind(doc);
  target._normalizeColor = (color: unknown) => (typeof color === 'string' && color.startsWith('#') ? blackInk(color) : rgb(color));
}

/**
 * Adds a page for a trimmed size: without press the page is the trimmed size; with press it grows by the
 * slug on every side, carries TrimBox and BleedBox, and gets crop marks at its four corners.
 */
export function addTrimmedPage(doc: PDFKit.PDFDocument, width: number, height: number, press: boolean): PagePlacement {
  if (!press) {
    doc.addPage({ size: [width, height], margin: 0 });
    return { dx: 0, dy: 0, bleed: 0 };
  }
  const W = width + 2 * SLUG;
  const H = height + 2 * SLUG;
  doc.addPage({ size: [W, H], margin: 0 });
  const page = doc.page as unknown as { dictionary: { data: Record<string, unknown> } };
  const r = (n: number) => Math.round(n * 1000) / 1000;
  page.dictionary.data.TrimBox = [r(SLUG), r(SLUG), r(SLUG + width), r(SLUG + height)];
  page.dictionary.data.BleedBox = [r(SLUG - BLEED), r(SLUG - BLEED), r(SLUG + width + BLEED), r(SLUG + height + BLEED)];
  cropMarks(doc, width, height);
  return { dx: SLUG, dy: SLUG, bleed: BLEED };
}

/** Hairlines in line with the trim edges, outside the bleed, at each corner. */
function cropMarks(doc: PDFKit.PDFDocument, width: number, height: number): void {
  const x0 = SLUG;
  const y0 = SLUG;
  const x1 = SLUG + width;
  const y1 = SLUG + height;
  const near = BLEED + MARK_GAP;
  const far = near + MARK_LENGTH;
  doc.save().lineWidth(0.25).strokeColor('#000000');
  for (const x of [x0, x1]) {
    doc.moveTo(x, y0 - near).lineTo(x, y0 - far).stroke();
    doc.moveTo(x, y1 + near).lineTo(x, y1 + far).stroke();
  }
  for (const y of [y0, y1]) {
    doc.moveTo(x0 - near, y).lineTo(x0 - far, y).stroke();
    doc.moveTo(x1 + near, y).lineTo(x1 + far, y).stroke();
  }
  doc.restore();
}
