// The HTML report of a harmonic analysis: one static page, no scripts, every text escaped. It shows the
// record, the fit and its residual as SVG, the constants with their 95 % intervals, what the record
// could not separate, and the caution. It presents the analysis; it computes nothing new.

import { CAUTION } from '../../engine/almanac/caution.js';
import type { HarmonicAnalysis } from '../../engine/analysis/harmonic.js';
import type { StationMeta } from '../../engine/analysis/station-yaml.js';
import { timeSeriesChart } from './chart.js';
import { escapeHtml as esc } from './escape.js';
import { REPORT_CSS } from './style.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;

/** The station a report is about: the same facts the analysed station file is written from. */
export type ReportStation = StationMeta;

const fixed = (v: number, digits: number): string => v.toFixed(digits).replace(/^-(?=0\.?0*$)/, '').replace('-', '\u2212');
const instant = (t: number): string => `${new Date(t).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

function facts(rows: readonly (readonly [string, string])[]): string {
  return `<dl class="facts">${rows.map(([k, v]) => `<dt>${esc(k)}</dt><dd>${esc(v)}</dd>`).join('')}</dl>`;
}

function cautionSection(a: HarmonicAnalysis): string {
  const days = a.summary.spanHours / 24;
  const short = days < 365
    ? ` This record spans only ${days.toFixed(1)} days: constituents it could not separate are left out, ` +
      'and the others absorb some of their energy.'
    : '';
  return `<section class="caution" aria-labelledby="caution-heading"><h2 id="caution-heading">Caution</h2>
<p><strong>Constants from a short record are less reliable.</strong>${esc(short)} A year of readings or more gives
dependable constants; a month gives the main ones only roughly. The intervals below assume independent errors;
the residual of a real record is not, so they are optimistic.</p>
<p>${esc(CAUTION)}</p></section>`;
}

function recordSection(a: HarmonicAnalysis): string {
  const s = a.summary;
  const gaps = s.gaps.slice(0, 3).map((g) => `${(g.hours / 24).toFixed(2)} days from ${instant(g.from)}`);
  const rows: [string, string][] = [
    ['File', a.record.file],
    ['First reading', instant(s.start)],
    ['Last reading', instant(s.end)],
    ['Length', `${(s.spanHours / 24).toFixed(2)} days`],
    ['Readings', `${s.count}`],
    ['Usual interval', `${(s.intervalHours * 60).toFixed(1)} minutes`],
    ['Span with readings', `${(s.coverage * 100).toFixed(1)} %`],
    ['Longest gaps', gaps.length > 0 ? gaps.join('; ') : 'none'],
    ['Exact duplicate rows dropped', `${a.record.duplicatesDropped}`],
  ];
  const chart = timeSeriesChart(
    [{ times: a.record.times, values: a.record.heights, className: 'observed', label: 'Observed' }],
    {
      id: 'record-chart',
      title: 'The gauge record',
      description: 'Observed height (m on the record’s zero) against time (UTC); breaks mark gaps.',
      breakAfterMs: Math.max(3 * s.intervalHours * HOUR, 2 * HOUR),
    });
  return `<section aria-labelledby="record-heading"><h2 id="record-heading">The record</h2>${facts(rows)}${chart}</section>`;
}

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

function fitSection(a: HarmonicAnalysis): string {
  const { record, fitted, residual: r } = a;
  const residuals = new Float64Array(record.heights.length);
  for (let i = 0; i < residuals.length; i++) residuals[i] = record.heights[i]! - fitted[i]!;
  const breakAfterMs = Math.max(3 * a.summary.intervalHours * HOUR, 2 * HOUR);
  const [start, end] = busiestWindow(record.times, 4);
  const detail = timeSeriesChart([
    { times: record.times, values: record.heights, className: 'observed', label: 'Observed' },
    { times: record.times, values: fitted, className: 'fitted', label: 'Fitted tide' },
  ], {
    id: 'fit-chart', title: 'Observed and fitted heights, four days', start, end, breakAfterMs,
    description: `Observed height and the fitted harmonic tide over four days from ${instant(start)}.`,
  });
  const residualChart = timeSeriesChart(
    [{ times: record.times, values: residuals, className: 'residual', label: 'Observed − fitted' }],
    {
      id: 'residual-chart', title: 'Residual', zeroLine: true, breakAfterMs,
      description: 'Observed minus fitted height (m) over the whole record: weather, surges, seiches and what the fit could not represent.',
    });
  const rows: [string, string][] = [
    ['RMS of the residual', `${fixed(r.rms, 3)} m`],
    ['Largest residual', `${fixed(r.maxAbs, 3)} m at ${instant(r.maxAbsTime)}`],
    ['Variance explained by the fit', `${(r.explained * 100).toFixed(2)} %`],
    ['Residual standard error', `${fixed(r.standardError, 3)} m (${r.count} readings, ${r.unknowns} unknowns)`],
  ];
  return `<section aria-labelledby="fit-heading"><h2 id="fit-heading">The fit and its residual</h2>
${detail}${residualChart}<h3>Residual statistics</h3>${facts(rows)}</section>`;
}

function constantsSection(a: HarmonicAnalysis, station: ReportStation): string {
  const body = a.constituents.map((c) => {
    // Signal-to-noise (H/σ_H)² below 2 (σ_H = half-width/1.96): not distinguishable from the noise.
    const weak = (c.amplitude / (c.amplitudeError / 1.96)) ** 2 < 2;
    if (c.inferred !== undefined) {
      return `<tr class="inferred"><th scope="row">${esc(c.name)}</th><td>${fixed(c.speed, 7)}</td><td>${fixed(c.amplitude, 4)}</td>` +
        `<td colspan="3">inferred from ${esc(c.inferred.from)}</td></tr>`;
    }
    return `<tr${weak ? ' class="weak"' : ''}><th scope="row">${esc(c.name)}${weak ? ' *' : ''}</th>` +
      `<td>${fixed(c.speed, 7)}</td><td>${fixed(c.amplitude, 4)}</td><td>${fixed(c.amplitudeError, 4)}</td>` +
      `<td>${fixed(c.phase, 2)}</td><td>${fixed(c.phaseError, 2)}</td></tr>`;
  });
  const anyWeak = body.some((row) => row.startsWith('<tr class="weak"'));
  return `<section aria-labelledby="constants-heading"><h2 id="constants-heading">Harmonic constants</h2>
<p>Mean level Z0 = ${esc(fixed(a.meanLevel, 4))} m ± ${esc(fixed(a.meanLevelError, 4))} m above ${esc(station.datum)}.
Phases are Greenwich phase lags g in degrees (UTC); ± values are 95 % confidence half-widths.</p>
<div class="table-scroll"><table><caption>${a.constituents.length} constituents, largest first</caption>
<thead><tr><th scope="col">Constituent</th><th scope="col">Speed (°/h)</th><th scope="col">Amplitude H (m)</th>
<th scope="col">± (m)</th><th scope="col">Phase g (°)</th><th scope="col">± (°)</th></tr></thead>
<tbody>${body.join('\n')}</tbody></table></div>
${anyWeak ? '<p class="weak">* Smaller than the noise of the record (signal-to-noise below 2): treat with caution.</p>' : ''}
</section>`;
}

function excludedSection(a: HarmonicAnalysis): string {
  const rayleigh = a.excluded.filter((e) => e.reason === 'rayleigh');
  const nyquist = a.excluded.filter((e) => e.reason === 'nyquist');
  const parts = [`<section aria-labelledby="excluded-heading"><h2 id="excluded-heading">Constituents this record could not separate</h2>`];
  const inferred = a.constituents.filter((c) => c.inferred !== undefined);
  if (inferred.length > 0) {
    parts.push(`<p>Inferred (Foreman 1977; Pugh 1987): each takes its separated neighbour’s phase lag and the amplitude
ratio of the equilibrium tide; the neighbour was fitted with the inferred line’s share in the model.</p>`);
    parts.push('<table><caption>Inferred from a neighbour</caption><thead><tr><th scope="col">Constituent</th>' +
      '<th scope="col">From</th><th scope="col">Equilibrium ratio</th></tr></thead><tbody>');
    for (const c of inferred) {
      parts.push(`<tr><th scope="row">${esc(c.name)}</th><td>${esc(c.inferred!.from)}</td><td>${fixed(c.inferred!.ratio, 4)}</td></tr>`);
    }
    parts.push('</tbody></table>');
  }
  if (rayleigh.length === 0) {
    parts.push(`<p>Every candidate constituent was separable at Rayleigh factor R = ${esc(String(a.rayleigh))}.</p>`);
  } else {
    parts.push(`<p>By the Rayleigh criterion (R = ${esc(String(a.rayleigh))}), two constituents are told apart only by a
record at least 360°·R / |σ₁ − σ₂| long. These were left out; their energy stays in the constituent named beside them.</p>`);
    parts.push('<table><caption>Left out for the record’s length</caption><thead><tr><th scope="col">Constituent</th>' +
      '<th scope="col">Not separable from</th><th scope="col">Record needed (days)</th></tr></thead><tbody>');
    for (const e of rayleigh) {
      const from = e.conflictsWith === 'Z0' ? 'the mean level' : e.conflictsWith ?? '';
      parts.push(`<tr><th scope="row">${esc(e.name)}</th><td>${esc(from)}</td><td>${esc(Number.isFinite(e.daysNeeded ?? Infinity) ? fixed(e.daysNeeded!, 1) : 'never (same speed)')}</td></tr>`);
    }
    parts.push('</tbody></table>');
  }
  if (nyquist.length > 0) {
    parts.push(`<p>Too fast for the sampling interval of ${esc((a.summary.intervalHours * 60).toFixed(1))} minutes: ` +
      `${esc(nyquist.map((e) => e.name).join(', '))}.</p>`);
  }
  parts.push('</section>');
  return parts.join('\n');
}

function methodSection(a: HarmonicAnalysis): string {
  return `<section aria-labelledby="method-heading"><h2 id="method-heading">Method</h2>
<p>Least-squares harmonic analysis: the mean level and, for every constituent, a cosine and a sine term with
Schureman’s node factor f, nodal angle u and equilibrium argument V (the same ones the prediction engine uses),
fitted to all ${a.residual.count} readings by the normal equations. Amplitude H and phase lag g follow from each
cosine/sine pair; their intervals from the residual variance and the covariance of that pair.</p></section>`;
}

/** The complete report as an HTML document. */
export function renderAnalysisReport(analysis: HarmonicAnalysis, station: ReportStation): string {
  const title = `Harmonic analysis: ${station.name}`;
  const where = `${station.id} · ${fixed(station.latitude, 4)}°, ${fixed(station.longitude, 4)}° (east positive) · ${station.timezone}`;
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(title)}</title>
<style>${REPORT_CSS}</style>
</head>
<body>
<header><h1>${esc(title)}</h1><p class="subtitle">${esc(where)}</p></header>
<main>
${cautionSection(analysis)}
${recordSection(analysis)}
${fitSection(analysis)}
${constantsSection(analysis, station)}
${excludedSection(analysis)}
${methodSection(analysis)}
</main>
<footer><p>Made by tidewright from the gauge record ${esc(analysis.record.file)}. Times are UTC; heights in metres
on the record’s zero (${esc(station.datum)}).</p></footer>
</body>
</html>
`;
}
