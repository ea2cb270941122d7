// Right-to-left names in the PDF and characters the typeface lacks. Expected visual orders are worked
// by hand from the Unicode bidirectional algorithm (UAX #9): in a right-to-left paragraph the line is
// reversed as a whole; in a left-to-right one each right-to-left run is; brackets in a right-to-left run
// are mirrored; digits after Arabic letters count as Arabic numbers (rule W2) and stay left to right.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createDocument, finish } from '../../templates/pdf/document.js';
import { put } from '../../templates/pdf/text.js';
import { missingInBook } from '../../templates/pdf/coverage.js';
import { REPLACEMENT, visualPieces, withReplacements } from '../../templates/pdf/script.js';
import { runCli } from '../fixtures/run-cli.js';
import { pdfWords } from '../fixtures/pdf-words.js';

const work = mkdtempSync(join(tmpdir(), 'tw-pdf-script-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const hasPoppler = spawnSync('pdftotext', ['-v']).error === undefined;
if (!hasPoppler) console.warn('pdf-script.test.ts: pdftotext (poppler-utils) not found: the drawn-order checks are skipped');

/** The glyphs of each piece from left to right, as they land on the page (the shaper reverses Hebrew/Arabic). */
const onPage = (text: string): string[] => visualPieces(text).filter((p) => !p.space)
  .map((p) => (/[\u0590-\u06ff]/.test(p.text) ? [...p.text].reverse().join('') : p.text));

describe('visual order of a line', () => {
  it.each([
    ['שלום עולם', ['םלוע', 'םולש']],
    ['Port of שלום עולם (invented)', ['Port', 'of', 'םלוע', 'םולש', '(invented)']],
    ['נמל (חיפה) 2027', ['2027', '(הפיח)', 'למנ']],
    ['ميناء البحر', ['رحبلا', 'ءانيم']],
    ['Harbour ميناء البحر 12', ['Harbour', '12', 'رحبلا', 'ءانيم']],
    ['Gannet Head', ['Gannet', 'Head']],
  ])('%s', (text, expected) => {
    expect(onPage(text)).toEqual(expected);
  });
});

describe('characters the typeface lacks', () => {
  it('are replaced by U+FFFD, and named', () => {
    const font = { hasGlyphForCodePoint: (cp: number) => cp < 0x1f000 };
    expect(withReplacements('emoji 🌊 here', font)).toBe(`emoji ${REPLACEMENT} here`);
    expect(missingInBook('Wave 🌊 and 🐚, שלום, ميناء')).toEqual(['🌊', '🐚']);
  });

  it('check names each field once (a note, not a problem)', async () => {
    const dir = join(work, 'stations');
    mkdirSync(dir);
    writeFileSync(join(dir, 'stint-rock.yaml'), `id: stint-rock
name: "Stint Rock 🌊🌊 (invented)"
kind: reference
position: { latitude: 47, longitude: -16 }
timezone: UTC
datum: Chart Datum
mean_level: 2.2
constituents:
  M2: { amplitude: 1.6, phase: 130 }
  S2: { amplitude: 0.55, phase: 175 }
provenance: Invented 🐚 for the script test
`);
    const { code, stdout } = await runCli(['check', '--stations', dir]);
    expect(code).toBe(0);
    const file = join(dir, 'stint-rock.yaml');
    expect(stdout.trimEnd().split('\n')).toEqual([
      `${file}: name: note: 🌊 (U+1F30A) is not in the book's typeface; the PDF prints \uFFFD in its place`,
      `${file}: provenance: note: 🐚 (U+1F41A) is not in the book's typeface; the PDF prints \uFFFD in its place`,
      `${dir}: 1 reference port, 0 secondary ports, OK`,
    ]);
  });
});

describe.skipIf(!hasPoppler)('drawn in a PDF', () => {
  it('places right-to-left words in visual order, at the width measured, with the replacement drawn', async () => {
    const doc = createDocument({ title: 't', subject: 's', keywords: 'k', date: new Date(0), lang: 'en' });
    doc.addPage({ size: 'A5', margin: 0 });
    const lines = ['Port of שלום עולם (invented)', 'Harbour ميناء البحر 12', 'emoji 🌊 here'];
    lines.forEach((line, i) => put(doc, line, 20, 40 + 30 * i, { font: 'regular', size: 11 }));
    const file = join(work, 'script.pdf');
    writeFileSync(file, await finish(doc));
    const words = pdfWords(file).map((w) => ({ x: w.x0, y: w.y0, text: w.text }));
    const rows = lines.map((_, i) => words.filter((w) => Math.abs(w.y - (40 + 30 * i - 10)) < 6).sort((a, b) => a.x - b.x).map((w) => w.text));
    expect(rows).toEqual([
      ['Port', 'of', 'םלוע', 'םולש', '(invented)'],
      ['Harbour', '12', 'رحبلا', 'ءانيم'],
      ['emoji', REPLACEMENT, 'here'],
    ]);
  });
});
