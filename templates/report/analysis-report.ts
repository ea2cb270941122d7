// The HTML report of a harmonic analysis: one static page from a Nunjucks template (autoescaped, like
// the site), no scripts, the site's own palette. This file turns the analysis into a view of ready
// strings; the template only places them. It presents the analysis; it computes nothing new.

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import nunjucks from 'nunjucks';
import { CAUTION } from '../../engine/index.js';
import type { HarmonicAnalysis, StationMeta } from '../../engine/index.js';
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

const fixed = (v: number, digits: number): string => v.toFixed(digits).replace(/^-(?=0\.?0*$)/, '').replace('-', '\u2212');
const instant = (t: number): string => `${new Date(t).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** The first stretch of `days` with the most readings, so the detail chart shows data, not a gap. */
function busiestWindow(times: Float64Array, days: number): [number, number] {
  const width = days * DAY;
  let best = 0, bestStart = times[0] ?? 0;
  for (let i = 0, j = 0; i < times.length; i++) {
    while (j < times.length && times[j]! < times[i]! + width) j++;
    if (j - i > best) {
      best = j - i;
      bestStart = times[i]!;
    }
    if (j === times.length) break;
  }
  return [bestStart, bestStart + width];
}

/** The three charts, as markup this module generated (its texts escaped inside timeSeriesChart). */
function charts(a: HarmonicAnalysis): Record<'record' | 'fit' | 'residual', nunjucks.runtime.SafeString> {
  const { record, fitted } = a;
  const breakAfterMs = Math.max(3 * a.summary.intervalHours * HOUR, 2 * HOUR);
  const residuals = new Float64Array(record.heights.length);
  for (let i = 0; i < residuals.length; i++) residuals[i] = record.heights[i]! - fitted[i]!;
  const [start, end] = busiestWindow(record.times, 4);
  const safe = (svg: string) => new nunjucks.runtime.SafeString(svg);
  return {
    record: safe(timeSeriesChart(
      [{ times: record.times, values: record.heights, className: 'observed', label: 'Observed' }],
      { id: 'record-chart', title: 'The gauge record', breakAfterMs,
        description: 'Observed height (m on the record’s zero) against time (UTC); breaks mark gaps.' })),
    fit: safe(timeSeriesChart([
      { times: record.times, values: record.heights, className: 'observed', label: 'Observed' },
      { times: record.times, values: fitted, className: 'fitted', label: 'Fitted tide' },
    ], {
      id: 'fit-chart', title: 'Observed and fitted heights, four days', start, end, breakAfterMs,
      description: `Observed height and the fitted harmonic tide over four days from ${instant(start)}.`,
    })),
    residual: safe(timeSeriesChart(
      [{ times: record.times, values: residuals, className: 'residual', label: 'Observed − fitted' }],
      { id: 'residual-chart', title: 'Residual', zeroLine: true, breakAfterMs,
        description: 'Observed minus fitted height (m) over the whole record: weather, surges, seiches and what the fit could not represent.' })),
  };
}

/** Everything the template prints, as strings. */
export function reportView(a: HarmonicAnalysis, station: ReportStation, root = projectRoot()) {
  const s = a.summary;
  const r = a.residual;
  const days = s.spanHours / 24;
  const rayleighLeftOut = a.excluded.filter((e) => e.reason === 'rayleigh');
  const tooFast = a.excluded.filter((e) => e.reason === 'nyquist').map((e) => e.name);
  const title = `Harmonic analysis: ${station.name}`;
  return {
    title,
    where: `${station.id} · ${fixed(station.latitude, 4)}°, ${fixed(station.longitude, 4)}° (east positive) · ${station.timezone}`,
    css: new nunjucks.runtime.SafeString(`${sitePaletteCss(root)}\n${readFileSync(join(root, 'templates', 'report', 'report.css'), 'utf8')}`),
    caution: CAUTION,
    shortNote: days < 365
      ? `This record spans only ${days.toFixed(1)} days: constituents it could not separate are inferred from a neighbour ` +
        'where the equilibrium tide allows, or else left out, and the others absorb some of their energy.'
      : '',
    recordFacts: [
      ['File', a.record.file],
      ['First reading', instant(s.start)],
      ['Last reading', instant(s.end)],
      ['Length', `${days.toFixed(2)} days`],
      ['Readings', `${s.count}`],
      ['Usual interval', `${(s.intervalHours * 60).toFixed(1)} minutes`],
      ['Span with readings', `${(s.coverage * 100).toFixed(1)} %`],
      ['Longest gaps', s.gaps.length > 0 ? s.gaps.slice(0, 3).map((g) => `${(g.hours / 24).toFixed(2)} days from ${instant(g.from)}`).join('; ') : 'none'],
      ['Exact duplicate rows dropped', `${a.record.duplicatesDropped}`],
    ],
    residualFacts: [
      ['RMS of the residual', `${fixed(r.rms, 3)} m`],
      ['Largest residual', `${fixed(r.maxAbs, 3)} m at ${instant(r.maxAbsTime)}`],
      ['Variance explained by the fit', `${(r.explained * 100).toFixed(2)} %`],
      ['Residual standard error', `${fixed(r.standardError, 3)} m (${r.count} readings, ${r.unknowns} unknowns)`],
    ],
    charts: charts(a),
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
        inferredFrom: c.inferred?.from ?? '',
      };
    }),
    inferred: a.constituents.filter((c) => c.inferred !== undefined)
      .map((c) => ({ name: c.name, from: c.inferred!.from, ratio: fixed(c.inferred!.ratio, 4) })),
    leftOut: rayleighLeftOut.map((e) => ({
      name: e.name,
      from: e.conflictsWith === 'Z0' ? 'the mean level' : e.conflictsWith ?? '',
      days: Number.isFinite(e.daysNeeded ?? Infinity) ? fixed(e.daysNeeded!, 1) : 'never (same speed)',
    })),
    rayleigh: String(a.rayleigh),
    tooFast: tooFast.join(', '),
    intervalMinutes: (s.intervalHours * 60).toFixed(1),
    readings: String(r.count),
    file: a.record.file,
  };
}

/** The complete report as an HTML document. */
export function renderAnalysisReport(analysis: HarmonicAnalysis, station: ReportStation): string {
  const root = projectRoot();
  const env = new nunjucks.Environment(new nunjucks.FileSystemLoader(join(root, 'templates', 'report')),
    { autoescape: true, throwOnUndefined: true, trimBlocks: true, lstripBlocks: true });
  return env.render('analysis-report.njk', reportView(analysis, station, root));
}
