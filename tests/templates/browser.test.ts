// The built site in a real browser (Debian's chromium through playwright-core): follow links from the
// index to a station and a month, no console errors, no sideways scrolling on a phone, a month prints
// on one A4 page, and screenshots at phone and desktop widths in tests/.artifacts/ to look at.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { extname, join, normalize } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderSite } from '../../templates/site/render.js';
import { demoModels } from './site-build.js';

const CHROMIUM = '/usr/bin/chromium';
const hasChromium = existsSync(CHROMIUM);
if (!hasChromium) console.warn(`browser tests skipped: ${CHROMIUM} not found (apt-get install -y chromium)`);

const ARTIFACTS = join(import.meta.dirname, '..', '.artifacts');
const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.css': 'text/css', '.csv': 'text/csv', '.json': 'application/json',
  '.ics': 'text/calendar', '.svg': 'image/svg+xml',
};

let tmp: string;
let server: Server;
let base: string;
let browser: Browser;

function serve(root: string): Promise<Server> {
  const srv = createServer((req, res) => {
    const path = normalize(decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname)).replace(/^(\.\.[/\\])+/, '');
    let file = join(root, path);
    if (existsSync(file) && statSync(file).isDirectory()) file = join(file, 'index.html');
    if (!existsSync(file)) {
      res.writeHead(404).end('not found');
      return;
    }
    res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' });
    res.end(readFileSync(file));
  });
  return new Promise((done) => srv.listen(0, '127.0.0.1', () => done(srv)));
}

/** A page that records console errors, failed requests and uncaught exceptions. */
async function watchedPage(width: number, height: number): Promise<{ page: Page; errors: string[] }> {
  const page = await browser.newPage({ viewport: { width, height } });
  const errors: string[] = [];
  page.on('console', (m) => { if (m.type() === 'error') errors.push(`${m.text()} ${m.location().url}`); });
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('response', (r) => { if (r.status() >= 400) errors.push(`${r.status()} ${r.url()}`); });
  return { page, errors };
}

async function noSidewaysScroll(page: Page): Promise<void> {
  // A string, so this Node-side file needs no DOM types.
  const widths = await page.evaluate<{ doc: number; view: number }>(
    '({ doc: document.documentElement.scrollWidth, view: window.innerWidth })',
  );
  expect(widths.doc, `page ${page.url()} scrolls sideways`).toBeLessThanOrEqual(widths.view);
}

describe.skipIf(!hasChromium)('the site in chromium', () => {
  beforeAll(async () => {
    tmp = mkdtempSync(join(tmpdir(), 'tidewright-browser-'));
    // A reference port with one of its secondary ports, as the engine builds them (Europe/Lisbon, DST).
    await renderSite(demoModels(['brinewold-head', 'saltgrist-cove']), join(tmp, 'site'), { units: 'm', quiet: true });
    server = await serve(join(tmp, 'site'));
    const address = server.address();
    base = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}/`;
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
        '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    mkdirSync(ARTIFACTS, { recursive: true });
  });

  afterAll(async () => {
    await browser?.close();
    await new Promise((done) => (server ? server.close(done) : done(undefined)));
    if (tmp) rmSync(tmp, { recursive: true, force: true });
  });

  for (const [label, width, height] of [['phone', 375, 812], ['desktop', 1280, 900]] as const) {
    it(`index → station → month at ${label} width (${width}×${height}) without console errors`, async () => {
      const { page, errors } = await watchedPage(width, height);
      await page.goto(base);
      expect(await page.locator('h1').count()).toBe(1);
      await page.screenshot({ path: join(ARTIFACTS, `site-index-${label}.png`), fullPage: true });
      await noSidewaysScroll(page);

      await page.getByRole('link', { name: 'Brinewold Head (invented)', exact: true }).last().click(); // the list's link (the map above has one too)
      await page.waitForURL(/brinewold-head\/2027\/index\.html$/);
      expect(await page.locator('h1').innerText()).toContain('Brinewold Head (invented)');
      await page.screenshot({ path: join(ARTIFACTS, `site-station-${label}.png`), fullPage: true });
      await noSidewaysScroll(page);

      await page.locator('a.glance-link', { hasText: 'March' }).click();
      await page.waitForURL(/brinewold-head\/2027\/03\/index\.html$/);
      expect(await page.locator('tbody tr.day').count()).toBe(31);
      expect(await page.locator('#day-28 .clock-change').isVisible()).toBe(true);
      await page.screenshot({ path: join(ARTIFACTS, `site-month-${label}.png`), fullPage: true });
      await noSidewaysScroll(page);
      await page.locator('#day-28').screenshot({ path: join(ARTIFACTS, `site-day-${label}.png`) });

      await page.goto(`${base}datums/index.html`);
      await page.screenshot({ path: join(ARTIFACTS, `site-datums-${label}.png`), fullPage: true });
      await noSidewaysScroll(page);

      expect(errors).toEqual([]);
      await page.close();
    });
  }

  it('prints a 31-day month with a clock change on a single page of A4 and of US Letter', async () => {
    const { page } = await watchedPage(1280, 900);
    await page.goto(`${base}brinewold-head/2027/03/index.html`);
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: join(ARTIFACTS, 'site-month-print.png'), fullPage: true });
    for (const format of ['A4', 'Letter']) {
      const pdf = await page.pdf({ format, printBackground: true });
      const pages = pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? [];
      expect(pages, format).toHaveLength(1);
    }
    await page.close();
  });

  it('keeps text contrast at or above WCAG AA (4.5:1) on the month and station pages', async () => {
    const { page } = await watchedPage(1280, 900);
    // WCAG 2.1 relative luminance and contrast ratio, computed in the page from the used colours.
    const worst = `(() => {
      const rgb = (c) => (c.match(/[\\d.]+/g) || []).map(Number);
      const lum = ([r, g, b]) => [r, g, b].map((v) => { v /= 255; return v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4; })
        .reduce((a, v, i) => a + v * [0.2126, 0.7152, 0.0722][i], 0);
      const bg = (el) => { for (; el; el = el.parentElement) { const c = rgb(getComputedStyle(el).backgroundColor); if (c.length === 3 || c[3] > 0.5) return c.slice(0, 3); } return [255, 255, 255]; };
      let low = { ratio: 99, text: '' };
      for (const el of document.querySelectorAll('body *')) {
        const own = [...el.childNodes].some((n) => n.nodeType === 3 && n.textContent.trim());
        if (!own || el.closest('svg') || el.offsetParent === null) continue;
        const a = lum(rgb(getComputedStyle(el).color)), b = lum(bg(el));
        const ratio = (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
        if (ratio < low.ratio) low = { ratio: Math.round(ratio * 100) / 100, text: el.className + ': ' + el.textContent.trim().slice(0, 30) };
      }
      return low;
    })()`;
    for (const path of ['brinewold-head/2027/03/index.html', 'brinewold-head/2027/index.html', 'index.html']) {
      await page.goto(`${base}${path}`);
      const low = await page.evaluate<{ ratio: number; text: string }>(worst);
      expect(low.ratio, `${path}: ${low.text}`).toBeGreaterThanOrEqual(4.5);
    }
    await page.close();
  });

  it('has no sideways scrolling at 360 px, the narrowest common phone', async () => {
    const { page, errors } = await watchedPage(360, 740);
    for (const path of ['index.html', 'brinewold-head/2027/index.html', 'saltgrist-cove/2027/10/index.html', 'datums/index.html']) {
      await page.goto(`${base}${path}`);
      await noSidewaysScroll(page);
    }
    expect(errors).toEqual([]);
    await page.close();
  });
});
