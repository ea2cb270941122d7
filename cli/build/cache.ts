// The build cache (`.tidewright-cache/` beside the output folder): one entry per key, a folder of
// files plus `entry.json` listing each file's size and SHA-256, written last. Safety rules:
//  - an entry is used only when entry.json names this very key and every file matches its size and
//    hash; anything else (half-written, edited, from another key or another program) is ignored and
//    written again;
//  - an entry is written into a private temporary folder and renamed into place whole, so a reader
//    never sees a partial entry, and two builds writing the same key leave one whole entry;
//  - the cache only ever feeds the temporary output folder, so it can never leave out/ half-written.
//    Deleting the whole cache folder at any time costs only a full build.
import { createHash, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

export const CACHE_FOLDER = '.tidewright-cache';
const FORMAT = 'tidewright-cache-1';
const ENTRY = 'entry.json';
const KEY_PATTERN = /^[0-9a-f]{64}$/;

export interface CacheEntryFiles { [name: string]: Buffer }

interface EntryRecord {
  format: string;
  key: string;
  files: Record<string, { bytes: number; sha256: string }>;
  meta: unknown;
}

const sha256 = (data: Buffer | string): string => createHash('sha256').update(data).digest('hex');

/** A key from everything that reaches an output, written as JSON in a fixed key order. */
export function cacheKey(parts: Record<string, unknown>): string {
  return sha256(stableJson(parts));
}

function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/** The hash of a file's bytes (a station file, a logo), or of nothing when it does not exist. */
export function fileHash(path: string | undefined): string | null {
  if (path === undefined || !existsSync(path)) return null;
  return sha256(readFileSync(path));
}

/** The cache folder beside an output folder: `<parent>/.tidewright-cache`. */
export function cacheDirFor(outDir: string): string {
  return join(dirname(outDir), CACHE_FOLDER);
}

function entryDir(cacheDir: string, key: string): string {
  if (!KEY_PATTERN.test(key)) throw new Error(`not a cache key: ${JSON.stringify(key)}`);
  return join(cacheDir, key.slice(0, 2), key);
}

/** Path of one file of an entry (after `readEntry` said it is whole). */
export function entryFile(cacheDir: string, key: string, name: string): string {
  return join(entryDir(cacheDir, key), name);
}

/** Marks an entry as used now: the build's prune keeps what its build touched (cli/build/cache-prune.ts). */
function touch(path: string): void {
  const now = new Date();
  try {
    utimesSync(path, now, now);
  } catch {
    // a read-only cache: still usable, only never pruned
  }
}

/**
 * The entry's files and meta when the entry is whole and is this key's, else null. `names`: the
 * files wanted (all of them must be there).
 */
export function readEntry<Name extends string>(cacheDir: string, key: string, names: readonly Name[]): { files: Record<Name, Buffer>; meta: unknown } | null {
  const dir = entryDir(cacheDir, key);
  try {
    const record = JSON.parse(readFileSync(join(dir, ENTRY), 'utf8')) as EntryRecord;
    if (record.format !== FORMAT || record.key !== key || typeof record.files !== 'object' || record.files === null) return null;
    const files = {} as Record<Name, Buffer>; // filled with every name below, or no entry is returned
    for (const name of names) {
      const want = record.files[name];
      if (!want) return null;
      const data = readFileSync(join(dir, name));
      if (data.length !== want.bytes || sha256(data) !== want.sha256) return null;
      files[name] = data;
    }
    touch(join(dir, ENTRY));
    return { files, meta: record.meta };
  } catch {
    return null; // missing, unreadable or not JSON: a miss
  }
}

/**
 * Writes an entry whole (temporary folder, then one rename). True when the key's entry is in place
 * afterwards (this one, or an equal one another build renamed in first); throws the write's error when not.
 */
export function writeEntry(cacheDir: string, key: string, files: CacheEntryFiles, meta: unknown): boolean {
  const dir = entryDir(cacheDir, key);
  const temp = join(cacheDir, `tmp-${process.pid}-${randomBytes(6).toString('hex')}`);
  try {
    mkdirSync(temp, { recursive: true });
    const record: EntryRecord = { format: FORMAT, key, files: {}, meta };
    for (const [name, data] of Object.entries(files)) {
      if (!/^[a-z0-9.-]+$/.test(name) || name === ENTRY) throw new Error(`bad cache file name ${name}`);
      writeFileSync(join(temp, name), data);
      record.files[name] = { bytes: data.length, sha256: sha256(data) };
    }
    writeFileSync(join(temp, ENTRY), JSON.stringify(record));
    mkdirSync(dirname(dir), { recursive: true });
    rmSync(dir, { recursive: true, force: true }); // a corrupt or foreign entry of this key
    renameSync(temp, dir);
    return true;
  } catch (error) {
    // another build renamed its entry of this key first; else (a full disk, a folder we may not write) the error stands
    if (readEntry(cacheDir, key, Object.keys(files)) !== null) return true;
    throw error;
  } finally {
    rmSync(temp, { recursive: true, force: true });
  }
}
