// `tidewright build` end to end, spawning the compiled CLI (worker threads need the compiled JS):
// broken station sets refused with file and field, an interrupted build, hostile station text shown
// as text, byte-identical rebuilds, and the exit codes.
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  copyFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { itemAt } from '../../engine/index.js';

const ROOT = join(import.meta.dirname, '..', '..');
const BIN = join(ROOT, 'bin', 'tidewright.js');
const DEMO = join(ROOT, 'stations-demo');
const work = mkdtempSync(join(tmpdir(), 'tw-build-cli-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const hasPdftotext = spawnSync('pdftotext', ['-v']).error === undefined;
if (!hasPdftotext) console.warn('build.test.ts: pdftotext (poppler-utils) not found: the PDF half of the escaping test is skipped');

interface Run { code: number | null; stdout: string; stderr: string }

// Eleventy warns on stderr when one of the site's filters took much of its time, even in quiet mode;
// that line is the site renderer's to silence, so it is set aside here rather than failing every check.
const ELEVENTY_TIMING = /^\[11ty\] Benchmark .*\n?/gm;

function tidewright(args: string[], cwd = work): Run {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', timeout: 240_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr.replace(ELEVENTY_TIMING, '') };
}

/** Every file under dir (relative path → sha256), and every folder, so any change at all shows. */
function treeHash(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      const p = join(d, name);
      const rel = relative(dir, p);
      if (statSync(p).isDirectory()) {
        out[`${rel}/`] = 'folder';
        walk(p);
      } else {
        out[rel] = createHash('sha256').update(readFileSync(p)).digest('hex');
      }
    }
  };
  walk(dir);
  return out;
}

let n = 0;
/** A small station set: the demo's Brinewold Head and its secondary port Saltgrist Cove, as given or edited. */
function stationSet(edit: (dir: string) => void = () => {}): string {
  const dir = join(work, `stations-${n++}`);
  mkdirSync(dir);
  copyFileSync(join(DEMO, 'brinewold-head.yaml'), join(dir, 'brinewold-head.yaml'));
  copyFileSync(join(DEMO, 'saltgrist-cove.yaml'), join(dir, 'saltgrist-cove.yaml'));
  edit(dir);
  return dir;
}

function editFile(file: string, from: RegExp, to: string): void {
  const text = readFileSync(file, 'utf8');
  if (!from.test(text)) throw new Error(`${from} not in ${file}`);
  writeFileSync(file, text.replace(from, to));
}

const HOSTILE = '<script>alert(1)</script> & Saltgrist Cove (invented)';
const HOSTILE_PROVENANCE = 'Invented <img src=x onerror=alert(2)> & not real';
const hostileSet = (dir: string): void => {
  editFile(join(dir, 'saltgrist-cove.yaml'), /^name: .*$/m, `name: "${HOSTILE}"`);
  editFile(join(dir, 'saltgrist-cove.yaml'), /^provenance: .*$/m, `provenance: "${HOSTILE_PROVENANCE}"`);
};

// One good build shared by several checks: the output a broken build must leave alone.
let goodStations: string;
let goodOut: string;
let goodRun: Run;
let goodHash: Record<string, string>;

beforeAll(() => {
  execFileSync('npx', ['tsc', '-p', 'tsconfig.build.json'], { cwd: ROOT, stdio: 'ignore' });
  goodStations = stationSet(hostileSet);
  goodOut = join(work, 'good', 'out');
  goodRun = tidewright(['build', '--stations', goodStations, '--out', goodOut, '--year', '2027']);
  goodHash = existsSync(goodOut) ? treeHash(goodOut) : {};
}, 300_000);

function tempFoldersBeside(out: string): string[] {
  return readdirSync(join(out, '..')).filter((name) => name.startsWith('.tidewright-tmp-'));
}

describe('a good build', () => {
  it('exits 0 with a one-line summary and writes the site, the books and the downloads', () => {
    expect(goodRun.stderr).toBe('');
    expect(goodRun.code).toBe(0);
    expect(goodRun.stdout).toMatch(/^built 2 stations for 2027: \d+ web pages, \d+ PDF pages, \d+ files \([\d.]+ MiB\) in \d+:\d\d with \d workers? → .*out\/\n$/);
    const files = Object.keys(goodHash);
    for (const f of ['pdf/brinewold-head-2027.pdf', 'pdf/brinewold-head-2027-pocket.pdf', 'pdf/saltgrist-cove-2027.pdf', 'pdf/almanac-2027.pdf', 'site/index.html',
      'site/data/brinewold-head-2027.ics', 'site/data/saltgrist-cove-2027-events.csv', 'site/data/saltgrist-cove-2027-events.json']) {
      expect(files).toContain(f);
    }
    // The downloads exist once, inside the site its pages link from.
    expect(files.filter((f) => f.endsWith('saltgrist-cove-2027-events.csv'))).toEqual(['site/data/saltgrist-cove-2027-events.csv']);
    expect(tempFoldersBeside(goodOut)).toEqual([]);
  });

  it('shows station text holding HTML and script as text on every web page that prints it', () => {
    const pages = Object.keys(goodHash).filter((f) => f.endsWith('.html'));
    let names = 0;
    let provenances = 0;
    for (const page of pages) {
      const html = readFileSync(join(goodOut, page), 'utf8');
      expect(html, page).not.toContain('<script>alert(1)');
      expect(html, page).not.toContain('<img src=x');
      if (html.includes('&lt;script&gt;alert(1)&lt;/script&gt; &amp; Saltgrist Cove')) names++;
      if (html.includes('Invented &lt;img src=x onerror=alert(2)&gt; &amp; not real')) provenances++;
    }
    expect(names).toBeGreaterThan(0);
    expect(provenances).toBeGreaterThan(0);
  });

  it.skipIf(!hasPdftotext)('prints the same texts literally in the PDF books', () => {
    for (const book of ['saltgrist-cove-2027.pdf', 'saltgrist-cove-2027-pocket.pdf', 'almanac-2027.pdf']) {
      const text = execFileSync('pdftotext', [join(goodOut, 'pdf', book), '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
      expect(text, book).toContain('<script>alert(1)</script> & Saltgrist Cove');
      expect(text, book).toContain(HOSTILE_PROVENANCE);
    }
  });

  it('is byte-identical when built again into another folder', () => {
    const again = join(work, 'again', 'out');
    const run = tidewright(['build', '--stations', goodStations, '--out', again, '--year', '2027', '--quiet', '--workers', '1']);
    expect(run).toEqual({ code: 0, stdout: '', stderr: '' });
    expect(treeHash(again)).toEqual(goodHash);
  });
});

describe('a broken station set', () => {
  const faults: [string, (dir: string) => void, RegExp][] = [
    ['YAML syntax', (d) => writeFileSync(join(d, 'palmsward-reach.yaml'), 'id: palmsward-reach\nname: [Palmsward Reach\nkind: reference\n'),
      /palmsward-reach\.yaml: line \d+, column \d+: YAML syntax error/],
    ['an unknown constituent', (d) => editFile(join(d, 'brinewold-head.yaml'), /^ {2}M8: /m, '  MX8: '),
      /brinewold-head\.yaml: constituents\.MX8: .*not a constituent/],
    ['an unknown time zone', (d) => editFile(join(d, 'brinewold-head.yaml'), /^timezone: .*$/m, 'timezone: Europe/Lisbn'),
      /brinewold-head\.yaml: timezone: .*Europe\/Lisbn.*did you mean Europe\/Lisbon/],
    ['a duplicate id', (d) => copyFileSync(join(d, 'brinewold-head.yaml'), join(d, 'brinewold-head-copy.yaml')),
      /brinewold-head(-copy)?\.yaml: id: "brinewold-head" is also the id of .*brinewold-head(-copy)?\.yaml/],
    ['a missing reference port', (d) => editFile(join(d, 'saltgrist-cove.yaml'), /^reference: .*$/m, 'reference: brinewold-hed'),
      /saltgrist-cove\.yaml: reference: .*"brinewold-hed".*did you mean brinewold-head/],
    ['an id with path characters', (d) => editFile(join(d, 'saltgrist-cove.yaml'), /^id: .*$/m, 'id: ../evil'),
      /saltgrist-cove\.yaml: id: "\.\.\/evil" may only hold lower-case letters/],
  ];

  it.each(faults)('(%s) is refused with file and field, exit 1, and the previous output untouched', (_fault, edit, message) => {
    const run = tidewright(['build', '--stations', stationSet(edit), '--out', goodOut]);
    expect(run.code).toBe(1);
    expect(run.stdout).toBe('');
    expect(run.stderr).toMatch(message);
    const lines = run.stderr.trimEnd().split('\n');
    expect(lines.at(-1)).toMatch(/^tidewright: build failed: \d+ problems? in the station files; nothing was written$/);
    expect(run.stderr).not.toMatch(/\n\s+at /); // no stack trace
    expect(treeHash(goodOut)).toEqual(goodHash);
    expect(tempFoldersBeside(goodOut)).toEqual([]);
  });

  it('lists every problem, not only the first', () => {
    const run = tidewright(['build', '--stations', stationSet((d) => {
      itemAt(faults, 2, 'faults')[1](d);
      itemAt(faults, 4, 'faults')[1](d);
    }), '--out', goodOut]);
    expect(run.code).toBe(1);
    expect(run.stderr).toMatch(itemAt(faults, 2, 'faults')[2]);
    expect(run.stderr).toMatch(itemAt(faults, 4, 'faults')[2]);
    expect(run.stderr).toMatch(/2 problems in the station files/);
  });
});

describe('bad options', () => {
  it.each([
    [['--out', '/'], /--out: \/ is the root of the file system/],
    [['--year', 'next'], /--year: "next" is not a year from 1970 to 2100/],
    [['--page', 'b5'], /--page: "b5" is not one of/],
  ])('%j exits 1 with one line', (args, message) => {
    const run = tidewright(['build', '--stations', goodStations, ...args]);
    expect(run.code).toBe(1);
    expect(run.stderr).toMatch(message);
    expect(run.stderr.trimEnd().split('\n')).toHaveLength(1);
  });

  it('refuses to write over the stations folder', () => {
    const run = tidewright(['build', '--stations', goodStations, '--out', goodStations]);
    expect(run.code).toBe(1);
    expect(run.stderr).toMatch(/is the stations folder/);
    expect(readdirSync(goodStations).sort()).toEqual(['brinewold-head.yaml', 'saltgrist-cove.yaml']);
  });
});

describe('a full disk', () => {
  // A 3 MiB file system of our own (tmpfs) stands in for a full disk; mounting needs root, so the test
  // is skipped, visibly, where that is not allowed.
  const disk = join(work, 'small-disk');
  mkdirSync(disk);
  const mounted = spawnSync('mount', ['-t', 'tmpfs', '-o', 'size=3m', 'tmpfs', disk]).status === 0;
  if (!mounted) console.warn('build.test.ts: cannot mount a small tmpfs here (needs root): the full-disk test is skipped');
  afterAll(() => { if (mounted) spawnSync('umount', [disk]); });

  it.skipIf(!mounted)('fails with exit 2 naming the cause, and leaves the previous output and no temporary folder', () => {
    const out = join(disk, 'out');
    mkdirSync(out);
    writeFileSync(join(out, '.tidewright-output'), '');
    writeFileSync(join(out, 'index.html'), 'previous');
    const before = treeHash(out);
    const run = tidewright(['build', '--stations', goodStations, '--out', out]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^tidewright: build failed: .*no space left on the disk.*; .*out\/ is as it was before\n$/);
    expect(treeHash(out)).toEqual(before);
    // beside out/ only the build cache may stay (whole entries only, never a half-written one)
    expect(readdirSync(disk).filter((name) => name !== '.tidewright-cache')).toEqual(['out']);
    const cache = join(disk, '.tidewright-cache');
    if (existsSync(cache)) expect(readdirSync(cache).filter((name) => name.startsWith('tmp-'))).toEqual([]);
  });
});

describe('an interrupted build', () => {
  it('exits 130 on SIGINT, removes its temporary folder and leaves the previous output as it was', async () => {
    const child = spawn(process.execPath, [BIN, 'build', '--stations', goodStations, '--out', goodOut, '--year', '2027'],
      { cwd: work, stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => { stderr += chunk.toString(); });
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    const temp = join(goodOut, '..', `.tidewright-tmp-out-${child.pid}`);
    const deadline = Date.now() + 60_000;
    while (!existsSync(temp) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 10));
    expect(existsSync(temp)).toBe(true);
    await new Promise((r) => setTimeout(r, 150)); // let it start writing
    child.kill('SIGINT');
    expect(await exited).toBe(130);
    expect(stderr).toMatch(/build interrupted \(SIGINT\); .*out\/ is as it was before/);
    expect(tempFoldersBeside(goodOut)).toEqual([]);
    expect(treeHash(goodOut)).toEqual(goodHash);
  });
});
