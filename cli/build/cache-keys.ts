// What a cached station-year depends on, as one key: the station file, its reference port's file,
// the year, every render choice (and the bytes of every file one names), and the program itself (its version
// and a hash of its own code, so a changed tidewright never reuses an older one's output).
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { dirname, isAbsolute, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Station } from '../../engine/index.js';
import { cacheKey, fileHash } from './cache.js';
import type { RenderChoices } from './options.js';

let fingerprint: string | null = null;

function hashTree(hash: ReturnType<typeof createHash>, dir: string): void {
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : 1))) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) hashTree(hash, path);
    else if (/\.(js|ts|json|css|njk|md)$/.test(entry.name)) hash.update(entry.name).update(readFileSync(path));
  }
}

/** tidewright's version and the hash of its code (engine, templates, cli) and of its lock file. */
export function codeFingerprint(): string {
  if (fingerprint !== null) return fingerprint;
  let root = dirname(fileURLToPath(import.meta.url));
  while (!existsSync(join(root, 'engine')) || !existsSync(join(root, 'templates'))) {
    const up = dirname(root);
    if (up === root) break;
    root = up;
  }
  const hash = createHash('sha256');
  for (const part of ['engine', 'templates', 'cli']) if (existsSync(join(root, part))) hashTree(hash, join(root, part));
  let pkgDir = root;
  for (let i = 0; i < 3 && !existsSync(join(pkgDir, 'package.json')); i++) pkgDir = dirname(pkgDir);
  for (const file of ['package.json', 'package-lock.json']) if (existsSync(join(pkgDir, file))) hash.update(readFileSync(join(pkgDir, file)));
  fingerprint = hash.digest('hex');
  return fingerprint;
}

/** The choices with every file they name (logo, cover image, pictures of the publisher's pages) as its bytes' hash too. */
function withFileBytes(value: unknown): unknown {
  if (typeof value === 'string' && isAbsolute(value) && existsSync(value) && statSync(value).isFile()) return { path: value, bytes: fileHash(value) };
  if (Array.isArray(value)) return value.map(withFileBytes);
  if (value !== null && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, withFileBytes(v)]));
  return value;
}

function stationBytes(station: Station): string {
  return fileHash(station.sourceFile) ?? cacheKey({ loaded: station });
}

/** The key of each station-year: every input that reaches its model, its books and its downloads. */
export function stationYearKeys(stations: readonly Station[], year: number, render: RenderChoices, code: string = codeFingerprint()): Map<string, string> {
  const byId = new Map(stations.map((s) => [s.id, s]));
  const choices = withFileBytes(render);
  const keys = new Map<string, string>();
  for (const s of stations) {
    const reference = s.kind === 'secondary' ? byId.get(s.reference) : undefined;
    keys.set(s.id, cacheKey({
      what: 'station-year', code, year, id: s.id, station: stationBytes(s),
      reference: reference === undefined ? null : stationBytes(reference), render: choices,
    }));
  }
  return keys;
}
