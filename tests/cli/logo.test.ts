// logo: in tidewright.yaml: checked before a build (exists, is the image its name says, SVG without
// scripts), drawn on the covers of the books (PNG, JPEG) and shown in the site's masthead (all three).
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildStationYear, firstOf } from '../../engine/index.js';
import { StationFileError } from '../../engine/index.js';
import { loadStationSet } from '../../engine/index.js';
import { loadProjectFile } from '../../cli/build/project.js';
import { STARTER_FILES } from '../../cli/init-files.js';
import { renderCombinedBook, renderStationBook } from '../../templates/pdf/book.js';
import { renderSite } from '../../templates/site/render.js';
import { LOGO_SVG, solidPng } from '../fixtures/images.js';

const dir = mkdtempSync(join(tmpdir(), 'tidewright-logo-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
for (const [name, text] of Object.entries(STARTER_FILES)) {
  mkdirSync(dirname(join(dir, name)), { recursive: true });
  writeFileSync(join(dir, name), text);
}
mkdirSync(join(dir, 'brand'));
writeFileSync(join(dir, 'brand', 'logo.svg'), LOGO_SVG);
writeFileSync(join(dir, 'brand', 'logo.png'), solidPng(40, 24, [15, 59, 90]));
writeFileSync(join(dir, 'brand', 'fake.png'), LOGO_SVG);
writeFileSync(join(dir, 'brand', 'bad.svg'), '<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>');
const project = (logo: string) => {
  writeFileSync(join(dir, 'tidewright.yaml'), `logo: ${logo}\n`);
  return () => loadProjectFile(dir);
};

describe('logo: in tidewright.yaml', () => {
  it('is found relative to tidewright.yaml', () => {
    expect(project('brand/logo.svg')().settings.logo).toBe(join(dir, 'brand', 'logo.svg'));
    expect(project('brand/logo.png')().settings.logo).toBe(join(dir, 'brand', 'logo.png'));
  });

  it.each([
    ['brand/missing.svg', /tidewright\.yaml: logo: brand\/missing\.svg does not exist \(looked for .*\); write the path of an SVG, PNG or JPEG file, relative to tidewright\.yaml/],
    ['brand/fake.png', /logo: brand\/fake\.png is not a PNG file inside, despite its name/],
    ['brand/bad.svg', /logo: brand\/bad\.svg contains a script, an event handler or foreign content; save the logo as a plain drawing/],
    ['brand', /logo: brand is a folder, not a file/],
    ['tidewright.yaml', /logo: tidewright\.yaml is not an SVG, PNG or JPEG file/],
  ])('refuses %s in one line', (logo, message) => {
    const load = project(logo);
    expect(load).toThrow(StationFileError);
    expect(load).toThrow(message);
  });
});

describe('the logo in the outputs', () => {
  const set = loadStationSet(dir);
  const models = set.stations.map((s) => buildStationYear(s, set, 2027));
  const pngLogo = join(dir, 'brand', 'logo.png');

  it('is an image on the cover of a station book and of the combined book (pdfimages)', async () => {
    const station = join(dir, 'station.pdf');
    const combined = join(dir, 'combined.pdf');
    writeFileSync(station, await renderStationBook(firstOf(models, 'models'), { units: 'm', page: 'a5', logo: pngLogo }));
    writeFileSync(combined, await renderCombinedBook(models, { units: 'm', page: 'a5', logo: pngLogo }));
    let lists: string[];
    try {
      lists = [station, combined].map((f) => execFileSync('pdfimages', ['-list', f], { encoding: 'utf8' }));
    } catch {
      console.warn('pdfimages (poppler-utils) not installed: logo check in the PDF skipped');
      return;
    }
    for (const list of lists) {
      const rows = list.trim().split('\n').slice(2).map((l) => l.trim().split(/\s+/));
      expect(rows.filter((r) => r[0] === '1' && r[3] === '40' && r[4] === '24')).toHaveLength(1); // page 1, 40 × 24
    }
  }, 120_000); // two books, now with the starter folder's own page, on a loaded machine

  it('heads every page of the site', async () => {
    const out = join(dir, 'site');
    await renderSite(models, out, { units: 'm', quiet: true, logo: join(dir, 'brand', 'logo.svg') });
    expect(readFileSync(join(out, 'assets', 'logo.svg'), 'utf8')).toBe(LOGO_SVG);
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toContain('<img class="masthead-logo" src="assets/logo.svg" alt="">');
    const station = readFileSync(join(out, firstOf(models, 'models').station.id, '2027', 'index.html'), 'utf8');
    expect(station).toContain('<img class="masthead-logo" src="../../assets/logo.svg" alt="">');
    expect(existsSync(join(out, 'assets', 'logo.png'))).toBe(false);
  }, 60_000);
});
