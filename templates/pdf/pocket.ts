// The pocket table: a whole year of one station on one sheet, printed on both sides and folded to
// pocket size (see pocket/fold.ts for the panels and the fold).
import { itemAt, type StationYear } from '../../engine/index.js';
import { createDocument, editionDate, finish } from './document.js';
import { printable } from './format.js';
import type { Box, Size } from './geometry.js';
import { wordsFor } from '../locale/index.js';
import type { HeightUnits } from './options.js';
import type { PanelContent, SideGrid } from './pocket/fold.js';
import { POCKET_COLUMNS, POCKET_ROWS, pocketPlan } from './pocket/fold.js';
import type { PocketMonthLayout } from './pocket/month-panel.js';
import { drawPocketMonth, pocketMonthLayout } from './pocket/month-panel.js';
import type { PanelText } from './pocket/panels.js';
import { drawCaution, drawCover, drawKey, drawLevels, POCKET_LOGO } from './pocket/panels.js';
import type { ImageWarningSink } from './image-resolution.js';
import { loadPicture } from './picture.js';
import { addTrimmedPage, useBlackInk, type PagePlacement } from './press.js';
import { RULE } from './style.js';
import { beginTaggedPage, group } from './tags.js';

const MM = 72 / 25.4;

export type PocketSheet = 'a4' | 'letter';

export interface PocketOptions {
  units: HeightUnits;
  sheet: PocketSheet;
  title?: string;
  publisher?: string;
  locale?: string;
  caution?: string; // the publisher's own caution, replacing the catalogue's
  logo?: string; // path of the publisher's logo (SVG, PNG or JPEG): top right of the cover panel
  press?: boolean; // crop marks, TrimBox and BleedBox round the sheet, black ink only (press.ts)
  warn?: ImageWarningSink; // told of a logo that would print below 300 dpi, or in greys for the press
}

// landscape sheets: ISO 216 A4, ANSI letter
const SHEETS: Record<PocketSheet, Size> = {
  a4: { width: 297 * MM, height: 210 * MM },
  letter: { width: 792, height: 612 },
};

const FOLD_MARGIN = 3.5 * MM; // type keeps this far from a fold
const EDGE_MARGIN = 5 * MM; // and this far from the sheet's edge, which many printers cannot reach

/** The type area of the panel at row r, column c of a side. */
export function panelBox(sheet: Size, r: number, c: number): Box {
  const w = sheet.width / POCKET_COLUMNS;
  const h = sheet.height / POCKET_ROWS;
  const left = c === 0 ? EDGE_MARGIN : FOLD_MARGIN;
  const right = c === POCKET_COLUMNS - 1 ? EDGE_MARGIN : FOLD_MARGIN;
  const top = r === 0 ? EDGE_MARGIN : FOLD_MARGIN;
  const bottom = r === POCKET_ROWS - 1 ? EDGE_MARGIN : FOLD_MARGIN;
  return { x: c * w + left, y: r * h + top, width: w - left - right, height: h - top - bottom };
}

/** A panel at the sheet's corner: the least room (edge margins on two sides). */
function smallestPanel(sheet: Size): Box {
  return panelBox(sheet, POCKET_ROWS - 1, 0);
}

/** Short marks at the sheet's edges where it is folded, outside the type. */
function foldMarks(doc: PDFKit.PDFDocument, sheet: Size): void {
  const len = 3 * MM;
  doc.save().lineWidth(0.4).strokeColor(RULE);
  for (let c = 1; c < POCKET_COLUMNS; c++) {
    const x = (c * sheet.width) / POCKET_COLUMNS;
    doc.moveTo(x, 0).lineTo(x, len).stroke().moveTo(x, sheet.height - len).lineTo(x, sheet.height).stroke();
  }
  const y = sheet.height / 2;
  doc.moveTo(0, y).lineTo(len, y).stroke().moveTo(sheet.width - len, y).lineTo(sheet.width, y).stroke();
  doc.restore();
}

function drawPanel(doc: PDFKit.PDFDocument, model: StationYear, content: PanelContent, box: Box, text: PanelText,
  layout: PocketMonthLayout): void {
  switch (content.kind) {
    case 'cover': return drawCover(doc, model, box, text);
    case 'key': return drawKey(doc, model, box, text);
    case 'levels': return drawLevels(doc, model, box, text);
    case 'caution': return drawCaution(doc, model, box, text);
    case 'month': return drawPocketMonth(doc, model, itemAt(model.months, content.month - 1, 'months'), box, layout, text.words, text.southern);
  }
}

export async function renderPocketTable(model: StationYear, options: PocketOptions): Promise<Buffer> {
  const sheet = SHEETS[options.sheet];
  if (!sheet) throw new RangeError(`pocket sheet "${String(options.sheet)}" must be a4 or letter`);
  const words = wordsFor({ locale: options.locale, units: options.units, caution: options.caution });
  const title = printable(options.title ?? words.t('book.defaultTitle'));
  const name = printable(model.station.name);
  const doc = createDocument({
    title: words.t('pocket.title', { station: name, year: String(model.year) }),
    author: options.publisher,
    subject: words.t('pocket.subject', { station: name, year: String(model.year) })
      + `${model.invented ? ` (${words.t('book.inventedSubject')})` : ''}`,
    keywords: words.t('pocket.keywords'),
    date: editionDate(model.year),
    lang: words.tag,
  });
  const press = options.press === true;
  if (press) useBlackInk(doc);
  const text: PanelText = {
    title, publisher: options.publisher, words, southern: model.station.position.latitude < 0,
    ...(options.logo !== undefined && { logo: loadPicture(options.logo, POCKET_LOGO.width) }),
    pictures: { press, ...(options.warn && { warn: options.warn }) },
  };
  const plan = pocketPlan();
  // one layout for every month, fitted to the smallest panel a month is printed on (an edge panel)
  let layout: PocketMonthLayout | undefined;
  for (const side of [plan.outside, plan.inside]) {
    // the sheet is the trimmed size; for the press it sits inside bleed, crop marks and page boxes
    const at = addTrimmedPage(doc, sheet.width, sheet.height, press);
    layout ??= pocketMonthLayout(doc, model, smallestPanel(sheet), words);
    drawSide(doc, model, side, sheet, text, layout, at);
  }
  return finish(doc);
}

function drawSide(doc: PDFKit.PDFDocument, model: StationYear, side: SideGrid, sheet: Size, text: PanelText,
  layout: PocketMonthLayout, at: PagePlacement): void {
  beginTaggedPage(doc);
  doc.save().translate(at.dx, at.dy);
  side.forEach((row, r) => row.forEach((content, c) => group(doc, 'Sect', {},
    () => drawPanel(doc, model, content, panelBox(sheet, r, c), text, layout))));
  foldMarks(doc, sheet);
  doc.restore();
}
