// Ctrl-C at moments spread over a build of a small set (a moment so early that Node itself is still
// starting, before the launcher's first line, ends the process by the signal: it is tried again later) (the long run of 50 moments over the demo is
// tests/stress/interrupt.ts, `npm run stress:interrupt`): every time exit code 130, the signal's one
// line, no crash or stack trace, no temporary folder left and no output written.
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { interruptBuild, interruptEarly, launchMs, phaseMoments } from '../stress/interrupt-run.js';

const work = mkdtempSync(join(tmpdir(), 'tw-interrupt-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const stations = join(work, 'stations');
mkdirSync(stations);
writeFileSync(join(stations, 'stint-rock.yaml'), `id: stint-rock
name: Stint Rock (invented)
kind: reference
position: { latitude: 47, longitude: -16 }
timezone: Europe/Lisbon
datum: Chart Datum
mean_level: 2.2
constituents:
  M2: { amplitude: 1.6, phase: 130 }
  S2: { amplitude: 0.55, phase: 175 }
provenance: Invented for the interrupt test
`);
writeFileSync(join(stations, 'stint-creek.yaml'), `id: stint-creek
name: Stint Creek (invented)
kind: secondary
reference: stint-rock
position: { latitude: 47.1, longitude: -16.1 }
timezone: Europe/Lisbon
datum: Chart Datum
differences:
  high_water: { springs: { time: 25, height: -0.3 }, neaps: { time: 15, height: -0.2 } }
  low_water: { springs: { time: 40, height: -0.1 }, neaps: { time: 30, height: -0.05 } }
provenance: Invented for the interrupt test
`);

describe('Ctrl-C during a build', () => {
  it('exits 130 with one line at every moment, leaving nothing behind', async () => {
    const moments = phaseMoments('stint-creek', await launchMs());
    const runs = await Promise.all(moments.map((moment, i) =>
      (moment.after ? interruptBuild : interruptEarly)(stations, join(work, `out-${i}`), moment, ['--workers', '2'])));
    for (const [i, run] of runs.entries()) {
      const what = `${run.label}: ${run.stderr}`;
      expect(run.finishedFirst, what).toBe(false);
      expect(run.signal, what).toBeNull();
      expect(run.code, what).toBe(130);
      expect(run.leftovers, what).toEqual([]);
      expect(run.stderr, what).not.toMatch(/Assertion|FATAL|internal error|\n\s+at /);
      expect(run.stderr.trim().split('\n').length, what).toBeLessThanOrEqual(1);
      expect(existsSync(join(work, `out-${i}`)), what).toBe(false);
    }
  }, 240_000);
});
