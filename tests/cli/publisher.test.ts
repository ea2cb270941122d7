// The publisher's own book (tests/fixtures/publisher, an invented harbour board): logo (SVG, and PNG on a
// page), accent, cover picture, custom caution, edition date and Markdown pages (a table, pictures, a
// sponsor's page, a grid) reach the books and the site; a bad one is one line and leaves out/ alone.
import { execFileSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear, firstOf, itemAt, loadStationSet, StationFileError, type StationYear } from '../../engine/index.js';
import { loadProjectFile } from '../../cli/build/project.js';
import { makePlan } from '../../cli/build/plan.js';
import { parseBuildArgs } from '../../cli/build/args.js';
import { renderCombinedBook, renderStationBook } from '../../templates/pdf/book.js';
import { renderSite } from '../../templates/site/render.js';
import { runCli } from '../fixtures/run-cli.js';
import { nodesOf, structureTree, textUnder } from '../fixtures/pdf-structure.js';
import { siteThemeFolder } from '../../cli/build/site-theme.js';
import { worstPerFile, type ImageWarning } from '../../templates/pdf/image-resolution.js';

const FIXTURE = join(import.meta.dirname, '..', 'fixtures', 'publisher');
const POPPLER = ['pdftotext', 'pdfimages'].every((t) => existsSync(`/usr/bin/${t}`));
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the publisher book checks in the PDFs are SKIPPED');

const tmp = mkdtempSync(join(tmpdir(), 'tidewright-publisher-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

const plan = makePlan(parseBuildArgs(['--stations', FIXTURE, '--year', '2027']), tmp);
const set = loadStationSet(FIXTURE);
let models: StationYear[] = [];
const placed: ImageWarning[] = []; // what the station book's placements reported (checkImageResolution)
const book = join(tmp, 'station.pdf');
const combined = join(tmp, 'combined.pdf');
const site = join(tmp, 'site');

const text = (file: string, ...range: string[]): string => execFileSync('pdftotext', [...range, file, '-'], { encoding: 'utf8' });
const flat = (s: string): string => s.replace(/\s+/g, ' ');

beforeAll(async () => {
  models = set.stations.map((s) => buildStationYear(s, set, 2027));
  writeFileSync(book, await renderStationBook(firstOf(models, 'models'), { ...plan.render, warn: (w) => placed.push(w) }));
  writeFileSync(combined, await renderCombinedBook(models, plan.render));
  await renderSite(models, site, { ...plan.render, quiet: true });
}, 240_000);

describe('the publisher fixture', () => {
  it('reads every page with its front matter, in place and order', () => {
    const pages = plan.render.pages ?? [];
    expect(pages.map((p) => [p.slug, p.place, p.in, p.order])).toEqual([
      ['harbour-notes', 'front', 'both', 2], ['sponsor', 'back', 'book', 0],
      ['supporters', 'back', 'both', 2], ['welcome', 'front', 'both', 1],
    ]);
    expect(pages.find((p) => p.slug === 'supporters')!.grid!.map((g) => g.size)).toEqual(['half', 'quarter', 'quarter']);
    expect(plan.render.accent).toBe('#0b5d7a');
    expect(plan.render.stamp).toBe(Date.UTC(2026, 10, 15));
  });

  it('names each supplied PNG that would print below 300 dpi in the books, and no SVG', () => {
    const warnings = worstPerFile(placed).map((w) => w.text);
    // quay.png (1200 px wide) across the 124 mm type area of an A5 page: 1200 / (124 / 25.4) = 246 dpi
    expect(warnings.find((w) => w.includes('quay.png'))).toMatch(/pages\/images\/quay\.png: 24[56] dpi at its printed size of 124 × \d+ mm would print blurry; supply it at 146\d × \d+ pixels or more \(300 dpi\)/);
    // logo.png (600 px) in a quarter of the grid, (124 mm − 8 pt) / 2 wide: 252 dpi
    expect(warnings.find((w) => w.includes('logo.png'))).toMatch(/brand\/logo\.png: 25\d dpi/);
    expect(warnings).toHaveLength(2);
    expect(warnings.join('\n')).not.toMatch(/\.svg/);
  });

  it.skipIf(!POPPLER)('prints the pages in the station book: welcome and notes before the tables, sponsors after, imprint last', () => {
    const pages = text(book).split('\f');
    const at = (needle: string): number => pages.findIndex((p) => flat(p).includes(needle));
    const welcome = at('Welcome to Brinewold Test Harbour');
    const notes = at('Berths and depths');
    const january = pages.findIndex((p) => /^\s*January/m.test(p));
    expect(welcome).toBeGreaterThan(0);
    expect(notes).toBeGreaterThan(welcome);
    expect(january).toBeGreaterThan(notes);
    expect(flat(itemAt(pages, welcome, 'pages'))).toContain('Keep to 4 knots inside the breakwaters.');
    const table = text(book, '-layout', '-f', String(notes + 1), '-l', String(notes + 1));
    expect(table).toMatch(/Visitors' pontoon\s+2\.4\s+60/);
    expect(table).toMatch(/Drying wall\s+dries 0\.6\s+45/);
    expect(flat(itemAt(pages, notes, 'pages'))).toContain('such as <b>this</b>, prints just as it is written');
    expect(at('Imprint')).toBe(pages.filter((p) => p.trim() !== '').length - 1);
    expect(flat(itemAt(pages, at('Imprint'), 'pages'))).toContain('15 November 2026');
    expect(flat(itemAt(pages, at('Imprint'), 'pages'))).toContain('Test caution of the invented board');
  });

  it.skipIf(!POPPLER)('draws the logo, the cover picture and the pages\' pictures as images (pdfimages)', () => {
    const rows = execFileSync('pdfimages', ['-list', book], { encoding: 'utf8' }).trim().split('\n').slice(2).map((l) => l.trim().split(/\s+/));
    const onPage = (n: number) => rows.filter((r) => r[0] === String(n) && r[2] === 'image'); // not their alpha masks
    expect(onPage(1).length).toBeGreaterThanOrEqual(2); // the logo and the cover picture
    // the SVG logo drawn at 600 dpi of its 70-point box: 584 pixels wide
    expect(onPage(1).some((r) => r[3] === '584')).toBe(true);
    const pages = text(book).split('\f');
    const notes = pages.findIndex((p) => flat(p).includes('Berths and depths')) + 1;
    expect(onPage(notes).some((r) => r[3] === '1200')).toBe(true); // the quay photo, as supplied
    const sponsor = pages.findIndex((p) => flat(p).includes('Quayside Chandlery (invented sponsor)')) + 1;
    expect(onPage(sponsor)).toHaveLength(1);
    const grid = pages.findIndex((p) => flat(p).includes('Our supporters (invented)')) + 1;
    expect(onPage(grid)).toHaveLength(3);
  });

  it.skipIf(!POPPLER)('tags a link on a page as a Link element whose object reference is its annotation', { timeout: 600_000 }, () => {
    // welcome.md: "Write to [the harbour office](mailto:office@example.invalid) with corrections."
    const links = nodesOf(structureTree(book), 'Link').filter((l) => textUnder(l).includes('the harbour office'));
    expect(links).toHaveLength(1);
    const raw = readFileSync(book).toString('latin1');
    // every link annotation of the book (contents entries and the page's link) hangs from a Link element
    const annots = [...raw.matchAll(/(\d+) 0 obj\s*<<([\s\S]*?)>>\s*endobj/g)].filter(([, , body = '']) => /\/Subtype \/Link/.test(body));
    expect(annots.length).toBeGreaterThan(0);
    for (const [, id, body = ''] of annots) {
      expect(body).toMatch(/\/StructParent \d+/);
      expect(raw).toMatch(new RegExp(`/Type /OBJR\\s*/Obj ${id} 0 R`));
    }
  });

  it.skipIf(!POPPLER)('prints the pages once in the combined book, with its own imprint', () => {
    const all = flat(text(combined));
    expect(all.match(/Welcome to Brinewold Test Harbour/g)!.length).toBeGreaterThanOrEqual(1);
    expect(all.split('Berths and depths')).toHaveLength(2);
    expect(all).toContain('Imprint');
  });

  it('makes each page a page of the site, in the navigation, with its pictures and no way to run a script', () => {
    const notes = readFileSync(join(site, 'pages', 'harbour-notes', 'index.html'), 'utf8');
    expect(notes).toContain('<h1>Harbour notes</h1>');
    expect(notes).toContain('<td class="align-left">Visitors\' pontoon</td>');
    expect(notes).toContain('<td class="align-right">2.4</td>');
    expect(notes).toContain('<img src="picture-1.png" alt="The quay light and the east arm (invented)"');
    expect(notes).toContain('such as &lt;b&gt;this&lt;/b&gt;, prints');
    expect(existsSync(join(site, 'pages', 'harbour-notes', 'picture-1.png'))).toBe(true);
    expect(existsSync(join(site, 'pages', 'sponsor'))).toBe(false); // in: book
    const supporters = readFileSync(join(site, 'pages', 'supporters', 'index.html'), 'utf8');
    expect(supporters).toContain('class="own-picture own-picture-half"');
    const index = readFileSync(join(site, 'index.html'), 'utf8');
    expect(index).toMatch(/<nav class="masthead-nav"[\s\S]*href="pages\/welcome\/index.html"[\s\S]*href="pages\/harbour-notes\/index.html"[\s\S]*datums[\s\S]*href="pages\/supporters\/index.html"/);
    expect(index).toContain('<img class="masthead-logo" src="assets/logo.svg"');
    expect(index).toContain('<figure class="cover-picture"><img src="assets/cover.svg"');
    expect(index).toContain('--sea: #0b5d7a');
    for (const file of ['pages/harbour-notes/index.html', 'pages/welcome/index.html', 'pages/supporters/index.html']) {
      expect(readFileSync(join(site, file), 'utf8')).not.toMatch(/<script/i);
    }
  });
});

describe('a site/ folder laid over the built-in templates', () => {
  it('takes the place of the template and stylesheet of the same path, and refuses code', async () => {
    const dir = join(tmp, 'themed');
    cpSync(FIXTURE, dir, { recursive: true });
    const templates = join(import.meta.dirname, '..', '..', 'templates');
    mkdirSync(join(dir, 'site', '_includes', 'layouts'), { recursive: true });
    mkdirSync(join(dir, 'site', 'assets'), { recursive: true });
    const base = readFileSync(join(templates, '_includes', 'layouts', 'base.njk'), 'utf8');
    writeFileSync(join(dir, 'site', '_includes', 'layouts', 'base.njk'),
      base.replace('<main id="content" class="page">', '<p class="office-hours">Harbour office open 08:00 to 18:00 (invented)</p>\n<main id="content" class="page">'));
    writeFileSync(join(dir, 'site', 'assets', 'site.css'), `${readFileSync(join(templates, 'assets', 'site.css'), 'utf8')}\n.office-hours { text-align: center; }\n`);
    const themed = join(tmp, 'themed-site');
    await renderSite(models, themed, { ...plan.render, quiet: true, siteTheme: siteThemeFolder(dir)! });
    for (const file of ['index.html', 'imprint/index.html', 'pages/welcome/index.html']) {
      expect(readFileSync(join(themed, file), 'utf8')).toContain('<p class="office-hours">Harbour office open 08:00 to 18:00 (invented)</p>');
    }
    expect(readFileSync(join(themed, 'assets', 'site.css'), 'utf8')).toContain('.office-hours { text-align: center; }');
    expect(readFileSync(join(site, 'index.html'), 'utf8')).not.toContain('office-hours'); // the built-in templates are untouched
    writeFileSync(join(dir, 'site', 'assets', 'menu.js'), 'alert(1)');
    expect(() => siteThemeFolder(dir)).toThrow(/site\/assets\/menu\.js: \(file\): is not a kind of file site\/ takes; keep only templates and styles/);
  }, 120_000);
});

describe('a bad publisher folder', () => {
  const copy = (name: string): string => {
    const dir = join(tmp, name);
    cpSync(FIXTURE, dir, { recursive: true });
    return dir;
  };
  const cases: [string, (dir: string) => void, RegExp][] = [
    ['a bad accent', (d) => writeFileSync(join(d, 'tidewright.yaml'), readFileSync(join(d, 'tidewright.yaml'), 'utf8').replace('"#0b5d7a"', '"#9fd3e6"')),
      /tidewright\.yaml: accent: "#9fd3e6" against white .* below 4\.5:1; write a darker colour/],
    ['a missing logo', (d) => rmSync(join(d, 'brand', 'logo.svg')),
      /tidewright\.yaml: logo: brand\/logo\.svg does not exist \(looked for .*\); write the path of an SVG, PNG or JPEG file/],
    ['an unknown front-matter key', (d) => writeFileSync(join(d, 'pages', 'welcome.md'), '---\ntitle: Welcome\nplacement: front\n---\nHello\n'),
      /welcome\.md: placement: is not a setting of a page; the settings of a page are title, order, place, in, image, alt, images/],
    ['a bad place', (d) => writeFileSync(join(d, 'pages', 'welcome.md'), '---\ntitle: Welcome\nplace: middle\n---\nHello\n'),
      /welcome\.md: place: "middle" is not one of front, back; write place: front/],
    ['a script in the Markdown', (d) => writeFileSync(join(d, 'pages', 'welcome.md'), '---\ntitle: Welcome\n---\nHello\n\n<script>alert(1)</script>\n'),
      /welcome\.md: line 6: holds a <script> element, and pages never run code; remove it/],
    ['a missing picture', (d) => rmSync(join(d, 'pages', 'images', 'quay.png')),
      /harbour-notes\.md: line 17 image: images\/quay\.png does not exist/],
  ];

  it.each(cases)('%s is one line naming file, field and fix', (name, spoil, message) => {
    const dir = copy(name.replace(/\W+/g, '-'));
    spoil(dir);
    const load = (): unknown => loadProjectFile(dir);
    expect(load).toThrow(StationFileError);
    expect(load).toThrow(message);
    let line = '';
    try { load(); } catch (error) { line = (error as Error).message; }
    expect(line.split('\n')).toHaveLength(1);
  });

  it('stops the build before anything is written, leaving the previous out/ as it was', async () => {
    const dir = copy('build-refused');
    writeFileSync(join(dir, 'pages', 'welcome.md'), '---\ntitle: Welcome\n---\n<script>fetch("x")</script>\n');
    const out = join(tmp, 'out');
    mkdirSync(out, { recursive: true });
    writeFileSync(join(out, 'earlier.txt'), 'the previous build');
    const result = await runCli(['build', '--stations', dir, '--out', out, '--year', '2027', '--quiet']);
    expect(result.code).not.toBe(0);
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
    expect(result.stderr).toContain('welcome.md: line 4: holds a <script> element');
    expect(readFileSync(join(out, 'earlier.txt'), 'utf8')).toBe('the previous build');
  });
});
