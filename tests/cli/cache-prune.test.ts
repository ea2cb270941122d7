// Keeping the build cache bounded: at the end of a build, entries it did not read or write go, with
// stale temporary folders; nothing goes while another live build uses the same cache. And the pack a
// station-year's pages are kept in: read back as written, refused when cut, padded or escaping.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { cacheKey, entryFile, readEntry, writeEntry } from '../../cli/build/cache.js';
import { pruneCache, useCache } from '../../cli/build/cache-prune.js';
import { packFiles, unpackFiles } from '../../cli/build/site-cache.js';

let dir: string;
beforeEach(() => { dir = mkdtempSync(join(tmpdir(), 'tw-prune-')); });
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const OLD = new Date(Date.UTC(2020, 0, 1));
const keyOf = (n: number): string => cacheKey({ what: 'test', n });
function aged(key: string): void {
  writeEntry(dir, key, { 'a.pdf': Buffer.from(`%PDF ${key}`) }, null);
  utimesSync(entryFile(dir, key, 'entry.json'), OLD, OLD);
}

describe('pruning the build cache', () => {
  it('removes what the build did not touch, keeps what it read or wrote', () => {
    for (const n of [1, 2, 3]) aged(keyOf(n));
    mkdirSync(join(dir, 'tmp-123-abcdef'));
    utimesSync(join(dir, 'tmp-123-abcdef'), OLD, OLD);
    const since = Date.now();
    expect(readEntry(dir, keyOf(1), ['a.pdf'])).not.toBeNull(); // read by this build
    writeEntry(dir, keyOf(4), { 'a.pdf': Buffer.from('%PDF 4') }, null); // written by it
    expect(pruneCache(dir, since)).toEqual({ entries: 2 });
    expect(readEntry(dir, keyOf(1), ['a.pdf'])).not.toBeNull();
    expect(readEntry(dir, keyOf(4), ['a.pdf'])).not.toBeNull();
    expect(readEntry(dir, keyOf(2), ['a.pdf'])).toBeNull();
    expect(readEntry(dir, keyOf(3), ['a.pdf'])).toBeNull();
    expect(existsSync(join(dir, 'tmp-123-abcdef'))).toBe(false);
  });

  it('waits while another live build uses the cache; a dead one does not count', () => {
    const ours = useCache(dir);
    expect(ours.alone()).toBe(true);
    const other = useCache(dir); // same process: alive
    expect(ours.alone()).toBe(false);
    other.release();
    writeFileSync(join(dir, 'builds', `${hostname()}~999999999~dead`), ''); // no such process
    expect(ours.alone()).toBe(true);
    pruneCache(dir, Date.now());
    expect(readdirSync(join(dir, 'builds'))).toHaveLength(1); // the dead build's marker went
    ours.release();
    expect(existsSync(dir)).toBe(false); // nothing else was in it
  });
});

describe('the pack of a station-year\'s pages', () => {
  const files = [
    { path: 'kelpmoor-harbour/2027/index.html', data: Buffer.from('<p>year</p>') },
    { path: 'data/kelpmoor-harbour-2027.ics', data: Buffer.from('BEGIN:VCALENDAR') },
    { path: 'empty.txt', data: Buffer.alloc(0) },
  ];

  it('reads back as written', () => {
    expect(unpackFiles(packFiles(files))).toEqual(files);
  });

  it.each([
    ['cut short', (p: Buffer) => p.subarray(0, p.length - 1)],
    ['with bytes after the last file', (p: Buffer) => Buffer.concat([p, Buffer.from('x')])],
    ['without its list', () => Buffer.from('no list here')],
    ['naming a path outside the site', () => packFiles([{ path: '../escape.html', data: Buffer.from('x') }])],
    ['naming an absolute path', () => packFiles([{ path: '/etc/x', data: Buffer.from('x') }])],
  ])('is refused when %s', (_what, spoil) => {
    expect(unpackFiles(spoil(packFiles(files)))).toBeNull();
  });
});
