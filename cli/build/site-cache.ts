// A station-year's website pages and downloads kept in the build cache, so a rebuild draws only the
// pages whose inputs changed. The key: the station-year's own key (station file, reference port's
// file, year, every render choice, tidewright's code), what its pages show of the site as a whole
// and of the other station-years (templates/site/render.ts: StationPageKey), and the bytes of the
// publisher's site/ templates. The files are packed into one cache file: a JSON list of
// [path, bytes], a newline, then the bytes one after another.
import { readdirSync } from 'node:fs';
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { dirname, join, relative } from 'node:path';
import type { StationPageKey, StationPageStore } from '../../templates/site/render.js';
import type { StationYearSummary } from '../../templates/site/summary.js';
import { cacheKey, fileHash, readEntry, writeEntry } from './cache.js';
import { messageOf } from './failure.js';

const PACK = 'pages.pack';
const SAFE_PATH = /^(?!\/)(?!.*(?:^|\/)\.\.?(?:\/|$))[A-Za-z0-9._\/-]+$/;

export function packFiles(files: readonly { path: string; data: Buffer }[]): Buffer {
  const head = Buffer.from(`${JSON.stringify(files.map((f) => [f.path, f.data.length]))}\n`);
  return Buffer.concat([head, ...files.map((f) => f.data)]);
}

/** The files of a pack, or null when it is not one (every path relative and inside the site, every length right). */
export function unpackFiles(pack: Buffer): { path: string; data: Buffer }[] | null {
  const end = pack.indexOf(0x0a);
  if (end < 0) return null;
  let list: unknown;
  try {
    list = JSON.parse(pack.subarray(0, end).toString('utf8'));
  } catch {
    return null;
  }
  if (!Array.isArray(list)) return null;
  const files: { path: string; data: Buffer }[] = [];
  let at = end + 1;
  for (const item of list as unknown[]) {
    if (!Array.isArray(item) || typeof item[0] !== 'string' || !SAFE_PATH.test(item[0]) || !Number.isInteger(item[1]) || item[1] < 0) return null;
    const bytes = item[1] as number;
    if (at + bytes > pack.length) return null;
    files.push({ path: item[0], data: pack.subarray(at, at + bytes) });
    at += bytes;
  }
  return at === pack.length ? files : null;
}

/** The hash of every file of a folder (a publisher's site/ templates), or null without one. */
function folderHash(dir: string | undefined): string | null {
  if (dir === undefined) return null;
  const files = readdirSync(dir, { withFileTypes: true, recursive: true }).filter((e) => e.isFile())
    .map((e) => join(e.parentPath, e.name)).sort();
  return cacheKey({ files: files.map((f) => [relative(dir, f), fileHash(f)]) });
}

/**
 * The build's store of station-year pages. `keyOf`: a station-year's own cache key (none: its pages
 * are drawn and not kept). `used`: every key this build reads or writes is added to it.
 */
export function sitePageStore(cacheDir: string, keyOf: (id: string, year: number) => string | undefined,
  theme: string | undefined, used?: Set<string>): StationPageStore {
  const themeHash = folderHash(theme);
  const pageKey = (sy: StationYearSummary, key: StationPageKey): string | undefined => {
    const own = keyOf(sy.station.id, sy.year);
    return own === undefined ? undefined : cacheKey({ what: 'station-pages', stationYear: own, shared: key.shared, page: key.page, theme: themeHash });
  };
  return {
    async restore(sy, key, siteDir) {
      const k = pageKey(sy, key);
      if (k === undefined) return false;
      const hit = readEntry(cacheDir, k, [PACK]);
      const pack = hit?.files[PACK];
      const files = pack ? unpackFiles(pack) : null;
      if (!files) return false; // missing, corrupt or not ours: drawn again, and kept again
      for (const f of files) {
        await mkdir(dirname(join(siteDir, f.path)), { recursive: true });
        await writeFile(join(siteDir, f.path), f.data);
      }
      used?.add(k);
      return true;
    },
    async store(sy, key, paths, siteDir) {
      const k = pageKey(sy, key);
      if (k === undefined) return;
      const files = await Promise.all(paths.map(async (path) => ({ path, data: await readFile(join(siteDir, path)) })));
      try {
        writeEntry(cacheDir, k, { [PACK]: packFiles(files) }, null);
      } catch (error) {
        throw new Error(`could not write the build cache in ${cacheDir}: ${messageOf(error)}; check the disk has space and the folder is writable`);
      }
      used?.add(k);
    },
  };
}
