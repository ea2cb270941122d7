// The index of a large set: stations grouped by region: with an A–Z jump list, the map drawn at build
// time (one link per station, each dot inside the frame), the search box in chromium (it filters the
// list; with JavaScript off the page shows everything and no box), and screenshots of the index and of
// a station page with its year switch at phone and desktop widths in tests/.artifacts/.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, extname, join, normalize, resolve } from 'node:path';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { firstOf, itemAt, type StationYear } from '../../engine/index.js';
import { initialOf } from '../../templates/site/index-views.js';
import { longitudeSpan } from '../../templates/site/map.js';
import { renderSite } from '../../templates/site/render.js';
import { demoModels } from './site-build.js';
import { captured } from '../fixtures/lists.js';

const CHROMIUM = '/usr/bin/chromium';
const hasChromium = existsSync(CHROMIUM);
if (!hasChromium) console.warn(`site-index browser tests skipped: ${CHROMIUM} not found (apt-get install -y chromium)`);
const ARTIFACTS = join(import.meta.dirname, '..', '.artifacts');

const REGIONS: Record<string, string | undefined> = {
  'brinewold-head': 'Brinewold Coast',
  'saltgrist-cove': 'Outer Brinewold Banks', // a secondary port listed away from its reference port
  'kelpmoor-harbour': 'Brinewold Coast',
  'rimeskerry-fjord': 'Rimeskerry Skerries',
  'whitespume-sound': 'Rimeskerry Skerries',
  'galewrack-point': 'Galewrack Shelf',
  // palmsward-reach: no region, listed last under "Other stations"
};
const IDS = [...Object.keys(REGIONS), 'palmsward-reach'];

let tmp: string;
let site: string;
let models: StationYear[];

const withRegion = (m: StationYear): StationYear => {
  const region = REGIONS[m.station.id];
  return region === undefined ? m : { ...m, station: { ...m.station, region } };
};
const read = (path: string): string => readFileSync(join(site, path), 'utf8');

beforeAll(async () => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-index-'));
  site = join(tmp, 'site');
  models = [...demoModels(IDS as unknown as readonly string[]), ...demoModels(['brinewold-head'], 2028)].map(withRegion);
  await renderSite(models, site, { units: 'm', quiet: true, title: 'Tide Tables of the Invented Coast' });
}, 300_000);

afterAll(() => {
  if (tmp) rmSync(tmp, { recursive: true, force: true });
});

describe('the index grouped by region', () => {
  it('lists the regions in order, each with its own stations, the stations without one last', () => {
    const html = read('index.html');
    const headings = [...html.matchAll(/<h3 id="(region-[^"]+)-heading" class="region-heading">([^<]+)<\/h3>/g)].map((m) => m[2]);
    expect(headings).toEqual(['Brinewold Coast', 'Galewrack Shelf', 'Outer Brinewold Banks', 'Rimeskerry Skerries', 'Other stations']);
    const section = (name: string): string => firstOf(html.split('class="region-heading">').find((part) => part.startsWith(name))!.split('<section class="region"'), name);
    expect(section('Brinewold Coast')).toContain('Kelpmoor Harbour');
    expect(section('Rimeskerry Skerries')).toContain('Whitespume Sound');
    expect(section('Other stations')).toContain('Palmsward Reach');
    // Saltgrist Cove's reference port is listed under another region: its group links there and says where.
    const banks = section('Outer Brinewold Banks');
    expect(banks).toContain('Saltgrist Cove');
    expect(banks).toContain('href="brinewold-head/2027/index.html">Brinewold Head (invented)</a>');
    expect(banks).toContain('Listed under Brinewold Coast');
  });

  it('has an A–Z jump list whose letters reach the first region under each letter', () => {
    const html = read('index.html');
    const jump = captured(/<ol class="jump-letters">([\s\S]*?)<\/ol>/, html, 'jump list');
    const linked = [...jump.matchAll(/<a href="#([^"]+)">([^<]+)<\/a>/g)].map((m): [string, string] => [itemAt(m, 2, 'jump letter'), itemAt(m, 1, 'jump target')]);
    expect(linked.map(([letter]) => letter)).toEqual(['B', 'G', 'O', 'R']);
    for (const [letter, target] of linked) {
      const heading = new RegExp(`id="${target}"[^>]*>\\s*<h3 id="${target}-heading" class="region-heading">([^<]+)<`).exec(html);
      expect(heading, target).not.toBeNull();
      expect(initialOf(itemAt(heading!, 1, 'region heading'))).toBe(letter);
    }
    // Every other letter is there, as plain text.
    expect([...jump.matchAll(/<span class="jump-none">([^<]+)<\/span>/g)]).toHaveLength(26 - 4);
    expect(initialOf('Île Verte')).toBe('I');
  });

  it('lists every year of a station built for several', () => {
    expect(read('index.html')).toMatch(/href="brinewold-head\/2027\/index.html">2027<\/a>, <a href="brinewold-head\/2028\/index.html">2028<\/a>/);
  });
});

describe('the map of the stations', () => {
  it('draws land from the outlines and one link per station, each dot inside the frame', () => {
    const html = read('index.html');
    const svg = /<svg class="station-map" viewBox="0 0 (\d+) (\d+)">([\s\S]*?)<\/svg>/.exec(html)!;
    expect(svg).not.toBeNull();
    const [width, height] = [Number(svg[1]), Number(svg[2])];
    expect(svg[3]).toMatch(/<path class="map-land" d="M[\d.,\-LMZ]+/); // the frame spans half the world: land is in it
    const dots = [...itemAt(svg, 3, 'map svg').matchAll(/<a class="map-station" href="([^"]+)"[^>]*><title>([^<]+)<\/title><circle cx="([\d.]+)" cy="([\d.]+)"/g)];
    expect(dots.map((d) => d[2]).sort()).toEqual(models.filter((m) => m.year === 2027).map((m) => m.station.name).sort());
    for (const [, href, name, cx, cy] of dots) {
      expect(existsSync(resolve(dirname(join(site, 'index.html')), href!)), `${name} → ${href}`).toBe(true);
      expect(Number(cx)).toBeGreaterThan(0);
      expect(Number(cx)).toBeLessThan(width);
      expect(Number(cy)).toBeGreaterThan(0);
      expect(Number(cy)).toBeLessThan(height);
    }
  });

  it('frames stations on both sides of 180° as one stretch of ocean, not the whole world', () => {
    expect(longitudeSpan([178, -179, -175])).toEqual({ west: 178, span: 7 });
    const demo = longitudeSpan([-15.8, 9.6, 140.2, 165.8]);
    expect(demo.west).toBeCloseTo(-15.8, 9);
    expect(demo.span).toBeCloseTo(181.6, 9);
    expect(longitudeSpan([10])).toEqual({ west: 10, span: 0 });
  });
});

function serve(root: string): Promise<Server> {
  const types: Record<string, string> = { '.html': 'text/html; charset=utf-8', '.css': 'text/css', '.js': 'text/javascript', '.svg': 'image/svg+xml' };
  const srv = createServer((req, res) => {
    const path = normalize(decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname)).replace(/^(\.\.[/\\])+/, '');
    let file = join(root, path);
    if (existsSync(file) && statSync(file).isDirectory()) file = join(file, 'index.html');
    if (!existsSync(file)) return void res.writeHead(404).end('not found');
    res.writeHead(200, { 'content-type': types[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
  });
  return new Promise((done) => srv.listen(0, '127.0.0.1', () => done(srv)));
}

describe.skipIf(!hasChromium)('the index in chromium', () => {
  let browser: Browser;
  let server: Server;
  let base: string;
  const outside: string[] = []; // any request that leaves the test server

  beforeAll(async () => {
    server = await serve(site);
    const address = server.address();
    base = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}/`;
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    mkdirSync(ARTIFACTS, { recursive: true });
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    await new Promise((done) => (server ? server.close(done) : done(undefined)));
  });

  const visibleNames = (page: import('playwright-core').Page): Promise<string[]> =>
    page.evaluate<string[]>("[...document.querySelectorAll('.secondary-name a, .port-group-heading a')].filter((a) => a.offsetParent !== null).map((a) => a.textContent.trim())");

  it('filters the list as the reader types, fetching nothing, and shows everything again when cleared', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    page.on('request', (r) => { if (!r.url().startsWith(base)) outside.push(r.url()); });
    await page.goto(base);
    const all = await visibleNames(page);
    expect(all.length).toBeGreaterThanOrEqual(IDS.length);
    const box = page.getByRole('searchbox', { name: 'Find a station' });
    await expect(box.isVisible()).resolves.toBe(true);
    await box.fill('saltgr');
    expect(await visibleNames(page)).toEqual(['Brinewold Head (invented)', 'Saltgrist Cove (invented)']); // the group heading stays, for context
    expect(await page.textContent('.find-count')).toBe('1 station matches');
    expect(await page.isVisible('#region-rimeskerry-skerries')).toBe(false);
    await box.fill('KELPMOOR'); // any case
    expect(await page.textContent('.find-count')).toBe('1 station matches');
    await box.fill('skerries'); // a region's name finds its stations
    expect(await page.textContent('.find-count')).toBe('2 stations match');
    await box.fill('whitespume');
    expect(await visibleNames(page)).toContain('Whitespume Sound (invented)');
    await box.fill('zzz');
    expect(await page.textContent('.find-count')).toBe('0 stations match');
    await box.fill('');
    expect(await visibleNames(page)).toEqual(all);
    expect(errors).toEqual([]);
    expect(outside).toEqual([]);
    await page.close();
  });

  it('with JavaScript off shows every station and no search box', async () => {
    const context = await browser.newContext({ javaScriptEnabled: false, viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto(base);
    expect(await page.isVisible('.find')).toBe(false);
    expect((await visibleNames(page)).length).toBeGreaterThanOrEqual(IDS.length);
    await page.click('text=Galewrack Shelf');
    await page.click('.map-station >> nth=0');
    expect(page.url()).toBe(`${base}brinewold-head/2027/index.html`); // the first dot: Brinewold Head, by name
    await context.close();
  });

  it('screenshots: the index with its map, and a station page with its year switch, at phone and desktop widths', async () => {
    for (const [name, width, height] of [['desktop', 1280, 900], ['phone', 390, 844]] as const) {
      const page = await browser.newPage({ viewport: { width, height } });
      await page.goto(base);
      await page.screenshot({ path: join(ARTIFACTS, `index-map-${name}.png`), fullPage: false });
      const scroll = await page.evaluate<{ doc: number; view: number }>('({ doc: document.documentElement.scrollWidth, view: window.innerWidth })');
      expect(scroll.doc, 'index scrolls sideways').toBeLessThanOrEqual(scroll.view);
      await page.goto(`${base}brinewold-head/2028/`);
      const switchLinks = await page.$$eval('.year-switch a', (links) => links.map((a) => [a.textContent, a.getAttribute('aria-current')]));
      expect(switchLinks).toEqual([['2027', null], ['2028', 'page']]);
      await page.screenshot({ path: join(ARTIFACTS, `station-years-${name}.png`), fullPage: false });
      await page.click('.year-switch a >> text=2027');
      expect(page.url()).toBe(`${base}brinewold-head/2027/index.html`);
      await page.close();
    }
  });
});
