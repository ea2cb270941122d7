// The station facts page: where and what the station is, its datums (table and tide staff to scale),
// ranges and age of the tide, provenance, and for a secondary port its reference and differences.
import type { SecondaryStation } from '../../engine/index.js';
import { datumsInHeightOrder, latBelowChartDatum } from '../datum-order.js';
import { DATUM_ROWS, drawDatumScale } from './datum-scale.js';
import { drawConstants } from './constants.js';
import { drawDifferences } from './differences.js';
import { printable } from './format.js';
import type { LogicalPage, PageContext } from './page.js';
import { unit } from './page.js';
import type { StationView } from './station-view.js';
import { DARK, HAIRLINE, INK, MID, RULE } from './style.js';
import { group, tag } from './tags.js';
import { paragraph, put, putFitted } from './text.js';

function sectionTitle(ctx: PageContext, title: string, y: number): number {
  const s = unit(ctx);
  tag(ctx.doc, 'H2', {}, () => putFitted(ctx.doc, title, ctx.box.x, y, { font: 'bold', size: 10.5 * s }, ctx.box.width, 7 * s));
  ctx.doc.save().lineWidth(0.6 * s).strokeColor(INK)
    .moveTo(ctx.box.x, y + 3.5 * s).lineTo(ctx.box.x + ctx.box.width, y + 3.5 * s).stroke().restore();
  return y + 15 * s;
}

/** Label/value lines; values wrap. Returns the next baseline. */
function keyValues(ctx: PageContext, rows: [string, string][], y: number, labelW: number): number {
  const s = unit(ctx);
  const { doc, box } = ctx;
  // read as a two-column table: each label a row header, its value the cell beside it
  group(doc, 'Table', {}, () => {
    for (const [k, v] of rows) {
      group(doc, 'TR', {}, () => {
        // a long label (some languages' words are long) wraps in its own column instead of running into the value
        const labelEnd = tag(doc, 'TH', { scope: 'Row' },
          () => paragraph(doc, k, box.x, y, labelW - 4 * s, { font: 'narrow', size: 7.8 * s, color: MID }, 9 * s, 2));
        y = tag(doc, 'TD', {}, () => paragraph(doc, v, box.x + labelW, y, box.width - labelW, { font: 'regular', size: 8.4 * s }, 10.6 * s, 3));
        y = Math.max(y, labelEnd) + 1.5 * s;
      });
    }
  });
  return y;
}

export function factsPage(view: StationView): LogicalPage {
  const { model } = view;
  return {
    kind: 'facts',
    footer: { invented: model.invented, label: view.name },
    outline: { title: view.words.t('book.facts'), level: 1 },
    draw(ctx) {
      const { doc, box } = ctx;
      const s = unit(ctx);
      const w = view.words;
      const st = model.station;
      let y = box.y + 14 * s;
      tag(doc, 'H1', {}, () => put(doc, w.t('book.facts'), box.x, y, { font: 'bold', size: 16 * s }));
      y += 14 * s;
      putFitted(doc, view.name, box.x, y, { font: 'regular', size: 10 * s, color: DARK }, box.width, 6 * s);
      y += 18 * s;

      const age = model.ageOfTideHours;
      y = keyValues(ctx, [
        [w.t('fact.position'), w.position(st.position)],
        [w.t('fact.timeZone'), `${w.zoneSummary(model)} (${printable(model.timezone)})`],
        [w.t('fact.tideType'), `${w.tideType(model.tideType.kind)} (${w.t('fact.formNumber', { value: w.number(model.tideType.formNumber, 2) })})`],
        [w.t('fact.meanRanges'), w.t('fact.rangesValue', { springs: w.height(model.meanSpringRange), neaps: w.height(model.meanNeapRange) })],
        [w.t('fact.ageOfTide'), w.t('fact.ageValue', { age: w.hours(age) })],
        ...(model.springLagHours === null ? [] : [[w.t('fact.springMarks'), w.t('fact.springMarksValue', { lag: w.hours(model.springLagHours) })] as [string, string]]),
        ...(st.number === undefined ? [] : [[w.t('station.numberLabel'), printable(st.number)] as [string, string]]),
        ...(st.levelling === undefined ? [] : [[w.t('station.levelling'), w.t('station.levellingValue', {
          datum: printable(st.datum), depth: w.height(st.levelling.chart_datum_below), land: printable(st.levelling.datum) })] as [string, string]]),
        ...(st.datum_authority === undefined ? [] : [[w.t('station.datumAuthority'), printable(st.datum_authority)] as [string, string]]),
        ...(st.observations === undefined ? [] : [[w.t('station.observations'), w.t('station.observationsValue', {
          from: w.date(st.observations.from), to: w.date(st.observations.to), source: printable(st.observations.source) })] as [string, string]]),
        [w.t('fact.provenance'), printable(st.provenance)],
      ], y, 62 * s);

      y += 8 * s;
      y = sectionTitle(ctx, w.t('book.datumsAbove', { unit: w.unit(), datum: printable(st.datum) }), y);
      const tableW = Math.min(box.width * 0.58, 210 * s);
      const rowH = 12.5 * s;
      const tableTop = y;
      // In height order, chart datum where it falls, as on the site.
      const datumRows = datumsInHeightOrder(model.datums).map((r) => ({ key: r.key as string, name: r.key === 'CD' ? printable(st.datum) : w.t(`datum.${r.key}`), v: r.value }));
      // With a levelling datum, a second column gives each level above it (a column, not a replacement).
      const land = st.levelling;
      const landW = land === undefined ? 0 : 44 * s;
      if (land !== undefined) {
        const head = { font: 'narrow', size: 6.8 * s, color: MID } as const;
        put(doc, w.t('station.aboveDatum', { datum: printable(st.datum) }), box.x + tableW - landW, y - 1 * s, head, 'right');
        putFitted(doc, w.t('station.aboveDatum', { datum: printable(land.datum) }), box.x + tableW, y + 7 * s, head, tableW * 0.6, 5 * s, 'right');
        y += 18 * s;
      }
      // a table: each level's abbreviation heads its row, then its name and height(s)
      group(doc, 'Table', {}, () => {
        for (const r of datumRows) {
          const bold = r.key === 'CD';
          group(doc, 'TR', {}, () => {
            tag(doc, 'TH', { scope: 'Row' }, () => put(doc, r.key, box.x, y, { font: bold ? 'bold' : 'narrow-bold', size: 8.2 * s }));
            tag(doc, 'TD', {}, () => putFitted(doc, r.name, box.x + 32 * s, y, { font: 'narrow', size: 8.2 * s, color: DARK }, tableW - 70 * s - landW, 4 * s));
            tag(doc, 'TD', {}, () => put(doc, w.heightNumber(r.v), box.x + tableW - landW, y, { font: bold ? 'bold' : 'regular', size: 8.6 * s }, 'right'));
            if (land !== undefined) tag(doc, 'TD', {}, () => put(doc, w.heightNumber(r.v - land.chart_datum_below), box.x + tableW, y, { font: 'regular', size: 8.6 * s, color: DARK }, 'right'));
          });
          doc.save().lineWidth(HAIRLINE).strokeColor(RULE)
            .moveTo(box.x, y + 3.8 * s).lineTo(box.x + tableW, y + 3.8 * s).stroke().restore();
          y += rowH;
        }
      });
      y = paragraph(doc, w.t('book.latHatNote', { epoch: `${model.datums.epoch.from}\u2013${model.datums.epoch.to}` }), box.x, y + 2 * s, tableW, { font: 'narrow', size: 7 * s, color: MID }, 8.6 * s);
      const latBelow = latBelowChartDatum(model.datums);
      if (latBelow !== null) {
        y = paragraph(doc, w.t('datum.latBelow', { depth: w.height(latBelow), datum: printable(st.datum) }),
          box.x, y + 2 * s, tableW, { font: 'bold', size: 7.4 * s }, 9 * s);
      }
      const diagramX = box.x + tableW + 8 * s;
      drawDatumScale(doc, model.datums, printable(st.datum), w,
        { x: diagramX, y: tableTop + 2 * s, width: box.x + box.width - diagramX, height: Math.max(rowH * 8, y - tableTop - 6 * s) }, s);
      y = Math.max(y, tableTop + rowH * 8 + 12 * s) + 10 * s;

      if (st.kind === 'secondary') {
        y = sectionTitle(ctx, `${w.t('port.secondaryOf')} ${printable(model.reference?.name ?? st.reference)}`, y);
        y = drawDifferences(ctx, st as SecondaryStation, y);
      } else {
        y = sectionTitle(ctx, w.t('book.constants'), y);
        y = drawConstants(ctx, st, y, 12);
      }

      y = sectionTitle(ctx, w.t('book.theYear', { year: model.year }), y + 4 * s);
      const { highest, lowest } = model.extremes;
      const at = (e: typeof highest) => w.t('book.dateAt', { date: w.date(e.date), clock: e.clock, offset: w.offset(e.offset) });
      y = keyValues(ctx, [
        [w.t('fact.highest'), `${w.height(highest.height)}, ${at(highest)}`],
        [w.t('fact.lowest'), `${w.height(lowest.height)}${lowest.belowDatum ? ` (${w.t('height.belowDatum')})` : ''}, ${at(lowest)}`],
      ], y, 62 * s);

      if (model.warnings.length > 0) {
        y = sectionTitle(ctx, w.t('site.warnings'), y + 6 * s);
        for (const warning of model.warnings) {
          y = paragraph(doc, `\u2022 ${w.warning(warning, printable(st.datum))}`, box.x, y, box.width, { font: 'bold', size: 8 * s }, 10 * s, 3);
        }
      }
    },
  };
}
