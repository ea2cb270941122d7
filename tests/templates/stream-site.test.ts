// The website's pages for tidal stream stations: listed in the index with the tide stations of their
// area, a year page and month pages that print the model's slack times and strongest flood and ebb
// (rate and an arrow turned to the direction), both cautions, downloads, and valid HTML.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { HtmlValidate } from 'html-validate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStreamYear, itemAt, loadStationSet, streamAlmanacEvent, type StreamYear } from '../../engine/index.js';
import { renderSite } from '../../templates/site/render.js';
import { demoModels, htmlFiles, read, textOf } from './site-build.js';

const DEMO = join(import.meta.dirname, '..', '..', 'stations-demo');
let tmp: string;
let site: string;
let narrows: StreamYear;
let gut: StreamYear;

// The year's strongest flood moved to 23:59:40 local on 14 May: it prints 00:00 and belongs to 15 May (the model's rule).
function lateFlood(m: StreamYear): StreamYear {
  const copy = structuredClone(m);
  copy.station = { ...copy.station, id: 'late-flood', name: 'Late Flood (invented)' };
  const start = Date.parse(copy.days.find((d) => d.date === '2027-05-15')!.start);
  copy.extremes.strongestFlood = streamAlmanacEvent({ time: start - 20_000, type: 'flood', speed: 9.99, direction: 70 }, copy.timezone);
  return copy;
}

beforeAll(async () => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-streams-'));
  site = join(tmp, 'site');
  const set = loadStationSet(DEMO);
  const [narrowsStation, gutStation] = ['wrackrun-narrows', 'spindrift-gut'].map((id) => set.streams!.find((s) => s.id === id)!);
  narrows = buildStreamYear(narrowsStation!, set, 2027);
  gut = buildStreamYear(gutStation!, set, 2027);
  await renderSite(demoModels(['brinewold-head']), site, { units: 'm', quiet: true, streams: [narrows, gut, lateFlood(narrows)] });
}, 120_000);

afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('stream pages', () => {
  it('the index lists the stream stations in the group of their tide reference, after its ports', () => {
    const html = read(site, 'index.html');
    const start = html.indexOf('<section class="port-group"'); // the list, after the map
    const group = html.slice(start, html.indexOf('</section>', start));
    expect(group).toContain('Brinewold Head (invented)');
    expect(group).toContain('Wrackrun Narrows (invented)');
    expect(group).toContain('Spindrift Gut (invented)');
    expect(textOf(group)).toContain('tidal stream, from Wrackrun Narrows (invented)');
    expect(textOf(html)).toContain('Tidal streams vary across a channel');
  });

  it('a month page prints every slack, flood and ebb of its days with rate and a turned arrow', () => {
    const html = read(site, 'wrackrun-narrows/2027/03/index.html');
    const march = narrows.days.filter((d) => d.month === 3);
    for (const day of march) {
      const row = html.slice(html.indexOf(`id="day-${day.dayOfMonth}"`), html.indexOf('</tr>', html.indexOf(`id="day-${day.dayOfMonth}"`)));
      for (const e of day.events) {
        expect(row).toContain(`<time datetime="${e.time}">${e.clock}</time>`);
        if (e.type !== 'slack') {
          // rates as the one formatter prints them (Intl rounds a tie such as 1.25 up)
          expect(row).toContain(`${new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 }).format(e.speed)}&#8239;kn`);
          expect(row).toContain(`rotate(${e.direction!.toFixed(1)})`);
          expect(row).toContain(`${String(Math.round(e.direction!) % 360).padStart(3, '0')}°`);
        }
      }
      if (day.springNeap === 'spring') expect(row).toContain('tag-springs');
      expect(row).toContain('class="stream-curve-line" d="M0 ');
    }
    const text = textOf(html);
    expect(text).toContain('Tidal streams vary across a channel');
    expect(text).toContain('Astronomical predictions only');
    expect(text).toContain('Invented data');
  });

  it('the year page names the reference stream station, the directions and the downloads', () => {
    const text = textOf(read(site, 'spindrift-gut/2027/index.html'));
    expect(text).toMatch(/Secondary stream station of Wrackrun Narrows \(invented\), by time differences and rate ratios/);
    expect(text).toMatch(/Flood sets toward\s+095° true/);
    expect(text).toMatch(/Ebb sets toward\s+280° true/);
    const csv = readFileSync(join(site, 'data', 'spindrift-gut-2027-streams.csv'), 'utf8');
    expect(csv).toContain('# Caution: Astronomical predictions only.');
    expect(csv).toContain('# Streams vary. Tidal streams vary across a channel');
    expect(csv).toContain('# These data are INVENTED');
    const rows = csv.trim().split('\r\n').filter((l) => !l.startsWith('#'));
    expect(rows[0]).toBe('station_id,time,time_local,type,speed_kn,direction_deg_true');
    expect(rows).toHaveLength(gut.events.length + 1);
    const json = JSON.parse(readFileSync(join(site, 'data', 'spindrift-gut-2027-streams.json'), 'utf8')) as { events: unknown[]; streamCaution: string };
    const ics = readFileSync(join(site, 'data', 'spindrift-gut-2027-streams.ics'), 'utf8');
    expect(ics.match(/BEGIN:VEVENT/g)).toHaveLength(gut.events.length);
    expect(ics.replace(/\r\n /g, '')).toContain('Tidal streams vary across a channel');
    expect(ics.split('\r\n').every((l) => Buffer.byteLength(l) <= 75)).toBe(true);
    expect(json.events).toEqual(gut.events.map((e) => ({ station_id: gut.station.id, time: e.time, time_local: e.local, type: e.type, speed_kn: e.speed, direction_deg_true: e.direction })));
  });

  it('the year page dates the strongest flood by its printed minute: 23:59:40 on 14 May is 00:00 on 15 May', () => {
    const text = textOf(read(site, 'late-flood/2027/index.html'));
    const line = text.slice(text.indexOf('Strongest flood'), text.indexOf('Strongest flood') + 80);
    expect(line).toContain('00:00');
    expect(line).toContain('15 May 2027');
    expect(line).not.toContain('14 May');
  });

  it('every stream page passes html-validate', async () => {
    const validator = new HtmlValidate({
      extends: ['html-validate:recommended'],
      rules: { 'no-trailing-whitespace': 'off', 'void-style': 'off', 'long-title': 'off' },
    });
    const problems: string[] = [];
    const files = htmlFiles(site).filter((f) => f.includes('wrackrun') || f.includes('spindrift') || f.endsWith(`site${'/'}index.html`));
    expect(files.length).toBe(27);
    for (const file of files) {
      const report = await validator.validateFile(file);
      for (const r of report.results) for (const m of r.messages) problems.push(`${file}:${m.line}:${m.column} ${m.ruleId} ${m.message}`);
    }
    expect(problems.slice(0, 30)).toEqual([]);
  });
});

describe('stream pages over several years', () => {
  it('carry the year switch to the same stream station (and month) in each year', async () => {
    const set = loadStationSet(DEMO);
    const station = set.streams!.find((s) => s.id === 'wrackrun-narrows')!;
    const years = join(tmp, 'years');
    await renderSite([], years, { units: 'm', quiet: true, streams: [narrows, buildStreamYear(station, set, 2028)] });
    for (const [page, current] of [['wrackrun-narrows/2028/index.html', '2028'], ['wrackrun-narrows/2027/06/index.html', '2027']] as const) {
      const nav = /<nav class="year-switch"[\s\S]*?<\/nav>/.exec(read(years, page))?.[0] ?? '';
      const suffix = page.includes('/06/') ? '06/' : '';
      const targets = [...nav.matchAll(/href="([^"]+)"/g)].map((m) => resolve(dirname(join(years, page)), itemAt(m, 1, 'm')));
      expect(targets, page).toEqual(['2027', '2028'].map((y) => join(years, `wrackrun-narrows/${y}/${suffix}index.html`)));
      for (const t of targets) expect(existsSync(t), t).toBe(true);
      expect(nav, page).toContain(`aria-current="page">${current}</a>`);
    }
  }, 120_000);
});
