// A publisher's raster picture that would print below 300 dpi: the build says so in one line naming the
// file and its dpi at the size printed (templates/pdf/image-resolution.ts), once however many books place
// it; the placements all go through checkImageResolution. The dpi is recomputed here from the pixels and
// the printed size the line states (1 inch = 25.4 mm).
import { copyFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { checkImageResolution, worstPerFile, type ImageWarning } from '../../templates/pdf/image-resolution.js';
import { solidPng } from '../fixtures/images.js';
import { runCli } from '../fixtures/run-cli.js';

const tmp = mkdtempSync(join(tmpdir(), 'tidewright-dpi-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('checkImageResolution', () => {
  const pixels = { width: 600, height: 300 };
  it('reports a raster picture below 300 dpi at its printed size, with its dpi; never one drawn from SVG', () => {
    const seen: ImageWarning[] = [];
    checkImageResolution((w) => seen.push(w), { file: 'logo.png', pixels, vector: false }, 144, 72); // 2 in wide: 300 dpi
    expect(seen).toEqual([]);
    checkImageResolution((w) => seen.push(w), { file: 'logo.png', pixels, vector: false }, 288, 144); // 4 in: 150 dpi
    checkImageResolution((w) => seen.push(w), { file: 'logo.svg', pixels, vector: true }, 2880, 1440);
    expect(seen.map((w) => [w.file, w.dpi])).toEqual([['logo.png', 150]]);
    expect(seen[0]?.text).toMatch(/^logo\.png: 150 dpi at its printed size of 102 × 51 mm would print blurry; supply it at 1200 × 600 pixels or more/);
  });

  it('keeps, of several placements of a file, the least sharp', () => {
    const w = (file: string, dpi: number): ImageWarning => ({ file, dpi, text: `${file} ${dpi}` });
    expect(worstPerFile([w('a', 200), w('b', 100), w('a', 120), w('a', 250)]).map((x) => x.text)).toEqual(['a 120', 'b 100']);
  });
});

describe('a build with a low-resolution PNG logo', () => {
  it('prints one warning line naming the file and its dpi at the printed size', { timeout: 900_000 }, async () => {
    const dir = join(tmp, 'stations');
    mkdirSync(join(dir, 'brand'), { recursive: true });
    copyFileSync(join(import.meta.dirname, '..', 'fixtures', 'stations-good', 'brinewold-head.yaml'), join(dir, 'brinewold-head.yaml'));
    writeFileSync(join(dir, 'brand', 'logo.png'), solidPng(40, 24, [15, 59, 90]));
    writeFileSync(join(dir, 'tidewright.yaml'), 'title: Dpi test (invented)\nlogo: brand/logo.png\npocket: false\n');
    const result = await runCli(['build', '--stations', dir, '--out', join(tmp, 'out'), '--year', '2027', '--workers', '1']);
    expect(result.code, result.stderr).toBe(0);
    const lines = result.stderr.split('\n').filter((l) => l.includes('dpi'));
    expect(lines).toHaveLength(1); // the station book and the combined book place it: said once
    const m = /brand\/logo\.png: (\d+) dpi at its printed size of (\d+) × (\d+) mm would print blurry/.exec(lines[0] ?? '');
    expect(m, lines[0]).not.toBeNull();
    const [, dpi = '', mmWide = ''] = m ?? [];
    // 40 pixels across the printed width, which the line gives to the nearest millimetre
    expect(Number(dpi)).toBeGreaterThanOrEqual(Math.floor((40 * 25.4) / (Number(mmWide) + 0.5)));
    expect(Number(dpi)).toBeLessThanOrEqual((40 * 25.4) / (Number(mmWide) - 0.5));
  });
});
