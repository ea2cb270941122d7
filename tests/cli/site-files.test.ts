// A publisher's own website files (site-files/ beside the stations, e.g. CNAME) are copied into every
// build's site, since a build replaces out/ whole; none may take the place of a page the build writes.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { StationFileError } from '../../engine/index.js';
import type { Station } from '../../engine/index.js';
import { checkStations } from '../../cli/check.js';
import { siteFilesFolder } from '../../cli/build/site-files.js';
import type { BuildPlan } from '../../cli/build/options.js';
import { buildAlmanac, type BuildDeps, type BuildEvents } from '../../cli/build/run.js';
import { renderSite } from '../../templates/site/render.js';
import { sampleYear } from '../fixtures/sample-year.js';

const root = mkdtempSync(join(tmpdir(), 'tw-site-files-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const STATION = `id: stint-rock
name: Stint Rock (invented)
kind: reference
position: { latitude: 47, longitude: -16 }
timezone: UTC
datum: Chart Datum
mean_level: 2.2
constituents:
  M2: { amplitude: 1.6, phase: 205 }
  S2: { amplitude: 0.55, phase: 250 }
provenance: Invented for the site-files test
`;

let n = 0;
function stationsWith(files: Record<string, string>): string {
  const dir = join(root, `stations-${n++}`);
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
  return dir;
}

describe('the publisher\'s site files', () => {
  it('are copied into the site with the pages, dot files and subfolders included', async () => {
    const dir = stationsWith({ 'site-files/CNAME': 'tides.example.org\n', 'site-files/.well-known/security.txt': 'Contact: x\n' });
    const folder = siteFilesFolder(dir, ['sample-quay']);
    expect(folder).toBe(join(dir, 'site-files'));
    const site = join(root, `site-${n++}`);
    await renderSite([sampleYear(2027)], site, { units: 'm', quiet: true, siteFiles: folder! });
    expect(readFileSync(join(site, 'CNAME'), 'utf8')).toBe('tides.example.org\n');
    expect(readFileSync(join(site, '.well-known', 'security.txt'), 'utf8')).toBe('Contact: x\n');
    expect(readFileSync(join(site, 'index.html'), 'utf8')).toMatch(/^<!DOCTYPE html>/);
  });

  it('is no folder at all when there is none', () => {
    expect(siteFilesFolder(stationsWith({ 'a.yaml': '' }), [])).toBeNull();
  });

  it.each([
    ['index.html', /site-files\/index\.html: \(file\): the website has its own index\.html; rename or remove it/],
    ['assets/site.css', /site-files\/assets: \(file\): the website has its own assets; /],
    ['brinewold-head/2027/index.html', /site-files\/brinewold-head: \(file\): the website has its own brinewold-head \(a station's pages\); /],
  ])('refuses %s, which would replace what the build writes, in one line', (name, message) => {
    const dir = stationsWith({ [`site-files/${name}`]: 'mine' });
    expect(() => siteFilesFolder(dir, ['brinewold-head'])).toThrow(StationFileError);
    expect(() => siteFilesFolder(dir, ['brinewold-head'])).toThrow(message);
  });

  it('refuses links and devices (a link to /dev/zero would never end)', () => {
    const dir = stationsWith({ 'site-files/CNAME': 'x' });
    symlinkSync('/dev/zero', join(dir, 'site-files', 'zero'));
    expect(() => siteFilesFolder(dir, [])).toThrow(/site-files\/zero: \(file\): is not a plain file \(a link or a device\); put a copy/);
  });

  it('are checked by tidewright check too', () => {
    const dir = stationsWith({ 'site-files/index.html': 'mine' });
    writeFileSync(join(dir, 'stint-rock.yaml'), STATION);
    const messages = checkStations(dir).problems.map((p) => p.message);
    expect(messages).toEqual([expect.stringMatching(/site-files\/index\.html: \(file\): the website has its own index\.html/)]);
  });

  it('reach the site renderer from a build, and a clash stops the build before anything is written', async () => {
    const dir = stationsWith({ 'stint-rock.yaml': STATION, 'site-files/CNAME': 'x' });
    const seen: (string | undefined)[] = [];
    const deps: BuildDeps = {
      checkSet: () => ({ stations: [{ ...sampleYear(2027).station, id: 'stint-rock' } as Station], problems: [] }),
      computeStations: async (request, onStation) => onStation({ id: 'stint-rock', summary: sampleYear(request.year), model: sampleYear(request.year), pdfPages: 1 }),
      renderSite: async (_m, siteDir, _o, siteFiles) => { seen.push(siteFiles); mkdirSync(siteDir, { recursive: true }); },
      renderCombinedBook: async () => Buffer.from('%PDF-1.3\n%%EOF\n'),
      cores: () => 1,
    };
    const events: BuildEvents = { progress: { stage() {}, tick() {}, clear() {} }, note() {}, tempCreated() {}, committed() {} };
    const plan: BuildPlan = { stationsDir: dir, outDir: join(root, `out-${n++}`), year: 2027, render: { units: 'm', page: 'a5', imposition: 'none' },
      quiet: true, workers: 1, projectFile: null };
    await buildAlmanac(plan, deps, events);
    expect(seen).toEqual([join(dir, 'site-files')]);

    writeFileSync(join(dir, 'site-files', 'stint-rock'), 'clash');
    const out = join(root, `out-${n++}`);
    await expect(buildAlmanac({ ...plan, outDir: out }, deps, events)).rejects.toThrow(/the website has its own stint-rock/);
    expect(existsSync(out)).toBe(false);
  });
});
