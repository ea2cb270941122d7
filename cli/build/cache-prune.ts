// Keeping the build cache to what the last build used. Every entry a build reads or writes has its
// entry.json touched (cli/build/cache.ts); at the end of a successful build, the entries no touch
// reached since the build started are removed, with the leftovers of interrupted writes. Two builds
// may share one cache (two output folders side by side): each leaves a marker in `builds/` while it
// runs, and a build prunes only when no other live build's marker is there (the next one will), so no
// build ever loses an entry it is about to read back.
import { existsSync, mkdirSync, readdirSync, rmdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';

const BUILDS = 'builds';
const ENTRY = 'entry.json';
const DAY_MS = 24 * 3600 * 1000;
/** Some file systems keep modification times to the second or two: touches this close before the start count. */
const CLOCK_SLACK_MS = 5000;

export interface CacheUse {
  /** True when no other build is using the cache now. */
  alone(): boolean;
  release(): void;
}

function alive(marker: string, dir: string): boolean {
  const [host, pid] = marker.split('~');
  if (host === hostname() && pid !== undefined && /^\d+$/.test(pid)) {
    try {
      process.kill(Number(pid), 0);
      return true;
    } catch (error) {
      return (error as NodeJS.ErrnoException).code === 'EPERM'; // running, as another user
    }
  }
  try {
    return Date.now() - statSync(join(dir, marker)).mtimeMs < DAY_MS; // another machine's: trusted for a day
  } catch {
    return false;
  }
}

/** Marks the cache as used by this build until `release`. */
export function useCache(cacheDir: string): CacheUse {
  const dir = join(cacheDir, BUILDS);
  const own = `${hostname().replace(/[^A-Za-z0-9.-]/g, '_')}~${process.pid}~${randomBytes(4).toString('hex')}`;
  try {
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, own), '');
  } catch {
    // a cache folder we may not write: the build says so when it writes its first entry
  }
  return {
    alone: () => {
      try {
        return readdirSync(dir).every((m) => m === own || !alive(m, dir));
      } catch {
        return false;
      }
    },
    release: () => {
      rmSync(join(dir, own), { force: true });
      for (const empty of [dir, cacheDir]) {
        try {
          rmdirSync(empty);
        } catch {
          break; // not empty: other entries or builds
        }
      }
    },
  };
}

/** Removes every entry not touched since `since` (UTC ms), stale temporary folders and dead builds' markers. */
export function pruneCache(cacheDir: string, since: number): { entries: number } {
  if (!existsSync(cacheDir)) return { entries: 0 };
  const before = since - CLOCK_SLACK_MS;
  let entries = 0;
  for (const top of readdirSync(cacheDir, { withFileTypes: true })) {
    const path = join(cacheDir, top.name);
    if (top.name === BUILDS && top.isDirectory()) {
      for (const marker of readdirSync(path)) if (!alive(marker, path)) rmSync(join(path, marker), { force: true });
    } else if (top.name.startsWith('tmp-')) {
      if (statSync(path).mtimeMs < before) rmSync(path, { recursive: true, force: true });
    } else if (top.isDirectory() && /^[0-9a-f]{2}$/.test(top.name)) {
      for (const key of readdirSync(path)) {
        let touched = 0;
        try {
          touched = statSync(join(path, key, ENTRY)).mtimeMs;
        } catch {
          // no entry.json: a half-removed entry
        }
        if (touched < before) {
          rmSync(join(path, key), { recursive: true, force: true });
          entries++;
        }
      }
      if (readdirSync(path).length === 0) rmdirSync(path);
    }
  }
  return { entries };
}
