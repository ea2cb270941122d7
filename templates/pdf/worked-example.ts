// A secondary port's compact section in the combined volumes: its facts page (datums, differences),
// then one high water worked from its reference port's event, step by step.
import type { AlmanacEvent, DifferenceExample, StationYear } from '../../engine/index.js';
import { factsPage } from './facts.js';
import { printable } from './format.js';
import type { LogicalPage } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { DARK, HAIRLINE, MID, RULE } from './style.js';
import { tag } from './tags.js';
import { paragraph, put, putFitted } from './text.js';

/** What the example page reads: the worked numbers and the two ports' printed events. */
export interface WorkedExample {
  example: DifferenceExample;
  highWater: AlmanacEvent; // the reference port's, as printed in its tables
  lowWater: AlmanacEvent;
  result: AlmanacEvent | null; // the secondary port's own high water from it, as its tables print it
}

/** The secondary port's own event of this instant (its tables print exactly this one). */
export function resultEvent(model: StationYear, time: number): AlmanacEvent | null {
  let best: AlmanacEvent | null = null;
  for (const e of model.events) {
    if (e.type !== 'high') continue;
    if (best === null || Math.abs(Date.parse(e.time) - time) < Math.abs(Date.parse(best.time) - time)) best = e;
  }
  return best !== null && Math.abs(Date.parse(best.time) - time) <= 60_000 ? best : null;
}

function examplePage(view: StationView, worked: WorkedExample): LogicalPage {
  const { model } = view;
  return {
    kind: 'facts',
    footer: { invented: model.invented, label: view.name },
    outline: { title: view.words.t('example.title'), level: 1 },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      const w = view.words;
      const reference = printable(model.reference?.name ?? '');
      const x = worked.example;
      const when = (e: AlmanacEvent): string => w.t('book.dateAt', { date: w.date(e.date), clock: e.clock, offset: w.offset(e.offset) });
      let y = box.y + 14 * s;
      tag(doc, 'H1', {}, () => put(doc, w.t('example.title'), box.x, y, { font: 'bold', size: 16 * s }));
      y += 14 * s;
      putFitted(doc, view.name, box.x, y, { font: 'regular', size: 10 * s, color: DARK }, box.width, 6 * s);
      y = paragraph(doc, w.t('example.intro', { station: view.name, reference }), box.x, y + 16 * s, box.width,
        { font: 'regular', size: 8.4 * s }, 10.6 * s) + 10 * s;
      const rows: [string, string][] = [
        [w.t('example.reference', { reference }), `${w.height(worked.highWater.height)}, ${when(worked.highWater)}`],
        [w.t('example.low'), `${w.height(worked.lowWater.height)}, ${when(worked.lowWater)}`],
        [w.t('example.range'), w.height(x.range)],
        [w.t('example.meanRanges', { reference }), w.t('fact.rangesValue', { springs: w.height(x.springRange), neaps: w.height(x.neapRange) })],
        [w.t('example.factor'), w.number(x.factor, 2)],
        [w.t('example.timeDifference'), w.minutesSigned(x.timeDifference)],
        [w.t('example.heightDifference'), w.heightSigned(x.heightDifference)],
        [w.t('example.result', { station: view.name }), worked.result === null ? w.height(x.height)
          : `${w.height(worked.result.height)}, ${when(worked.result)}`],
      ];
      const labelW = box.width * 0.52;
      rows.forEach(([label, value], i) => {
        const last = i === rows.length - 1;
        const labelEnd = paragraph(doc, label, box.x, y, labelW - 6 * s, { font: last ? 'narrow-bold' : 'narrow', size: 7.8 * s, color: last ? DARK : MID }, 9.4 * s, 3);
        const valueEnd = paragraph(doc, value, box.x + labelW, y, box.width - labelW, { font: last ? 'bold' : 'regular', size: 8.6 * s }, 10.6 * s, 3);
        y = Math.max(labelEnd, valueEnd) + 1 * s;
        doc.save().lineWidth(HAIRLINE).strokeColor(RULE).moveTo(box.x, y - 6 * s).lineTo(box.x + box.width, y - 6 * s).stroke().restore();
        y += 4 * s;
      });
      paragraph(doc, w.t('example.note'), box.x, y + 6 * s, box.width, { font: 'narrow', size: 7.2 * s, color: DARK }, 9 * s);
    },
  };
}

/** A secondary port's compact section: facts, then the worked example when there is one. */
export function compactPages(view: StationView, worked: WorkedExample | null): LogicalPage[] {
  const facts = factsPage(view);
  const first: LogicalPage = { ...facts, outline: { title: view.name, level: 0 }, anchor: `station-${view.model.station.id}` };
  return worked === null ? [first] : [first, examplePage(view, worked)];
}
