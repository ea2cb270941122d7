// The HTML report of a harmonic analysis: one static page from a Nunjucks template (autoescaped, like
// the site), no scripts, the site's own palette. This file turns the analysis into a view of ready
// strings; the template only places them. It presents the analysis; it computes nothing new.

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import nunjucks from 'nunjucks';
import { numberAt, type HarmonicAnalysis, type StationMeta } from '../../engine/index.js';
import { wordsFor, type MessageKey, type Words } from '../locale/index.js';
import { projectRoot } from '../site/paths.js';
import { timeSeriesChart } from './chart.js';
import { sitePaletteCss } from './palette.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;

/** The station a report is about: the same facts the analysed station file is written from. */
export type ReportStation = StationMeta;

/** Amplitude ÷ 95 % half-width: from 2 the line stands well clear of the noise; below 1 its interval reaches zero. */
export type Reliability = 'firm' | 'fair' | 'weak';
export function reliability(ratio: number): Reliability {
  return ratio >= 2 ? 'firm' : ratio >= 1 ? 'fair' : 'weak';
}

const instant = (t: number): string => `${new Date(t).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** The first stretch of `days` with the most readings, so the detail chart shows data, not a gap. */
function busiestWindow(times: Float64Array, days: number): [number, number] {
  const width = days * DAY;
  let best = 0, bestStart = times[0] ?? 0;
  let j = 0; // the first reading at or after t + width
  for (const [i, t] of times.entries()) {
    while (j < times.length && numberAt(times, j, 'record times') < t + width) j++;
    if (j - i > best) {
      best = j - i;
      bestStart = t;
    }
    if (j === times.length) break;
  }
  return [bestStart, bestStart + width];
}

/** The three charts, as markup this module generated (its texts escaped inside timeSeriesChart). */
function charts(a: HarmonicAnalysis, w: Words): Record<'record' | 'fit' | 'residual', nunjucks.runtime.SafeString> {
  const { record, fitted } = a;
  const breakAfterMs = Math.max(3 * a.summary.intervalHours * HOUR, 2 * HOUR);
  const residuals = record.heights.map((h, i) => h - numberAt(fitted, i, 'fitted heights'));
  const [start, end] = busiestWindow(record.times, 4);
  const safe = (svg: string) => new nunjucks.runtime.SafeString(svg);
  return {
    record: safe(timeSeriesChart(
      [{ times: record.times, values: record.heights, className: 'observed', label: w.t('report.observed') }],
      { id: 'record-chart', title: w.t('report.recordTitle'), breakAfterMs, description: w.t('report.recordDescription') })),
    fit: safe(timeSeriesChart([
      { times: record.times, values: record.heights, className: 'observed', label: w.t('report.observed') },
      { times: record.times, values: fitted, className: 'fitted', label: w.t('report.fittedTide') },
    ], {
      id: 'fit-chart', title: w.t('report.fitTitle'), start, end, breakAfterMs,
      description: w.t('report.fitDescription', { from: instant(start) }),
    })),
    residual: safe(timeSeriesChart(
      [{ times: record.times, values: residuals, className: 'residual', label: w.t('report.observedMinusFitted') }],
      { id: 'residual-chart', title: w.t('report.residualTitle'), zeroLine: true, breakAfterMs,
        description: w.t('report.residualDescription') })),
  };
}

/** Everything the template prints, as strings. */
export function reportView(a: HarmonicAnalysis, station: ReportStation, root = projectRoot(), w: Words = wordsFor()) {
  const fixed = (v: number, digits: number): string => w.number(v, digits);
  const s = a.summary;
  const r = a.residual;
  const days = s.spanHours / 24;
  const rayleighLeftOut = a.excluded.filter((e) => e.reason === 'rayleigh');
  const tooFast = a.excluded.filter((e) => e.reason === 'nyquist').map((e) => e.name);
  const title = w.t('report.title', { station: station.name });
  return {
    lang: w.tag,
    t: (key: MessageKey, params?: Record<string, string | number>) => w.t(key, params),
    title,
    where: `${station.id} · ${fixed(station.latitude, 4)}°, ${fixed(station.longitude, 4)}° (${w.t('report.eastPositive')}) · ${station.timezone}`,
    css: new nunjucks.runtime.SafeString(`${sitePaletteCss(root)}\n${readFileSync(join(root, 'templates', 'report', 'report.css'), 'utf8')}`),
    caution: w.caution,
    shortNote: days < 365 ? w.t('report.shortNote', { days: fixed(days, 1) }) : '',
    recordFacts: [
      [w.t('report.file'), a.record.file],
      [w.t('report.firstReading'), instant(s.start)],
      [w.t('report.lastReading'), instant(s.end)],
      [w.t('report.length'), w.t('report.days', { days: fixed(days, 2) })],
      [w.t('report.readings'), `${s.count}`],
      [w.t('report.interval'), w.t('report.minutes', { minutes: fixed(s.intervalHours * 60, 1) })],
      [w.t('report.coverage'), `${fixed(s.coverage * 100, 1)} %`],
      [w.t('report.gaps'), s.gaps.length > 0 ? s.gaps.slice(0, 3).map((g) => w.t('report.gap', { days: fixed(g.hours / 24, 2), from: instant(g.from) })).join('; ') : w.t('report.none')],
      [w.t('report.duplicates'), `${a.record.duplicatesDropped}`],
    ],
    residualFacts: [
      [w.t('report.rms'), `${fixed(r.rms, 3)} m`],
      [w.t('report.largest'), w.t('report.largestValue', { value: fixed(r.maxAbs, 3), time: instant(r.maxAbsTime) })],
      [w.t('report.explained'), `${fixed(r.explained * 100, 2)} %`],
      [w.t('report.standardError'), w.t('report.standardErrorValue', { value: fixed(r.standardError, 3), count: String(r.count), unknowns: String(r.unknowns) })],
    ],
    charts: charts(a, w),
    meanLevel: fixed(a.meanLevel, 4),
    meanLevelError: fixed(a.meanLevelError, 4),
    trend: a.trend === undefined ? '' : `${fixed(a.trend.change, 3)} ± ${fixed(a.trend.error, 3)}`,
    datum: station.datum,
    constituents: a.constituents.map((c) => {
      const ratio = c.amplitudeError > 0 ? c.amplitude / c.amplitudeError : Infinity;
      return {
        name: c.name,
        speed: fixed(c.speed, 7),
        amplitude: fixed(c.amplitude, 4),
        amplitudeError: fixed(c.amplitudeError, 4),
        phase: fixed(c.phase, 2),
        phaseError: fixed(c.phaseError, 2),
        ratio: Number.isFinite(ratio) ? fixed(ratio, 1) : '∞',
        reliability: reliability(ratio),
        reliabilityWord: w.t(`report.${reliability(ratio)}`),
        inferredFrom: c.inferred?.from ?? '',
      };
    }),
    inferred: a.constituents.filter((c) => c.inferred !== undefined)
      .map((c) => ({ name: c.name, from: c.inferred!.from, ratio: fixed(c.inferred!.ratio, 4) })),
    leftOut: rayleighLeftOut.map((e) => ({
      name: e.name,
      from: e.conflictsWith === 'Z0' ? w.t('report.meanLevelName') : e.conflictsWith ?? '',
      days: Number.isFinite(e.daysNeeded ?? Infinity) ? fixed(e.daysNeeded!, 1) : w.t('report.never'),
    })),
    rayleigh: fixed(a.rayleigh, (String(a.rayleigh).split('.')[1] ?? '').length),
    tooFast: tooFast.join(', '),
    intervalMinutes: fixed(s.intervalHours * 60, 1),
    readings: String(r.count),
    file: a.record.file,
  };
}

/** The complete report as an HTML document. */
export function renderAnalysisReport(analysis: HarmonicAnalysis, station: ReportStation, locale?: string): string {
  const root = projectRoot();
  const env = new nunjucks.Environment(new nunjucks.FileSystemLoader(join(root, 'templates', 'report')),
    { autoescape: true, throwOnUndefined: true, trimBlocks: true, lstripBlocks: true });
  return env.render('analysis-report.njk', reportView(analysis, station, root, wordsFor({ locale })));
}
