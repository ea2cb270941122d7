import { HtmlValidate } from 'html-validate';
import { describe, expect, it } from 'vitest';
import { analyseRecord, compilePredictor } from '../../engine/index.js';
import type { ReferenceStation } from '../../engine/index.js';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { reliability, renderAnalysisReport, type ReportStation } from '../../templates/report/analysis-report.js';
import { rootCustomProperties, sitePaletteCss } from '../../templates/report/palette.js';
import { projectRoot } from '../../templates/site/paths.js';
import { niceTicks } from '../../templates/report/chart.js';
import { escapeHtml } from '../../templates/report/escape.js';
import { DAY, degrade, evenTimes, recordOf } from '../fixtures/analysis-records.js';
import { captured } from '../fixtures/lists.js';

const START = Date.UTC(2027, 0, 1);
// Invented constants, realistic in magnitude.
const station: ReferenceStation = {
  id: 'report-quay', name: 'Report Quay (invented)', kind: 'reference', position: { latitude: 47.2, longitude: -15.9 },
  timezone: 'Europe/Lisbon', datum: 'Chart Datum', mean_level: 2.4,
  constituents: {
    M2: { amplitude: 1.6, phase: 135 }, S2: { amplitude: 0.55, phase: 178 }, N2: { amplitude: 0.3, phase: 117 },
    K1: { amplitude: 0.08, phase: 101 }, O1: { amplitude: 0.07, phase: 332 }, M4: { amplitude: 0.1, phase: 47 },
  },
  provenance: 'Invented for the report test',
};

function analysis(days: number, stepMinutes: number) {
  const step = stepMinutes * 60_000;
  const count = Math.floor((days * DAY) / step) + 1;
  const clean = recordOf(evenTimes(START, step, count), compilePredictor(station).heights(START, step, count), 'quay <gauge>.csv');
  return analyseRecord(degrade(clean, { sigma: 0.03, seed: 2, blockFrom: START + 10 * DAY, blockTo: START + 12 * DAY }));
}

const hostile: ReportStation = {
  id: 'report-quay', name: 'Quay <script>alert("x")</script> & Sons', latitude: 47.2, longitude: -15.9,
  timezone: 'Europe/Lisbon', datum: 'Gauge "zero"',
};

describe('renderAnalysisReport', () => {
  const month = analysis(32, 10);
  const html = renderAnalysisReport(month, hostile);

  it('is valid HTML with lang set and no scripts', async () => {
    const validator = new HtmlValidate({
      extends: ['html-validate:recommended'],
      // SVG shapes are written self-closed (HTML allows it for foreign elements); the title carries the
      // station name, whose length the user sets.
      rules: { 'void-style': 'off', 'long-title': 'off' },
    });
    const report = await validator.validateString(html);
    const problems = report.results.flatMap((r) => r.messages.map((m) => `${m.line}:${m.column} ${m.ruleId} ${m.message}`));
    expect(problems).toEqual([]);
    expect(html).toMatch(/^<!DOCTYPE html>\n<html lang="en">/);
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/ on[a-z]+=/i);
  });

  it('escapes every text from the user', () => {
    expect(html).toContain('Quay &lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; Sons');
    expect(html).toContain('quay &lt;gauge&gt;.csv');
    expect(html).toContain('Gauge &quot;zero&quot;');
    expect(escapeHtml(`<a href='x'>&</a>`)).toBe('&lt;a href=&#39;x&#39;&gt;&amp;&lt;/a&gt;');
  });

  it('shows the record, the fit and the residual as SVG', () => {
    expect(html.match(/<svg /g)?.length).toBe(3);
    expect(html).toContain('<path class="observed"');
    expect(html).toContain('<path class="fitted"');
    expect(html).toContain('<path class="residual"');
    // The two-day hole shows as a break: the record's path starts a new piece after it
    const recordPath = captured(/<path class="observed" d="([^"]+)"/, html, 'observed path');
    expect(recordPath.match(/M/g)!.length).toBe(2);
  });

  it('lists the constants with their intervals, as analysed', () => {
    const m2 = month.constituents.find((c) => c.name === 'M2')!;
    expect(html).toContain(`<th scope="row">M2</th><td>28.9841042</td><td>${m2.amplitude.toFixed(4)}</td>` +
      `<td>${m2.amplitudeError.toFixed(4)}</td><td>${m2.phase.toFixed(2)}</td><td>${m2.phaseError.toFixed(2)}</td>`);
    expect(html).toContain(`Mean level Z0 = ${month.meanLevel.toFixed(4)} m`);
  });

  it('lists what the record could not separate, with the record length needed, and what it inferred', () => {
    expect(html).toMatch(/<th scope="row">MSf<\/th><td>Mf<\/td><td>182\.6<\/td>/); // REFERENCE-VALUES §5
    expect(html).toMatch(/<th scope="row">K2<\/th><td>S2<\/td><td>0\.2721<\/td>/); // REFERENCE-VALUES §7
    expect(html).toMatch(/<th scope="row">P1<\/th><td>K1<\/td><td>0\.3309<\/td>/);
    expect(html).toMatch(/<th scope="row">Sa<\/th><td>the mean level<\/td>/);
  });

  it('words each fitted line\'s reliability from amplitude ÷ 95 % half-width, the ratio printed, and marks inferred lines', () => {
    expect(reliability(2)).toBe('firm');
    expect(reliability(1.99)).toBe('fair');
    expect(reliability(1)).toBe('fair');
    expect(reliability(0.99)).toBe('weak');
    for (const c of month.constituents.filter((k) => k.inferred === undefined)) {
      const ratio = c.amplitude / c.amplitudeError;
      expect(html).toContain(`<th scope="row">${c.name}</th><td>${c.speed.toFixed(7)}</td><td>${c.amplitude.toFixed(4)}</td>` +
        `<td>${c.amplitudeError.toFixed(4)}</td><td>${c.phase.toFixed(2)}</td><td>${c.phaseError.toFixed(2)}</td>` +
        `<td>${ratio.toFixed(1)}</td><td class="word reliability-${reliability(ratio)}">${reliability(ratio)}</td></tr>`);
    }
    // 3 cm of noise over a month: M2 firm, and some small line weak
    expect(html).toMatch(/<th scope="row">M2<\/th>.*reliability-firm">firm</);
    expect(html).toMatch(/reliability-weak">weak</);
    expect(html).toMatch(/<tr class="inferred"><th scope="row">K2<\/th>.*inferred from S2<\/td><\/tr>/);
    // no symbol marks a line: the words say it
    expect(html).not.toMatch(/<th scope="row">[^<]*[*†‡]/);
  });

  it('takes its colours from the site\'s stylesheet, the one source of the palette', () => {
    const site = rootCustomProperties(readFileSync(join(projectRoot(), 'templates/assets/site.css'), 'utf8'));
    expect(site.length).toBeGreaterThanOrEqual(8);
    const style = captured(/<style>([\s\S]*?)<\/style>/, html, 'style');
    expect(rootCustomProperties(style)).toEqual(site);
    // outside that copied block the report names no colour of its own
    const own = style.replace(/:root \{[^}]*\}/, '');
    expect(own).not.toMatch(/#[0-9a-f]{3,8}\b|rgba?\(|hsla?\(/i);
    // a publisher who changes the site's palette changes the report's
    const root = mkdtempSync(join(tmpdir(), 'tidewright-palette-'));
    try {
      mkdirSync(join(root, 'templates/assets'), { recursive: true });
      writeFileSync(join(root, 'templates/assets/site.css'), ':root {\n  --ink: #101010;\n  --sea: #123456;\n}\n.x { color: red; }');
      expect(sitePaletteCss(root)).toBe(':root { --ink: #101010; --sea: #123456; }');
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });

  it('gives the residual statistics and the caution', () => {
    expect(html).toContain(`<dt>RMS of the residual</dt><dd>${month.residual.rms.toFixed(3)} m</dd>`);
    expect(html).toContain('Variance explained by the fit');
    expect(html).toContain('Constants from a short record are less reliable.');
    expect(html).toContain('Astronomical predictions only.');
    expect(html).toContain('defer to the harbour authority');
    expect(html).toContain('optimistic');
  });

  it('keeps a year of readings small by drawing each pixel column at most twice', () => {
    const year = renderAnalysisReport(analysis(366, 60), hostile);
    const recordPath = captured(/<path class="observed" d="([^"]+)"/, year, 'observed path');
    expect(recordPath.match(/[ML]/g)!.length).toBeLessThanOrEqual(2 * 700); // 8785 readings, 696 columns
    expect(year.length).toBeLessThan(150_000);
  });
});

describe('the report in the reader\u2019s language (analyse --locale)', () => {
  const month = analysis(32, 10);
  it.each(['fr', 'de', 'nb'])('%s: lang set, the catalogue\u2019s words, Intl\u2019s decimal separator, no English sentence left', (tag) => {
    const html = renderAnalysisReport(month, hostile, tag);
    expect(html).toMatch(new RegExp(`^<!DOCTYPE html>\n<html lang="${tag}">`));
    const comma = new Intl.NumberFormat(tag, { minimumFractionDigits: 1 }).format(1.5).replace(/\d/g, '');
    expect(comma).toBe(',');
    expect(html).toContain(`<th scope="row">M2</th><td>28,9841042</td>`);
    const text = html.replace(/<style>[\s\S]*?<\/style>/, '').replace(/<[^>]+>/g, ' ');
    for (const english of ['The record', 'Residual statistics', 'Harmonic constants', 'Constituent', 'Reliability', 'inferred from',
      'the mean level', 'Method', 'Made by tidewright', 'Observed', 'Caution', 'Astronomical predictions only', 'largest first', 'firm', 'weak'])
      expect(text, english).not.toMatch(new RegExp(`\\b${english}\\b`));
  });
});

describe('niceTicks', () => {
  it('gives round steps of 1, 2 or 5 × 10ⁿ', () => {
    expect(niceTicks(0, 4.2)).toEqual([0, 1, 2, 3, 4]);
    expect(niceTicks(-0.11, 0.12)).toEqual([-0.1, -0.05, 0, 0.05, 0.1]);
  });
});
