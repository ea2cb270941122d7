// The PDF book of a tidal stream station's year: a first page with the station, its directions and
// both cautions, then one page per month of our own design: per day the slack times, and every
// strongest flood and ebb with its time, rate and an arrow turned to the direction the water goes.
import type { StreamAlmanacEvent, StreamDayEntry, StreamYear } from '../../engine/index.js';
import { wordsFor, type Words } from '../locale/index.js';
import { editionDate } from './document.js';
import { printable } from './format.js';
import { contentBox, pageGeometry } from './geometry.js';
import { springNeapBadge } from './glyphs.js';
import { offsetStatement } from './month-page.js';
import { imprintPage } from './imprint.js';
import { notesPage } from './notes.js';
import { imprintText, publisherParts } from './publisher.js';
import { checkBookOptions, type BookOptions } from './options.js';
import type { BookSettings, LogicalPage, PageContext } from './page.js';
import { renderBook } from './render.js';
import { HAIRLINE, INK, MID, RULE } from './style.js';
import { group, tag } from './tags.js';
import { paragraph, put, putFitted, widthOf } from './text.js';

const HEADER = 46; // design points above the first day row

/** A dart pointing the way the water goes: turned clockwise from north by the direction in degrees true. */
export function streamArrow(doc: PDFKit.PDFDocument, direction: number, cx: number, cy: number, size: number): void {
  const r = size / 2;
  doc.save().translate(cx, cy).rotate(direction)
    .polygon([0, -r], [r * 0.55, r * 0.45], [0, r * 0.15], [-r * 0.55, r * 0.45]).fill(INK)
    .restore();
}

const bearing = (d: number): string => `${String(Math.round(d) % 360).padStart(3, '0')}\u00b0`;

function firstPage(model: StreamYear, title: string, w: Words): LogicalPage {
  const st = model.station;
  return {
    kind: 'facts',
    footer: { invented: model.invented, label: st.name },
    outline: { title: st.name, level: 0 },
    draw(ctx: PageContext) {
      const { doc, box } = ctx;
      const s = ctx.settings.geometry.scale;
      let y = box.y + 20 * s;
      // the book's title: the station, then what the book is and its year
      tag(doc, 'H1', {}, () => {
        putFitted(doc, `${st.name} `, box.x, y, { font: 'bold', size: 18 * s }, box.width, 9 * s);
        y += 16 * s;
        put(doc, `${title} \u00b7 ${w.t('stream.title', { year: model.year })}`, box.x, y, { font: 'regular', size: 11 * s, color: MID });
      });
      y += 22 * s;
      const facts: [string, string][] = [
        [w.t('stream.station'), st.kind === 'stream-secondary' ? w.t('stream.secondaryOf', { station: model.reference?.name ?? '' })
          : `${w.t('stream.kind')}${model.rotary ? ` (${w.t('stream.rotary')})` : ''}`],
        [w.t('fact.position'), w.position(st.position)],
        [w.t('fact.localTime'), `${w.zoneSummary(model)} (${model.timezone})`],
        [w.t('stream.floodToward'), w.t('stream.true', { bearing: bearing(model.floodDirection) })],
        [w.t('stream.ebbToward'), w.t('stream.true', { bearing: bearing(model.ebbDirection) })],
        [w.t('stream.rates'), w.t('stream.inKnots')],
        [w.t('stream.springsNeaps'), model.tideReference ? w.t('stream.asAt', { station: model.tideReference.name }) : w.t('stream.ownRates')],
      ];
      // read as a two-column table, each label the header of its row; the arrows are decoration beside the bearings
      group(doc, 'Table', {}, () => facts.forEach(([label, value], i) => group(doc, 'TR', {}, () => {
        tag(doc, 'TH', { scope: 'Row' }, () => putFitted(doc, label, box.x, y, { font: 'narrow-bold', size: 8.5 * s }, 96 * s, 5.5 * s));
        const arrow = i === 3 ? model.floodDirection : i === 4 ? model.ebbDirection : null;
        const vx = box.x + 100 * s + (arrow === null ? 0 : 12 * s);
        if (arrow !== null) streamArrow(doc, arrow, box.x + 104 * s, y - 3 * s, 8 * s);
        // a long value (a zone described in words) wraps onto a second line rather than shrinking out of reach
        const end = tag(doc, 'TD', {}, () => paragraph(doc, value, vx, y, box.x + box.width - vx, { font: 'narrow', size: 8.5 * s }, 10.5 * s, 2));
        y = end + 1.5 * s;
      })));
      y += 14 * s;
      tag(doc, 'H2', {}, () => put(doc, w.t('caution.heading').toLocaleUpperCase(w.tag), box.x, y, { font: 'bold', size: 10 * s }));
      y += 14 * s;
      y = paragraph(doc, printable(`${w.caution} ${w.t('caution.streams')}`), box.x, y, box.width, { font: 'regular', size: 8.5 * s });
      if (model.invented) {
        y += 10 * s;
        paragraph(doc, `${w.t('book.inventedBanner')}: ${w.t('stream.inventedThis')}`, box.x, y, box.width, { font: 'bold', size: 8.5 * s });
      }
      y += 18 * s;
      // the key's words speak of a sample arrow turned to 045°: it is drawn beside them
      streamArrow(doc, 45, box.x + 5 * s, y + 9 * s, 9 * s);
      paragraph(doc, `${w.t('book.howToRead')}: ${w.t('stream.keySlack')} ${w.t('stream.keySlackText')}; ${w.t('stream.flood')} ${w.t('stream.and')} ${w.t('stream.ebb')}${w.t('stream.keyPeak')}`,
        box.x + 15 * s, y + 12 * s, box.width - 15 * s, { font: 'oblique', size: 8 * s, color: MID });
    },
  };
}

function peak(doc: PDFKit.PDFDocument, e: StreamAlmanacEvent, x: number, y: number, u: number): number {
  // each piece drawn with an unseen space after it (read as words), placed by its own width
  const time = { font: 'narrow' as const, size: 7.4 * u };
  const rate = { font: 'narrow-bold' as const, size: 7.4 * u };
  const w1 = widthOf(doc, e.clock, time);
  const w2 = widthOf(doc, e.speed.toFixed(1), rate);
  put(doc, `${e.clock} `, x, y, time);
  put(doc, `${e.speed.toFixed(1)} `, x + w1 + 3 * u, y, rate);
  if (e.direction !== null) streamArrow(doc, e.direction, x + w1 + w2 + 9 * u, y - 2.6 * u, 7 * u);
  return w1 + w2 + 16 * u;
}

function monthPage(model: StreamYear, month: StreamYear['months'][number], words: Words): LogicalPage {
  const days: StreamDayEntry[] = model.days.slice(month.firstDayIndex, month.firstDayIndex + month.dayCount);
  return {
    kind: 'month',
    footer: { invented: model.invented, label: model.station.name },
    outline: { title: `${words.monthName(month.month)} ${model.year}`, level: 1 },
    draw(ctx: PageContext) {
      const { doc, box } = ctx;
      const u = ctx.settings.geometry.scale;
      const right = box.x + box.width;
      const y0 = box.y;
      tag(doc, 'H1', {}, () => {
        const mw = put(doc, `${words.monthName(month.month)} `, box.x, y0 + 17 * u, { font: 'bold', size: 21 * u });
        put(doc, String(model.year), box.x + mw + 6 * u, y0 + 17 * u, { font: 'regular', size: 21 * u, color: MID });
      });
      putFitted(doc, model.station.name, right, y0 + 8 * u, { font: 'bold', size: 9.5 * u }, box.width / 2, 6 * u, 'right');
      put(doc, words.t('stream.groupName'), right, y0 + 17.5 * u, { font: 'narrow', size: 7.6 * u, color: MID }, 'right');
      const info = `${offsetStatement(days as never, words)} \u00b7 ${words.t('stream.rates')} ${words.t('stream.inKnots')} \u00b7 ${words.t('stream.directionsText', { flood: bearing(model.floodDirection), ebb: bearing(model.ebbDirection) })}`;
      putFitted(doc, info, box.x, y0 + 29 * u, { font: 'narrow', size: 7.6 * u }, box.width, 5 * u);

      const col = { day: box.x, slack: box.x + box.width * 0.12, flood: box.x + box.width * 0.41, ebb: box.x + box.width * 0.705 };
      const hy = y0 + 41 * u;
      const head = { font: 'narrow-bold' as const, size: 6.3 * u, color: MID };
      // the month read as a table: a row of column headers, then each day a row headed by its date
      group(doc, 'Table', { title: `${words.monthName(month.month)} ${model.year}` }, () => {
        group(doc, 'TR', {}, () => {
          const th = (draw: () => unknown) => tag(doc, 'TH', { scope: 'Column' }, draw);
          th(() => put(doc, words.t('site.colDay').toLocaleUpperCase(words.tag), col.day, hy, head));
          th(() => put(doc, words.t('stream.colSlack').toLocaleUpperCase(words.tag), col.slack, hy, head));
          th(() => putFitted(doc, `${words.t('stream.flood').toLocaleUpperCase(words.tag)}  ${words.t('stream.colUnit')}`, col.flood, hy, head, col.ebb - col.flood - 4 * u, 4 * u));
          th(() => putFitted(doc, `${words.t('stream.ebb').toLocaleUpperCase(words.tag)}  ${words.t('stream.colUnit')}`, col.ebb, hy, head, right - col.ebb, 4 * u));
        });
        drawDays(ctx, model, days, col, words);
      });
    },
  };
}

/** The day rows of a stream month: date, slack times (with a spring or neap mark), floods and ebbs. */
function drawDays(ctx: PageContext, model: StreamYear, days: StreamDayEntry[], col: { day: number; slack: number; flood: number; ebb: number },
  words: Words): void {
  const { doc, box } = ctx;
  const u = ctx.settings.geometry.scale;
  const right = box.x + box.width;
  const y0 = box.y;
  doc.save().lineWidth(0.9 * u).strokeColor(INK).moveTo(box.x, y0 + HEADER * u - 3 * u).lineTo(right, y0 + HEADER * u - 3 * u).stroke().restore();

  const row = (box.height - HEADER * u) / 31;
  let top = y0 + HEADER * u;
  for (const day of days) {
    const base = top + row * 0.68;
    group(doc, 'TR', {}, () => {
      tag(doc, 'TH', { scope: 'Row' }, () => put(doc, `${words.weekdayShort(day.weekday)} ${day.dayOfMonth}`, col.day, base,
        { font: day.weekday === 7 ? 'narrow-bold' : 'narrow', size: 7.6 * u }));
      group(doc, 'TD', {}, () => {
        const mark = day.springNeap;
        if (mark) {
          tag(doc, 'Figure', { alt: words.springNeapName(mark) }, () => springNeapBadge(doc, mark, col.slack - 6 * u, top + row / 2, 7 * u, 7 * u, 5.2 * u,
            words.t(mark === 'spring' ? 'tide.springMark' : 'tide.neapMark')));
        }
        let sx = col.slack;
        tag(doc, 'P', {}, () => {
          for (const e of day.events.filter((x) => x.type === 'slack')) {
            put(doc, `${e.clock} `, sx, base, { font: 'narrow', size: 7.4 * u });
            sx += widthOf(doc, e.clock, { font: 'narrow', size: 7.4 * u }) + 4.5 * u;
          }
        });
      });
      // a strongest stream's arrow is drawn inside its cell: the rate and the month's directions say where it runs
      let fx = col.flood;
      tag(doc, 'TD', {}, () => { for (const e of day.events.filter((x) => x.type === 'flood')) fx += peak(doc, e, fx, base, u); });
      let ex = col.ebb;
      tag(doc, 'TD', {}, () => { for (const e of day.events.filter((x) => x.type === 'ebb')) ex += peak(doc, e, ex, base, u); });
    });
    top += row;
    const weekEnd = day.weekday === 7;
    doc.save().lineWidth(weekEnd ? 0.9 * u : HAIRLINE).strokeColor(weekEnd ? INK : RULE).moveTo(box.x, top).lineTo(right, top).stroke().restore();
  }
}

/** The pages of one stream-year: its first page, then a page per month. */
export function streamBookPages(model: StreamYear, title: string, words: Words): LogicalPage[] {
  return [firstPage(model, title, words), ...model.months.map((month) => monthPage(model, month, words))];
}

export async function renderStreamBook(model: StreamYear, options: BookOptions): Promise<Buffer> {
  checkBookOptions(options);
  const g = pageGeometry(options.page);
  contentBox(g, 1);
  const title = printable(options.title ?? wordsFor({ locale: options.locale }).t('book.defaultTitle'));
  const words = wordsFor({ locale: options.locale, units: options.units, caution: options.caution });
  const settings: BookSettings = { units: options.units, geometry: g, title, publisher: options.publisher, words, press: options.press, warn: options.warn };
  const own = publisherParts(options, g, model.invented, 0).own;
  const [first, ...months] = streamBookPages(model, title, words);
  const pages = [first!, ...own.front, ...months, ...own.back, imprintPage([model], words, imprintText(options), model.station.name)];
  return renderBook(pages, settings, {
    title: `${model.station.name}: ${words.t('stream.title', { year: model.year })}`,
    author: options.publisher,
    subject: `${words.t('stream.caption', { station: model.station.name, month: '', year: model.year }).replace(', ', ' ').replace('  ', ' ')}${model.invented ? ` (${words.t('book.inventedSubject')})` : ''}`,
    keywords: `${words.t('stream.groupName')}, ${words.t('stream.colSlack')}, ${words.t('stream.flood')}, ${words.t('stream.ebb')}`,
    date: options.stamp !== undefined ? new Date(options.stamp) : editionDate(model.year),
    lang: words.tag,
    tagged: options.tagged,
  }, options.imposition ?? 'none', () => notesPage({ invented: model.invented, label: model.station.name }));
}
