// The website is rendered in batches of station-years so memory stays flat for large sets; the batching
// must never change a byte of the output.
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { renderSite } from '../../templates/site/render.js';
import { demoModels } from './site-build.js';

const tmp = mkdtempSync(join(tmpdir(), 'tidewright-site-batches-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

function tree(dir: string): Map<string, string> {
  const files = new Map<string, string>();
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (!entry.isFile()) continue;
    const path = join(entry.parentPath, entry.name);
    files.set(relative(dir, path), readFileSync(path).toString('base64'));
  }
  return files;
}

it('one station-year per Eleventy run writes exactly the files of a single run', async () => {
  const models = demoModels(['brinewold-head', 'saltgrist-cove', 'palmsward-reach']);
  const whole = join(tmp, 'whole');
  const batched = join(tmp, 'batched');
  await renderSite(models, whole, { units: 'm', quiet: true });
  await renderSite(models, batched, { units: 'm', quiet: true, stationYearsPerRun: 1 });
  const a = tree(whole);
  const b = tree(batched);
  expect([...b.keys()].sort()).toEqual([...a.keys()].sort());
  for (const [path, bytes] of a) expect(b.get(path), path).toBe(bytes);
  expect(a.size).toBeGreaterThan(3 * 13);
});
