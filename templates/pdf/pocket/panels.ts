// The pocket table's panels other than the months: the cover, the key on the card's back, the levels
// of the tide, and the caution in full.
import type { StationYear } from '../../../engine/index.js';
import { DATUM_ROWS } from '../datum-scale.js';
import type { Words } from '../../locale/index.js';
import { printable } from '../format.js';
import type { Box } from '../geometry.js';
import { clockGlyph, laneMark, moonGlyph } from '../glyphs.js';
import { DARK, INK, LABEL_MIN, MID, WHITE } from '../style.js';
import { fitLines, paragraph, put, putFitted, spacedLines, widthOf, wrapLines } from '../text.js';
import { fitted, type Picture } from '../picture.js';
import { placePicture, type PictureSettings } from '../place-picture.js';
import { group, tag } from '../tags.js';

export interface PanelText {
  title: string;
  publisher?: string;
  words: Words;
  southern: boolean;
  logo?: Picture; // the publisher's logo, top right of the cover panel
  pictures: PictureSettings; // press output and the image warnings
}

/** The largest the logo prints on the cover panel, in points. */
export const POCKET_LOGO = { width: 56, height: 30 };

const BODY = 6.6;

function inventedStrip(doc: PDFKit.PDFDocument, box: Box, y: number, words: Words): number {
  doc.save().rect(box.x, y, box.width, 17).fill(INK).restore();
  putFitted(doc, words.t('book.inventedBanner'), box.x + 4, y + 11.5, { font: 'bold', size: 7.5, color: WHITE }, box.width - 8, LABEL_MIN);
  return y + 17;
}

/**
 * The cover panel: one heading (the title line, the year, the station), the logo, the facts as a table of
 * labelled rows, the invented-data notice, the publisher and the caution in short.
 */
export function drawCover(doc: PDFKit.PDFDocument, model: StationYear, box: Box, text: PanelText): void {
  const logo = text.logo === undefined ? undefined : fitted(text.logo.pixels, Math.min(POCKET_LOGO.width, box.width * 0.35), POCKET_LOGO.height);
  let y = box.y + 8;
  const name = fitLines(doc, printable(model.station.name), { font: 'bold', size: 15 }, box.width, 3, 8);
  tag(doc, 'H1', {}, () => {
    putFitted(doc, `${text.title.toLocaleUpperCase(text.words.tag)} `, box.x, y, { font: 'bold', size: 7, color: MID },
      box.width - (logo ? logo.width + 6 : 0), LABEL_MIN);
    y += 38;
    put(doc, `${model.year} `, box.x - 1.5, y, { font: 'bold', size: 40 });
    y += 20;
    for (const line of spacedLines(name.lines)) { put(doc, line, box.x, y, name.style); y += name.style.size * 1.15; }
  });
  if (text.logo && logo) {
    const picture = text.logo;
    tag(doc, 'Figure', { alt: text.publisher ? `Logo of ${text.publisher}` : 'Logo of the publisher' },
      () => placePicture(doc, text.pictures, picture, box.x + box.width - logo.width, box.y, logo.width, logo.height));
  }
  y += 2;
  const rows: [string, string][] = [
    [text.words.t('site.heights'), text.words.t('site.heightsAbove', { unit: text.words.unitName(), datum: printable(model.station.datum) })],
    [text.words.t('pocket.times'), `${text.words.zoneSummary(model)} (${printable(model.timezone)})`],
    [text.words.t('fact.position'), text.words.position(model.station.position)],
  ];
  if (model.station.kind === 'secondary') rows.push([text.words.t('pocket.predictedFrom'), printable(model.reference?.name ?? model.station.reference)]);
  // the label column as wide as its longest label (languages differ), within reason
  const labelStyle = { font: 'narrow' as const, size: LABEL_MIN, color: MID };
  const labelW = Math.min(box.width * 0.4, Math.max(38, ...rows.map(([k]) => widthOf(doc, k, labelStyle) + 3)));
  group(doc, 'Table', {}, () => {
    for (const [k, v] of rows) {
      group(doc, 'TR', {}, () => {
        tag(doc, 'TH', { scope: 'Row' }, () => putFitted(doc, k, box.x, y, labelStyle, labelW - 2, LABEL_MIN));
        y = tag(doc, 'TD', {}, () => paragraph(doc, v, box.x + labelW, y, box.width - labelW, { font: 'narrow', size: BODY }, BODY * 1.2, 3)) + 1;
      });
    }
  });
  y += 4;
  if (model.invented) y = inventedStrip(doc, box, y, text.words) + 6;
  // the caution in short at the foot, the publisher above it
  const cautionStyle = { font: 'narrow' as const, size: LABEL_MIN, color: DARK };
  const lines = wrapLines(doc, text.words.cautionShort, cautionStyle, box.width).length;
  let foot = box.y + box.height - lines * LABEL_MIN * 1.2;
  if (text.publisher) {
    putFitted(doc, text.publisher, box.x, foot - 10, { font: 'bold', size: 8 }, box.width, LABEL_MIN);
  }
  doc.save().lineWidth(0.5).strokeColor(INK).moveTo(box.x, foot - 6).lineTo(box.x + box.width, foot - 6).stroke().restore();
  foot += LABEL_MIN;
  paragraph(doc, text.words.cautionShort, box.x, foot, box.width, cautionStyle, LABEL_MIN * 1.2);
}

export function drawKey(doc: PDFKit.PDFDocument, model: StationYear, box: Box, text: PanelText): void {
  let y = box.y + 9;
  tag(doc, 'H2', {}, () => putFitted(doc, text.words.t('pocket.howToRead'), box.x, y, { font: 'bold', size: 9 }, box.width, LABEL_MIN));
  y += 14;
  const textX = box.x + 34;
  const style = { font: 'narrow' as const, size: BODY };
  const item = (draw: (x: number, baseline: number) => void, words: string) => {
    draw(box.x, y);
    y = paragraph(doc, words, textX, y, box.width - 34, style, BODY * 1.2) + 4;
  };
  const sample = (x: number, b: number, time: string, font: 'narrow' | 'narrow-bold') => {
    const w = put(doc, time, x, b, { font, size: LABEL_MIN });
    put(doc, text.words.heightNumber(4.54), x + w + 1.5, b, { font: 'narrow', size: LABEL_MIN });
  };
  item((x, b) => { laneMark(doc, 'high', x, b, 7); put(doc, text.words.eventShort('high'), x + 5.5, b, { font: 'narrow-bold', size: LABEL_MIN, color: MID }); },
    text.words.t('pocket.keyHigh'));
  item((x, b) => { laneMark(doc, 'low', x, b, 7); put(doc, text.words.eventShort('low'), x + 5.5, b, { font: 'narrow-bold', size: LABEL_MIN, color: MID }); },
    text.words.t('pocket.keyLow'));
  item((x, b) => sample(x, b, '06:29', 'narrow-bold'), text.words.t('site.heightsAbove', { unit: text.words.unitName(), datum: printable(model.station.datum) }));
  item((x, b) => {
    const w = put(doc, text.words.heightNumber(-0.12, true), x, b, { font: 'narrow-bold', size: BODY });
    doc.save().lineWidth(0.5).moveTo(x, b + 1).lineTo(x + w, b + 1).stroke(INK).restore();
  }, text.words.t('pocket.keyBelow'));
  item((x, b) => {
    doc.save().roundedRect(x, b - BODY * 0.92, 11, BODY * 1.18, 1.2).fill(INK).restore();
    put(doc, '12', x + 9.5, b, { font: 'bold', size: BODY, color: WHITE }, 'right');
  }, text.words.t('pocket.keySpring'));
  item((x, b) => {
    doc.save().lineWidth(0.7).roundedRect(x + 0.35, b - BODY * 0.92 + 0.35, 10.3, BODY * 1.18 - 0.7, 1.2).stroke(INK).restore();
    put(doc, '19', x + 9.5, b, { font: 'bold', size: BODY }, 'right');
  }, text.words.t('pocket.keyNeap'));
  item((x, b) => (['new', 'first-quarter', 'full', 'last-quarter'] as const).forEach((p, i) =>
    moonGlyph(doc, p, x + 3 + i * 7.5, b - 2.3, 2.8, text.southern)), text.words.t('pocket.keyMoon'));
  if (model.offsetChanges.length > 0) {
    item((x, b) => clockGlyph(doc, x + 3, b - 2.3, 2.8), text.words.t('pocket.keyClock'));
  }
  y = paragraph(doc, text.words.t('key.weekend'), box.x, y, box.width, { font: 'narrow', size: LABEL_MIN, color: DARK }, LABEL_MIN * 1.2) + 12 - LABEL_MIN * 1.2;
  if (model.invented) y = inventedStrip(doc, box, y, text.words) + 8;
  paragraph(doc, text.words.cautionShort, box.x, Math.max(y + 2, box.y + box.height - 5 * LABEL_MIN * 1.2), box.width,
    { font: 'narrow-bold', size: LABEL_MIN }, LABEL_MIN * 1.2);
}

export function drawLevels(doc: PDFKit.PDFDocument, model: StationYear, box: Box, text: PanelText): void {
  let y = box.y + 9;
  tag(doc, 'H2', {}, () => putFitted(doc, text.words.t('pocket.levels'), box.x, y, { font: 'bold', size: 9 }, box.width * 0.55, LABEL_MIN));
  y += 6;
  put(doc, text.words.t('site.heightsAbove', { unit: text.words.unit(), datum: printable(model.station.datum) }), box.x + box.width, y - 6, { font: 'narrow', size: LABEL_MIN, color: MID }, 'right');
  y += 9;
  for (const row of DATUM_ROWS) {
    put(doc, row.key, box.x, y, { font: 'narrow-bold', size: BODY });
    putFitted(doc, text.words.t(`datum.${row.key}`), box.x + 24, y, { font: 'narrow', size: BODY, color: DARK }, box.width - 52, LABEL_MIN);
    put(doc, text.words.heightNumber(model.datums[row.key]), box.x + box.width, y, { font: 'narrow-bold', size: BODY }, 'right');
    y += BODY * 1.45;
  }
  y += 6;
  const facts: [string, string][] = [
    [text.words.t('fact.tideType'), text.words.tideType(model.tideType.kind)],
    [text.words.t('pocket.meanSpringRange'), text.words.height(model.meanSpringRange)],
    [text.words.t('pocket.meanNeapRange'), text.words.height(model.meanNeapRange)],
    [text.words.t('pocket.highest'), `${text.words.height(model.extremes.highest.height)} (${text.words.date(model.extremes.highest.date)})`],
    [text.words.t('pocket.lowest'), `${text.words.height(model.extremes.lowest.height)} (${text.words.date(model.extremes.lowest.date)})`],
  ];
  for (const [k, v] of facts) {
    putFitted(doc, k, box.x, y, { font: 'narrow', size: BODY, color: MID }, box.width * 0.48, LABEL_MIN);
    putFitted(doc, v, box.x + box.width, y, { font: 'narrow', size: BODY }, box.width * 0.5, LABEL_MIN, 'right');
    y += BODY * 1.45;
  }
  y += 8;
  paragraph(doc, text.words.t('pocket.depthNote'), box.x, y, box.width,
  { font: 'narrow', size: BODY, color: DARK }, BODY * 1.25);
}

export function drawCaution(doc: PDFKit.PDFDocument, model: StationYear, box: Box, text: PanelText): void {
  let y = box.y + 9;
  tag(doc, 'H2', {}, () => put(doc, text.words.t('caution.heading'), box.x, y, { font: 'bold', size: 9 }));
  y += 13;
  y = paragraph(doc, text.words.caution, box.x, y, box.width, { font: 'regular', size: BODY }, BODY * 1.3);
  if (model.invented) {
    y = paragraph(doc, text.words.t('book.inventedCaution'),
      box.x, y + 3, box.width, { font: 'bold', size: BODY }, BODY * 1.3);
  }
  y += 8;
  put(doc, text.words.t('pocket.source'), box.x, y, { font: 'narrow-bold', size: LABEL_MIN, color: MID });
  y = paragraph(doc, printable(model.station.provenance), box.x, y + 8, box.width, { font: 'narrow', size: LABEL_MIN, color: DARK }, LABEL_MIN * 1.25, 6);
  const bottom = box.y + box.height;
  if (text.publisher) putFitted(doc, text.publisher, box.x, bottom - 10, { font: 'bold', size: 8 }, box.width, LABEL_MIN);
  putFitted(doc, text.words.t('pocket.computed', { year: String(model.year) }), box.x, bottom, { font: 'narrow', size: LABEL_MIN, color: MID }, box.width, LABEL_MIN);
}
