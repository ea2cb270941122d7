// Where things are: the project root (for templates/ and .eleventy.js, from source or from dist/) and
// relative links between pages, so the site works uploaded under any folder or opened from disk.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The folder holding tidewright's package.json, found upward from this file (works from dist/ too). */
export function projectRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const pkg = join(dir, 'package.json');
    if (existsSync(pkg)) {
      const name = (JSON.parse(readFileSync(pkg, 'utf8')) as { name?: string }).name;
      if (name === 'tidewright') return dir;
    }
    const up = dirname(dir);
    if (up === dir) throw new Error('tidewright: cannot find the project folder (package.json) above templates/site');
    dir = up;
  }
}

/**
 * A link from the page at `fromUrl` to the site path `to` (both root-relative, e.g. "/brinewold-head/2027/").
 * Folder targets get an explicit index.html so links also work when the site is opened from disk.
 */
export function relativeUrl(to: string, fromUrl: string): string {
  const fromParts = fromUrl.split('/').filter(Boolean);
  if (!fromUrl.endsWith('/')) fromParts.pop(); // a file page: links are relative to its folder
  const target = to.endsWith('/') ? `${to}index.html` : to;
  const targetParts = target.split('/').filter(Boolean);
  let common = 0;
  while (common < fromParts.length && common < targetParts.length - 1 && fromParts[common] === targetParts[common]) {
    common++;
  }
  const ups = fromParts.length - common;
  return `${'../'.repeat(ups)}${targetParts.slice(common).join('/')}`;
}
