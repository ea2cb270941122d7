// A small share of the seeded fuzz run (the full run of 1,000 or more, through check and a real build,
// is tests/stress/fuzz.ts, `npm run stress:fuzz`): damaged demo station files through check, in this
// process; each must be refused in one-line problems or pass, and a few that pass are built into a
// station-year and its book. A failure names the seed and the mutant, so it can be repeated.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildStationYear } from '../../engine/index.js';
import { renderStationBook } from '../../templates/pdf/book.js';
import { checkMutant, demoFiles, describeMutant, mutant, MUTATIONS } from '../stress/fuzz-run.js';

const SEED = 17;
const COUNT = 120;
const BUILDS = 2;

const work = mkdtempSync(join(tmpdir(), 'tw-fuzz-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('damaged station files', () => {
  it(`${COUNT} seeded mutations (seed ${SEED}) are refused in one line each or pass and build`, async () => {
    const files = demoFiles();
    const kinds = new Set<string>();
    let refused = 0;
    let built = 0;
    for (let i = 0; i < COUNT; i++) {
      const m = mutant(SEED, i, files);
      m.kinds.forEach((k) => kinds.add(k));
      const where = describeMutant(SEED, m);
      let verdict;
      try {
        verdict = checkMutant(m, files, join(work, 'set'));
      } catch (error) {
        throw new Error(`${where}: check failed: ${error instanceof Error ? error.stack : String(error)}`);
      }
      if (verdict.outcome === 'refused') {
        refused++;
        expect(verdict.lines.length, where).toBeGreaterThan(0);
        continue;
      }
      if (built >= BUILDS) continue;
      const station = verdict.stations.find((s) => s.sourceFile?.endsWith(m.base))!;
      const model = buildStationYear(station, { byId: new Map(verdict.stations.map((s) => [s.id, s])) }, 2027);
      const pdf = await renderStationBook(model, { units: 'm', page: 'a5', imposition: 'none' });
      expect(pdf.subarray(0, 5).toString(), where).toBe('%PDF-');
      built++;
    }
    expect([...kinds].sort()).toEqual(Object.keys(MUTATIONS).sort());
    expect(refused).toBeGreaterThan(COUNT / 2);
  }, 120_000);
});
