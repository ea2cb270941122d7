// The books are written without node's zlib: its native handles abort the process when a worker
// thread is stopped in the middle of a call (Ctrl-C during a build), so PDF writing must not use them.
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildStationYear, loadStationSet } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';

// the module object itself, which pdfkit and every other library share
const patched = createRequire(import.meta.url)('node:zlib') as Record<string, unknown>;
const originals = new Map<string, unknown>();
const calls: string[] = [];

beforeAll(() => {
  for (const [name, value] of Object.entries(patched)) {
    const slot = Object.getOwnPropertyDescriptor(patched, name);
    if (typeof value !== 'function' || !slot?.writable) continue;
    originals.set(name, value);
    patched[name] = (...args: unknown[]) => { calls.push(name); return (value as (...a: unknown[]) => unknown)(...args); };
  }
});
afterAll(() => { for (const [name, value] of originals) patched[name] = value; });

describe('PDF writing', () => {
  it('compresses a whole book without calling node\u2019s zlib', async () => {
    for (const name of ['deflateSync', 'deflate', 'inflate', 'inflateSync']) expect(originals.has(name)).toBe(true);
    const set = loadStationSet('stations-demo');
    const model = buildStationYear(set.byId.get('brinewold-head')!, set, 2027);
    const pdf = await renderStationBook(model, { units: 'm', page: 'a6' });
    expect(pdf.subarray(0, 8).toString('latin1')).toBe('%PDF-1.7');
    expect(pdf.toString('latin1')).toMatch(/\/Filter \/FlateDecode/);
    expect(calls).toEqual([]);
  });
});
