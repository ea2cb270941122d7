// A combined volume drawn from the build cache reports what its covers found about the publisher's
// pictures (one line per picture), and a volume copied from the cache reports the same again.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cacheKey, writeEntry } from '../../cli/build/cache.js';
import { runVolumeJob, type VolumeJob, type VolumeJobDeps } from '../../cli/build/volume-job.js';
import { sampleStation, sampleYear } from '../fixtures/sample-year.js';

const dir = mkdtempSync(join(tmpdir(), 'tw-volume-job-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('runVolumeJob', () => {
  it('passes the picture warnings of the volume on, once per picture, drawn or cached', async () => {
    const cache = join(dir, 'cache');
    const model = { ...sampleYear(2027), station: { ...sampleStation, id: 'a' } };
    const stationKey = cacheKey({ station: 'a' });
    writeEntry(cache, stationKey, { 'model.json': Buffer.from(JSON.stringify(model)) }, {});
    const job: VolumeJob = { index: 0, text: { volume: 1, volumes: 1 }, stations: [{ id: 'a', key: stationKey, compact: false }],
      file: join(dir, 'vol.pdf'), key: cacheKey({ volume: 1 }) };
    let drawn = 0;
    const deps: VolumeJobDeps = {
      async renderVolume(stations, options) {
        drawn++;
        // the logo on the cover, and again (sharper) inside: one line, the blurrier placement
        options.warn?.({ file: 'logo.png', kind: 'resolution', dpi: 150, text: 'logo.png: 150 dpi' });
        options.warn?.({ file: 'logo.png', kind: 'resolution', dpi: 250, text: 'logo.png: 250 dpi' });
        return { pdf: Buffer.from('%PDF-1.7 volume'), entries: stations.map((s) => ({ id: s.model.station.id, page: 4 })) };
      },
      countPages: () => 40,
    };
    const render = { units: 'm' as const, page: 'a5' as const, imposition: 'none' as const };
    const first = await runVolumeJob(job, cache, render, deps);
    expect(first.cached).toBe(false);
    expect(first.imageWarnings?.map((w) => w.text)).toEqual(['logo.png: 150 dpi']);
    const again = await runVolumeJob(job, cache, render, deps);
    expect(again.cached).toBe(true);
    expect(drawn).toBe(1);
    expect(again.imageWarnings).toEqual(first.imageWarnings);
    expect(readFileSync(job.file, 'latin1')).toBe('%PDF-1.7 volume');
  });
});
