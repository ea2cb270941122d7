// Press output: page boxes read back with pdfinfo -box, crop marks and thumb tabs found in the rendered
// pixels, colours written as black ink only (the publisher's pictures too, in greys), and the
// image-resolution warning.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear } from '../../engine/index.js';
import { loadStationSet } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { contentBox, pageGeometry } from '../../templates/pdf/geometry.js';
import { resolutionWarning, type ImageWarning } from '../../templates/pdf/image-resolution.js';
import { greyPixels } from '../../templates/pdf/place-picture.js';
import { loadPicture } from '../../templates/pdf/picture.js';
import { renderPocketTable } from '../../templates/pdf/pocket.js';
import { solidPng, solidRgbaPng } from '../fixtures/images.js';
import { BLEED, blackInk, SLUG } from '../../templates/pdf/press.js';
import { zipSame } from '../fixtures/lists.js';

const POPPLER = ['pdfinfo', 'pdftoppm'].every((t) => existsSync(`/usr/bin/${t}`));
if (!POPPLER) console.warn('poppler-utils not found in /usr/bin: the press output\u2019s box and pixel checks are SKIPPED');

const MM = 72 / 25.4;
let dir = '';
let press: Buffer;
let file = '';
let logo = '';
const warnings: ImageWarning[] = [];
const set = loadStationSet('stations-demo');
const model = buildStationYear(set.byId.get('brinewold-head')!, set, 2027);
const a5 = pageGeometry('a5');

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tidewright-press-'));
  logo = join(dir, 'logo.png');
  writeFileSync(logo, solidPng(600, 300, [15, 59, 90])); // a deep blue, 600 px across a 70 pt logo box: sharp
  press = await renderStationBook(model, { units: 'm', page: 'a5', press: true, logo, warn: (w) => warnings.push(w) });
  file = join(dir, 'press.pdf');
  writeFileSync(file, press);
});
afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

/** Grey levels of page p rendered at `dpi` (pdftoppm writes a binary PGM). */
function raster(p: number, dpi: number): { w: number; h: number; at: (xPt: number, yPt: number) => number } {
  const out = join(dir, `p${p}`);
  execFileSync('pdftoppm', ['-gray', '-r', String(dpi), '-f', String(p), '-l', String(p), '-singlefile', file, out]);
  const buf = readFileSync(`${out}.pgm`);
  const header = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(buf.toString('latin1', 0, 40));
  if (header === null) throw new Error(`${out}.pgm is not an 8-bit PGM`);
  const [all, width = '', height = ''] = header;
  const w = Number(width);
  const h = Number(height);
  const start = all.length;
  return { w, h, at: (x, y) => buf.readUInt8(start + Math.round((y * dpi) / 72) * w + Math.round((x * dpi) / 72)) };
}

describe('press output', () => {
  it.skipIf(!POPPLER)('sets TrimBox to the A5 page and BleedBox 3 mm beyond it on every page', () => {
    const boxes = execFileSync('pdfinfo', ['-box', '-f', '1', '-l', '30', file], { encoding: 'utf8' });
    const box = (name: string) => [...boxes.matchAll(new RegExp(`${name}:\\s+([\\d.]+)\\s+([\\d.]+)\\s+([\\d.]+)\\s+([\\d.]+)`, 'g'))]
      .map(([, x0 = '', y0 = '', x1 = '', y1 = '']) => ({ x0: Number(x0), y0: Number(y0), x1: Number(x1), y1: Number(y1) }));
    const trims = box('TrimBox');
    expect(trims.length).toBe(3 + 24 + 1 + 1); // cover, facts, caution; 24 month pages; overview; imprint
    for (const [t, b] of zipSame(trims, box('BleedBox'), 'page boxes')) {
      expect(t.x1 - t.x0).toBeCloseTo(148 * MM, 1);
      expect(t.y1 - t.y0).toBeCloseTo(210 * MM, 1);
      for (const bleed of [t.x0 - b.x0, t.y0 - b.y0, b.x1 - t.x1, b.y1 - t.y1]) expect(bleed).toBeCloseTo(3 * MM, 1);
    }
  });

  it.skipIf(!POPPLER)('draws crop marks outside the bleed in line with the trim, and nothing else out there', () => {
    const r = raster(4, 150);
    const lines = (xPt: number, yPt: number) => r.at(xPt, yPt) < 128;
    // the mark above the top-left corner lies on the trim's x, beyond the bleed
    expect(lines(SLUG, SLUG - BLEED - 2 * MM)).toBe(true);
    expect(lines(SLUG - BLEED - 2 * MM, SLUG)).toBe(true);
    // inside the bleed at that corner: paper
    expect(lines(SLUG - BLEED / 2, SLUG - BLEED / 2)).toBe(false);
  });

  it.skipIf(!POPPLER)('runs each month\u2019s thumb tab through the trim into the bleed at the outer edge', () => {
    // page 4 is January's left-hand (verso) page: tab on the left, first twelfth of the type area
    const r = raster(4, 150);
    const y = SLUG + a5.margins.top + (a5.size.height - a5.margins.top - a5.margins.bottom) / 24;
    expect(r.at(SLUG - BLEED / 2, y)).toBeLessThan(64); // in the bleed
    expect(r.at(SLUG + 1, y)).toBeLessThan(64); // just inside the trim
    // page 9 is March's right-hand page: tab on the right, third twelfth
    const r9 = raster(9, 150);
    const y9 = SLUG + a5.margins.top + (5 / 24) * (a5.size.height - a5.margins.top - a5.margins.bottom);
    expect(r9.at(SLUG + a5.size.width + BLEED / 2, y9)).toBeLessThan(64);
  });

  it('writes every colour as black ink: DeviceCMYK, never DeviceRGB', () => {
    const text = press.toString('latin1');
    let cmyk = 0;
    for (const m of text.matchAll(/stream\r?\n/g)) {
      const start = m.index! + m[0].length;
      const end = text.indexOf('endstream', start);
      let content = '';
      try { content = inflateSync(press.subarray(start, end)).toString('latin1'); } catch { continue; } // fonts etc.
      expect(content).not.toMatch(/DeviceRGB|\brg\b|\bRG\b/);
      if (content.includes('/DeviceCMYK')) cmyk++;
    }
    expect(cmyk).toBeGreaterThan(20);
    expect(blackInk('#666666')).toEqual([0, 0, 0, 0.6]);
    expect(() => blackInk('#0055aa')).toThrow(/not a grey/);
  });

  it('is byte-identical when rendered again, and a book without press has no page boxes', async () => {
    expect((await renderStationBook(model, { units: 'm', page: 'a5', press: true, logo })).equals(press)).toBe(true);
    const plain = (await renderStationBook(model, { units: 'm', page: 'a5' })).toString('latin1');
    expect(plain).not.toContain('/TrimBox');
  });
});

describe('the publisher\u2019s pictures in press output', () => {
  // Luma Y′ = 0.2126 R′ + 0.7152 G′ + 0.0722 B′ (ITU-R BT.709-6, item 3.2): for (15, 59, 90), 51.9
  it('turns each pixel into the grey of its luma, keeps transparency, and knows a grey picture from a coloured one', () => {
    const picture = (bytes: Buffer) => {
      const path = join(dir, `p${bytes.length}.png`);
      writeFileSync(path, bytes);
      return loadPicture(path, 100);
    };
    const blue = greyPixels(picture(solidPng(8, 4, [15, 59, 90])));
    expect([...new Set(blue.grey)]).toEqual([52]);
    expect(blue.alpha).toBeNull();
    expect(blue.coloured).toBe(true);
    const grey = greyPixels(picture(solidPng(8, 4, [90, 90, 90])));
    expect([...new Set(grey.grey)]).toEqual([90]);
    expect(grey.coloured).toBe(false);
    // half covered orange: 0.2126·200 + 0.7152·100 + 0.0722·50 = 117.7, coverage kept as it was
    const orange = greyPixels(picture(solidRgbaPng(8, 4, [200, 100, 50, 128])));
    for (const g of orange.grey) expect(Math.abs(g - 117.7)).toBeLessThanOrEqual(1.5);
    expect([...new Set(orange.alpha)]).toEqual([128]);
    // a picture the decoder cannot read is named with the fix, never left out of the page in silence
    const broken = solidPng(8, 4, [1, 2, 3]);
    broken.fill(0x55, 40, broken.length - 12); // IHDR intact (the size reads), pixel data garbled
    expect(() => greyPixels(picture(broken))).toThrow(/p\d+\.png: press output prints pictures in greys, and this picture could not be read for it; save it as an RGB or greyscale PNG or JPEG/);
  });

  it.skipIf(!POPPLER)('places the logo as a DeviceGray image printing the grey of its luma, and says so once', () => {
    const list = execFileSync('pdfimages', ['-list', file], { encoding: 'utf8' }).split('\n').slice(2).filter((l) => l.trim() !== '');
    expect(list.length).toBeGreaterThan(0);
    for (const line of list) expect(line.split(/\s+/)[6]).toBe('gray');
    // the logo sits in the top right corner of the cover's type area, 70 pt wide at most
    const r = raster(1, 150);
    const box = contentBox(a5, 1);
    expect(Math.abs(r.at(SLUG + box.x + box.width - 20, SLUG + box.y + 10) - 52)).toBeLessThanOrEqual(2);
    const colour = warnings.filter((w) => w.kind === 'colour');
    expect(colour).toHaveLength(1);
    expect(colour[0]?.text).toMatch(/logo\.png: in colour, and press output prints in black ink only, so it prints in greys; check the proof, or supply a greyscale picture/);
  });

  it.skipIf(!POPPLER)('prints the pocket table for the press too: trim and bleed boxes round the sheet, the logo in grey', async () => {
    const sheet = join(dir, 'pocket.pdf');
    writeFileSync(sheet, await renderPocketTable(model, { units: 'm', sheet: 'a4', press: true, logo }));
    const boxes = execFileSync('pdfinfo', ['-box', sheet], { encoding: 'utf8' });
    const [x0 = 0, y0 = 0, x1 = 0, y1 = 0] = /TrimBox:\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)/.exec(boxes)?.slice(1).map(Number) ?? [];
    expect(x1 - x0).toBeCloseTo(297 * MM, 1);
    expect(y1 - y0).toBeCloseTo(210 * MM, 1);
    expect(boxes).toMatch(/BleedBox/);
    const list = execFileSync('pdfimages', ['-list', sheet], { encoding: 'utf8' }).split('\n').slice(2).filter((l) => l.trim() !== '');
    expect(list.map((l) => l.split(/\s+/)[6])).toEqual(['gray']);
  });
});

describe('image resolution', () => {
  it('warns, naming the file, when an image would print under 300 dpi', () => {
    // 600 × 300 pixels printed 50.8 mm wide (144 pt, 2 in) is 300 dpi: fine; at 4 in it is 150 dpi
    expect(resolutionWarning('logo.png', { width: 600, height: 300 }, 144, 72)).toBeNull();
    const w = resolutionWarning('sponsor/logo.png', { width: 600, height: 300 }, 288, 144)!;
    expect(w).toMatch(/^sponsor\/logo\.png: 150 dpi at its printed size of 102 × 51 mm would print blurry; supply it at 1200 × 600 pixels/);
    expect(w).not.toContain('\n');
  });
});
