// The website built from station-year models: pages against the model, grouping, escaping, units,
// links and downloads, and every page through an HTML validator.
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { HtmlValidate } from 'html-validate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { firstOf, itemAt, type StationYear } from '../../engine/index.js';
import { renderSite } from '../../templates/site/render.js';
import {
  HOSTILE_NAME, demoModels, htmlFiles, read, rowById, textOf, withHostileText, withLowWaterBelowDatum,
} from './site-build.js';
import { wordsFor } from '../../templates/locale/index.js';

// Intl is the reference for printed numbers (it rounds the shortest decimal form of a tie away from zero).
const fixed = (v: number, digits: number): string =>
  new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false }).format(v);

const en = wordsFor();

let tmp: string;
let site: string;
let feetSite: string;
let reference: StationYear; // rimeskerry-fjord: reference port, Europe/Oslo, polar day and night
let secondary: StationYear; // whitespume-sound: secondary port of rimeskerry-fjord

const MINUS = '\u2212';
/** Metres as the month tables print them, written out here independently of the site's formatter. */
const cm = (m: number): string => `${m < 0 ? MINUS : ''}${fixed(Math.abs(m), 2)}`;
const signed = (n: number, digits: number, unit: string): string =>
  `${n > 0 ? '+' : n < 0 ? MINUS : ''}${fixed(Math.abs(n), digits)} ${unit}`;
const ids = ['rimeskerry-fjord', 'whitespume-sound', 'odd-name'];

beforeAll(async () => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-site-'));
  site = join(tmp, 'site');
  feetSite = join(tmp, 'site-ft');
  const [rimeskerry, whitespume] = demoModels(['rimeskerry-fjord', 'whitespume-sound']);
  reference = withLowWaterBelowDatum(rimeskerry, '2027-01-14');
  secondary = whitespume;
  await renderSite([secondary, withHostileText(rimeskerry), reference], site, {
    units: 'm', quiet: true, locale: 'en-GB', title: 'Harbour tides', publisher: 'Test Club',
  });
  await renderSite([reference], feetSite, { units: 'ft', quiet: true });
});

afterAll(() => {
  if (tmp) rmSync(tmp, { recursive: true, force: true });
});

describe('pages and URLs', () => {
  it('writes the index, the datums page, the imprint, and a year page, twelve month pages and twelve hour-by-hour pages per station-year', () => {
    expect(existsSync(join(site, 'index.html'))).toBe(true);
    expect(existsSync(join(site, 'datums/index.html'))).toBe(true);
    expect(existsSync(join(site, 'imprint/index.html'))).toBe(true);
    for (const id of ids) {
      expect(existsSync(join(site, id, '2027/index.html'))).toBe(true);
      for (let m = 1; m <= 12; m++) {
        expect(existsSync(join(site, id, '2027', String(m).padStart(2, '0'), 'index.html'))).toBe(true);
        expect(existsSync(join(site, id, '2027', String(m).padStart(2, '0'), 'hours', 'index.html'))).toBe(true);
      }
    }
    expect(htmlFiles(site)).toHaveLength(3 + 3 * 25);
  });

  it('every relative link and stylesheet on every page points at a file that exists', () => {
    let checked = 0;
    for (const file of htmlFiles(site)) {
      const html = readFileSync(file, 'utf8');
      for (const [, url = ''] of html.matchAll(/(?:href|src)="([^"#]+)(?:#[^"]*)?"/g)) {
        if (/^[a-z]+:/.test(url)) continue;
        const target = resolve(dirname(file), url);
        expect(existsSync(target) && statSync(target).isFile(), `${file} → ${url}`).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(500);
  });

  it('sets lang from the locale option and shows the title and publisher', () => {
    const html = read(site, 'index.html');
    expect(html).toMatch(/<html lang="en-GB">/);
    expect(html).toContain('Harbour tides');
    expect(html).toContain('Test Club');
  });
});

describe('index', () => {
  it('lists each reference port followed by its own secondary ports, with tide type and position', () => {
    const html = read(site, 'index.html');
    const groups = html.split('<section class="port-group"').slice(1);
    expect(groups).toHaveLength(2);
    // Sorted by reference port name: the hostile name starts with "<", before "S".
    expect(textOf(groups[0])).toContain(HOSTILE_NAME);
    const rimeskerry = textOf(groups[1]);
    expect(rimeskerry.indexOf('Rimeskerry Fjord (invented) reference port')).toBeGreaterThanOrEqual(0);
    expect(rimeskerry.indexOf('Rimeskerry Fjord (invented)')).toBeLessThan(rimeskerry.indexOf('Whitespume Sound (invented) secondary port'));
    expect(rimeskerry).toContain(`Tide ${en.tideType(reference.tideType.kind)} Position`);
    // Degrees and decimal minutes worked by hand from the station's decimal degrees.
    const { latitude, longitude } = secondary.station.position;
    const dm = (v: number): string => `${Math.trunc(Math.abs(v))}°${((Math.abs(v) % 1) * 60).toFixed(1).padStart(4, '0')}′`;
    expect(rimeskerry).toContain(`${dm(latitude)} ${latitude >= 0 ? 'N' : 'S'}, ${dm(longitude)} ${longitude >= 0 ? 'E' : 'W'}`);
    expect(groups[1]).toContain('href="whitespume-sound/2027/index.html"');
  });
});

describe('month pages against the model', () => {
  it('prints a day’s high waters on its first line and low waters on its second, each in time order, as the book does', () => {
    const html = read(site, 'rimeskerry-fjord/2027/03/index.html');
    const day = reference.days.find((d) => d.date === '2027-03-10')!;
    const text = textOf(rowById(html, 'day-10'));
    const printed = (type: string) => day.events.filter((e) => e.type === type).map((e) => `${type === 'high' ? 'HW' : 'LW'} ${e.clock} ${cm(e.height)}`);
    expect(day.events.length).toBeGreaterThanOrEqual(3);
    expect(text).toContain([...printed('high'), ...printed('low')].join(' '));
    expect(text).toMatch(/^Wed 10/); // 10 March 2027 is a Wednesday
    // Every day of the year: the first list holds only high waters, the second only low waters, in time order.
    let lowFirst = 0;
    for (const month of ['01', '03', '06', '09', '12']) {
      const page = read(site, `rimeskerry-fjord/2027/${month}/index.html`);
      for (const d of reference.days.filter((x) => x.date.slice(5, 7) === month)) {
        const lists = [...rowById(page, `day-${d.dayOfMonth}`).matchAll(/<ul class="events lane lane-(high|low)">([\s\S]*?)<\/ul>/g)];
        const times = (type: string) => d.events.filter((e) => e.type === type).map((e) => e.time);
        expect(lists.map((l) => l[1])).toEqual(['high', 'low'].filter((t) => times(t).length > 0));
        for (const l of lists) expect([...itemAt(l, 2, 'l').matchAll(/datetime="([^"]+)"/g)].map((m) => m[1])).toEqual(times(itemAt(l, 1, 'l')));
        if (d.events[0]?.type === 'low') lowFirst++;
      }
    }
    expect(lowFirst).toBeGreaterThan(50); // the days whose first column used to be a low water
  });

  it('states the UTC offset and the clock change on the day it happens, with offsets on that day’s times', () => {
    const html = read(site, 'rimeskerry-fjord/2027/03/index.html');
    // Europe/Oslo goes from UTC+01:00 to UTC+02:00 at 01:00 UTC on the last Sunday of March
    // (EU rule, tz database): 28 March 2027, at 02:00 on the clocks of the morning.
    expect(textOf(html)).toContain(`local clock time, UTC+01:00 until the clocks change at 02:00 on ${en.date('2027-03-28', { weekday: true })}, then UTC+02:00. (Europe/Oslo)`);
    const change = reference.days.find((d) => d.date === '2027-03-28')!;
    const row = textOf(rowById(html, 'day-28'));
    expect(row).toContain(`${en.offsetChange(change.offsetChange!)}. This day has 23 hours.`);
    for (const e of change.events) expect(row).toContain(`${e.clock} ${cm(e.height)} UTC${e.offset}`);
    expect(textOf(rowById(html, 'day-27'))).not.toMatch(/Clocks|UTC\+/);
  });

  it('marks a height below chart datum in bold, boxed, with a minus sign and words for screen readers', () => {
    const row = rowById(read(site, 'rimeskerry-fjord/2027/01/index.html'), 'day-14');
    expect(row).toContain('<strong class="height below-datum">−0.12<span class="visually-hidden"> (below chart datum)</span></strong>');
    expect(row).toMatch(/curve-dot-below/);
  });

  it('marks springs, neaps and moon quarters in words on the model’s days, and draws a curve', () => {
    const html = read(site, 'rimeskerry-fjord/2027/02/index.html');
    const feb = reference.days.filter((d) => d.month === 2);
    const spring = feb.find((d) => d.springNeap === 'spring')!;
    const neap = feb.find((d) => d.springNeap === 'neap')!;
    expect(textOf(rowById(html, `day-${spring.dayOfMonth}`))).toContain('Springs');
    expect(textOf(rowById(html, `day-${neap.dayOfMonth}`))).toContain('Neaps');
    for (const d of feb.filter((x) => !x.springNeap)) expect(textOf(rowById(html, `day-${d.dayOfMonth}`))).not.toMatch(/Springs|Neaps/);
    const words = { new: 'New moon', 'first-quarter': 'First quarter', full: 'Full moon', 'last-quarter': 'Last quarter' };
    const quarters = reference.moonPhases.filter((m) => m.date.startsWith('2027-02'));
    expect(quarters.length).toBeGreaterThanOrEqual(3);
    for (const q of quarters) {
      const moonRow = rowById(html, `day-${Number(q.date.slice(8))}`);
      expect(textOf(moonRow)).toContain(`${words[q.phase]} ${q.clock}`);
      expect(moonRow).toContain('class="moon-glyph"');
    }
    const points = itemAt(reference.days, 31, 'days').curve.length; // 1 February: samples from midnight to midnight
    expect(rowById(html, 'day-1')).toMatch(new RegExp(`<path class="curve-line" d="M0 [\\d.]+(L[\\d.]+ [\\d.]+){${points - 1}}"`));
  });

  it('gives sunrise and sunset, and says "Sun up all day" / "Sun down all day" in words when the model has none', () => {
    const june = reference.days.filter((d) => d.month === 6 && d.sunNote === 'sun-up-all-day');
    const december = reference.days.filter((d) => d.month === 12 && d.sunNote === 'sun-down-all-day');
    expect(june.length).toBeGreaterThan(20); // 69.7° N: midnight sun all June, polar night in December
    expect(december.length).toBeGreaterThan(20);
    expect(textOf(rowById(read(site, 'rimeskerry-fjord/2027/06/index.html'), `day-${june[0]?.dayOfMonth}`))).toContain('Sun up all day');
    expect(textOf(rowById(read(site, 'rimeskerry-fjord/2027/12/index.html'), `day-${december[0]?.dayOfMonth}`))).toContain('Sun down all day');
    const mar10 = reference.days.find((d) => d.date === '2027-03-10')!;
    expect(textOf(rowById(read(site, 'rimeskerry-fjord/2027/03/index.html'), 'day-10'))).toContain(`Rise ${mar10.sunriseClock} Set ${mar10.sunsetClock}`);
  });
});

describe('station-year page', () => {
  it('shows the datums, the year at a glance linking every month, and the downloads', () => {
    const html = read(site, 'rimeskerry-fjord/2027/index.html');
    const text = textOf(html);
    expect(text).toContain(`MHWS Mean high water springs ${cm(reference.datums.MHWS)}`);
    expect(text).toContain(`LAT Lowest astronomical tide ${cm(reference.datums.LAT)}`);
    expect(text).toContain(`Tide type ${en.tideType(reference.tideType.kind)} (form number ${reference.tideType.formNumber.toFixed(2)})`);
    for (let m = 1; m <= 12; m++) expect(html).toContain(`href="${String(m).padStart(2, '0')}/index.html"`);
    expect(html.match(/class="glance-month"/g) ?? []).toHaveLength(12);
    const springs = reference.days.filter((d) => d.month === 5 && d.springNeap === 'spring').map((d) => d.dayOfMonth);
    expect(text).toContain(`Springs ${springs.join(springs.length === 2 ? ' and ' : ', ')}`);
    expect(html).toContain('href="../../data/rimeskerry-fjord-2027.ics"');
    expect(html).toContain('href="../../data/rimeskerry-fjord-2027-events.csv"');
    expect(html).toContain('href="../../data/rimeskerry-fjord-2027-events.json"');
    for (const c of reference.offsetChanges) expect(text).toContain(en.offsetChange(c));
  });

  it('for a secondary port names and links its reference port and prints its differences', () => {
    const html = read(site, 'whitespume-sound/2027/index.html');
    expect(html).toContain('Secondary port of <a href="../../rimeskerry-fjord/2027/index.html">Rimeskerry Fjord (invented)</a>');
    const st = secondary.station;
    if (st.kind !== 'secondary') throw new Error('whitespume-sound should be a secondary port');
    const text = textOf(html);
    for (const [label, d] of [['High water', st.differences.high_water], ['Low water', st.differences.low_water]] as const) {
      expect(text).toContain(`${label} ${signed(d.springs.time, 0, 'min').replace(/^0 min$/, '0 min')} ${signed(d.neaps.time, 0, 'min')} ${signed(d.springs.height, 2, 'm')} ${signed(d.neaps.height, 2, 'm')}`);
    }
  });
});

describe('footer, escaping and units', () => {
  it('every page carries the caution, the provenance and the invented-data note', () => {
    for (const file of htmlFiles(site)) {
      const footer = readFileSync(file, 'utf8').split('<footer class="colophon">')[1];
      const text = textOf(footer);
      expect(text, file).toContain(en.caution);
      expect(text, file).toContain('Provenance of the data:');
      expect(text, file).toMatch(/Invented data: (this station|stations marked invented)/);
    }
    const whitespume = textOf(read(site, 'whitespume-sound/2027/05/index.html').split('<footer')[1]);
    expect(whitespume).toContain(secondary.station.provenance);
  });

  it('the index and datums pages carry one provenance sentence, not one per near-identical station text', async () => {
    // This site mixes three provenances: the footer points to the station pages, once.
    for (const path of ['index.html', 'datums/index.html']) {
      const text = textOf(itemAt(read(site, path).split('<footer class="colophon">'), 1, `footer of ${path}`));
      expect(text.split('Provenance of the data:').length - 1, path).toBe(1);
      expect(text).toContain('Provenance of the data: each station’s page names where its data come from.');
      expect(text).not.toContain(secondary.station.provenance);
    }
    // The demo's reference and secondary ports say "not real constants" and "not real differences":
    // two provenances, one sentence.
    const demo = demoModels(['brinewold-head', 'saltgrist-cove']);
    expect(new Set(demo.map((m) => m.station.provenance)).size).toBe(2);
    const out = join(tmp, 'site-demo-pair');
    await renderSite(demo, out, { units: 'm', quiet: true });
    for (const path of ['index.html', 'datums/index.html']) {
      const text = textOf(itemAt(read(out, path).split('<footer class="colophon">'), 1, `footer of ${path}`));
      expect(text.split('Provenance of the data:').length - 1).toBe(1);
      expect(text.split('Invented for the tidewright demo').length - 1, path).toBe(0);
    }
    // One provenance shared by every station is printed as it is.
    const one = join(tmp, 'site-one');
    await renderSite([reference], one, { units: 'm', quiet: true });
    expect(textOf(itemAt(read(one, 'index.html').split('<footer class="colophon">'), 1, 'footer of index.html'))).toContain(`Provenance of the data: ${reference.station.provenance}.`);
  });

  it('shows station text with markup as text, never as markup', () => {
    for (const file of htmlFiles(site)) {
      // The one script of the site is the index's search box, loaded from the site's own assets.
      const html = readFileSync(file, 'utf8').replace('<script src="assets/find.js" defer></script>', '');
      expect(html, file).not.toMatch(/<script|<b>|<i>/);
    }
    const page = read(site, 'odd-name/2027/04/index.html');
    expect(page).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; Quay &amp; &quot;Pier&quot; &lt;b&gt;');
    expect(textOf(page)).toContain(HOSTILE_NAME);
    expect(read(site, 'odd-name/2027/index.html')).toContain('Invented &lt;i&gt;provenance&lt;/i&gt;');
  });

  it('with units ft prints feet (international foot) and says so', () => {
    const html = read(feetSite, 'rimeskerry-fjord/2027/03/index.html');
    const day = reference.days.find((d) => d.date === '2027-03-10')!;
    const e = firstOf(day.events, 'events of 10 March');
    const feet = fixed(e.height / 0.3048, 1); // 1 ft = 0.3048 m exactly
    expect(textOf(rowById(html, 'day-10'))).toContain(`${e.clock} ${feet}`);
    expect(html).toContain('(time, ft)');
    expect(textOf(html)).toContain('Heights: feet above Chart Datum');
    const year = textOf(read(feetSite, 'rimeskerry-fjord/2027/index.html'));
    expect(year).toContain(`springs ${fixed(reference.meanSpringRange / 0.3048, 1)} ft`);
    expect(year).toContain(`MHWS Mean high water springs ${fixed(reference.datums.MHWS / 0.3048, 1)}`);
  });
});

describe('downloads', () => {
  it('writes CSV, JSON and iCalendar once, inside the site, where its links point', () => {
    for (const id of ids) {
      for (const name of [`${id}-2027-events.csv`, `${id}-2027-events.json`, `${id}-2027.ics`]) {
        expect(existsSync(join(site, 'data', name)), name).toBe(true);
      }
    }
    expect(existsSync(join(tmp, 'data'))).toBe(false);
  });
});

describe('valid HTML', () => {
  it('every generated page passes html-validate', async () => {
    const validator = new HtmlValidate({
      extends: ['html-validate:recommended'],
      rules: {
        // Purely stylistic: Nunjucks output keeps the template's own whitespace.
        'no-trailing-whitespace': 'off',
        // SVG shapes are written self-closed (<circle/>), which HTML allows for foreign elements.
        'void-style': 'off',
        // Titles carry the full station name for bookmarks; a station file sets its length, not us.
        'long-title': 'off',
      },
    });
    const problems: string[] = [];
    for (const file of [...htmlFiles(site), ...htmlFiles(feetSite).slice(0, 3)]) {
      const report = await validator.validateFile(file);
      for (const r of report.results) {
        for (const m of r.messages) problems.push(`${file}:${m.line}:${m.column} ${m.ruleId} ${m.message}`);
      }
    }
    expect(problems.slice(0, 60)).toEqual([]);
  });
});
