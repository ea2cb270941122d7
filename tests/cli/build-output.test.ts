// Safe output of tidewright build: refusals before anything is written, the swap, and recovery
// from a build that died part-way.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { UsageError } from '../../engine/index.js';
import {
  commitOutput, createTemp, discardTemp, OUTPUT_MARKER, planOutput, recoverStale,
} from '../../cli/build/output.js';
import { assertSafeId, combinedBookName, stationYearFile } from '../../cli/build/paths.js';

const root = mkdtempSync(join(tmpdir(), 'tw-build-output-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));
let n = 0;
function scene(): { dir: string; stations: string } {
  const dir = join(root, `scene-${n++}`);
  const stations = join(dir, 'stations');
  mkdirSync(stations, { recursive: true });
  return { dir, stations };
}

function refusal(out: string, stations: string, cwd: string): string {
  try {
    planOutput(out, stations, cwd);
  } catch (error) {
    expect(error).toBeInstanceOf(UsageError);
    expect((error as UsageError).option).toBe('--out');
    return (error as UsageError).problem;
  }
  throw new Error(`planOutput accepted ${out}`);
}

/** The pid of a process that has certainly ended. */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))']);
  return Number(child.stdout.toString());
}

describe('planOutput refuses', () => {
  it('the root of the file system', () => {
    const { dir, stations } = scene();
    expect(refusal('/', stations, dir)).toMatch(/root of the file system/);
  });

  it('a file', () => {
    const { dir, stations } = scene();
    writeFileSync(join(dir, 'out'), 'not a folder');
    expect(refusal('out', stations, dir)).toMatch(/is a file/);
  });

  it('the stations folder, a folder holding it, or one inside it', () => {
    const { dir, stations } = scene();
    expect(refusal(stations, stations, dir)).toMatch(/is the stations folder/);
    expect(refusal(dir, stations, join(root))).toMatch(/holds the stations folder/);
    expect(refusal(join(stations, 'out'), stations, dir)).toMatch(/inside the stations folder/);
  });

  it('the working folder', () => {
    const { dir } = scene();
    const elsewhere = scene().stations;
    expect(refusal('.', elsewhere, dir)).toMatch(/holds the current folder/);
  });

  it('a folder of files tidewright did not write', () => {
    const { dir, stations } = scene();
    mkdirSync(join(dir, 'docs'));
    writeFileSync(join(dir, 'docs', 'thesis.tex'), 'precious');
    expect(refusal('docs', stations, dir)).toMatch(/did not write/);
  });
});

describe('planOutput accepts', () => {
  it('a new folder, an empty one, a previous output, and a link to one', () => {
    const { dir, stations } = scene();
    expect(planOutput('out', stations, dir, 4242)).toEqual({
      out: join(dir, 'out'), parent: dir,
      temp: join(dir, '.tidewright-tmp-out-4242'), aside: join(dir, '.tidewright-tmp-out-4242-previous'),
    });
    mkdirSync(join(dir, 'empty'));
    expect(planOutput('empty', stations, dir).out).toBe(join(dir, 'empty'));
    mkdirSync(join(dir, 'old'));
    writeFileSync(join(dir, 'old', OUTPUT_MARKER), '');
    writeFileSync(join(dir, 'old', 'index.html'), '');
    expect(planOutput('old', stations, dir).out).toBe(join(dir, 'old'));
    symlinkSync(join(dir, 'old'), join(dir, 'link'));
    expect(planOutput('link', stations, dir).out).toBe(join(dir, 'old'));
    expect(planOutput('deep/er/out', stations, dir).parent).toBe(join(dir, 'deep', 'er'));
  });
});

describe('the swap', () => {
  it('puts the new output in place and removes the old one', () => {
    const { dir, stations } = scene();
    const target = planOutput('out', stations, dir);
    createTemp(target);
    writeFileSync(join(target.temp, 'new.txt'), 'new');
    commitOutput(target);
    expect(readdirSync(join(dir, 'out')).sort()).toEqual([OUTPUT_MARKER, 'new.txt']);

    const second = planOutput('out', stations, dir);
    createTemp(second);
    writeFileSync(join(second.temp, 'newer.txt'), 'newer');
    commitOutput(second);
    expect(readdirSync(join(dir, 'out')).sort()).toEqual([OUTPUT_MARKER, 'newer.txt']);
    expect(readdirSync(dir).sort()).toEqual(['out', 'stations']);
  });

  it('a discarded build leaves the previous output as it was', () => {
    const { dir, stations } = scene();
    mkdirSync(join(dir, 'out'));
    writeFileSync(join(dir, 'out', OUTPUT_MARKER), '');
    writeFileSync(join(dir, 'out', 'keep.txt'), 'previous');
    const target = planOutput('out', stations, dir);
    createTemp(target);
    writeFileSync(join(target.temp, 'half.txt'), 'half');
    discardTemp(target);
    expect(readdirSync(dir).sort()).toEqual(['out', 'stations']);
    expect(readFileSync(join(dir, 'out', 'keep.txt'), 'utf8')).toBe('previous');
  });
});

describe('recoverStale', () => {
  it('removes the temporary folder of a dead build and keeps a running one', () => {
    const { dir, stations } = scene();
    const dead = deadPid();
    mkdirSync(join(dir, `.tidewright-tmp-out-${dead}`));
    mkdirSync(join(dir, `.tidewright-tmp-out-${process.ppid}`)); // alive: our parent
    mkdirSync(join(dir, `.tidewright-tmp-other-${dead}`)); // another output's, not ours to judge
    const notes = recoverStale(planOutput('out', stations, dir));
    expect(notes).toEqual([`removed .tidewright-tmp-out-${dead}, left by an interrupted build`]);
    expect(readdirSync(dir).sort()).toEqual(
      [`.tidewright-tmp-other-${dead}`, `.tidewright-tmp-out-${process.ppid}`, 'stations'].sort());
  });

  it('puts back a previous output left aside between the two renames', () => {
    const { dir, stations } = scene();
    const dead = deadPid();
    mkdirSync(join(dir, `.tidewright-tmp-out-${dead}-previous`));
    writeFileSync(join(dir, `.tidewright-tmp-out-${dead}-previous`, 'keep.txt'), 'previous');
    mkdirSync(join(dir, `.tidewright-tmp-out-${dead}`));
    writeFileSync(join(dir, `.tidewright-tmp-out-${dead}`, 'new.txt'), 'finished but never moved');
    recoverStale(planOutput('out', stations, dir));
    expect(readdirSync(dir).sort()).toEqual(['out', 'stations']);
    expect(readFileSync(join(dir, 'out', 'keep.txt'), 'utf8')).toBe('previous');
  });

  it('deletes an aside folder once the new output is in place', () => {
    const { dir, stations } = scene();
    const dead = deadPid();
    mkdirSync(join(dir, 'out'));
    writeFileSync(join(dir, 'out', OUTPUT_MARKER), '');
    mkdirSync(join(dir, `.tidewright-tmp-out-${dead}-previous`));
    recoverStale(planOutput('out', stations, dir));
    expect(readdirSync(dir).sort()).toEqual(['out', 'stations']);
    expect(existsSync(join(dir, 'out', OUTPUT_MARKER))).toBe(true);
  });
});

describe('file names from station ids', () => {
  it('stay inside their folder', () => {
    expect(stationYearFile('/o/pdf', 'brinewold-head', 2027, 'pdf')).toBe('/o/pdf/brinewold-head-2027.pdf');
    for (const id of ['../evil', 'a/b', '..', 'A', 'x\u0000', '', 'é']) {
      expect(() => stationYearFile('/o/pdf', id, 2027, 'pdf')).toThrow(/refusing/);
      expect(() => assertSafeId(id)).toThrow(/refusing/);
    }
  });

  it('give the combined book a name of its own', () => {
    expect(combinedBookName(undefined, ['brinewold-head'])).toBe('almanac');
    expect(combinedBookName('Brinewold Bay: Tides & Times', [])).toBe('brinewold-bay-tides-times');
    expect(combinedBookName('../../etc', [])).toBe('etc');
    expect(combinedBookName('Brinewold Head', ['brinewold-head'])).toBe('brinewold-head-all');
    expect(combinedBookName(undefined, ['almanac', 'almanac-all'])).toBe('almanac-all-all');
    expect(combinedBookName('***', [])).toBe('almanac');
  });
});
