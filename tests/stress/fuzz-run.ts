// Seeded mutations of the demo station files (whatever stations-demo/ holds when this runs) and the
// verdict on each: `check` must answer with one-line problems or pass, and a file that passes must
// build. Shared by the quick test (tests/cli/fuzz.test.ts) and the full run (tests/stress/fuzz.ts).
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { entryOf, itemAt, loadStationSet, TidewrightError, type Station } from '../../engine/index.js';
import { checkStations } from '../../cli/check.js';

const ROOT = join(import.meta.dirname, '..', '..').replace(/[\\/]dist$/, '');
export const DEMO = join(ROOT, 'stations-demo');

/** mulberry32: small, seeded, the same sequence everywhere. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Random = () => number;
const pick = <T>(random: Random, list: readonly T[]): T => itemAt(list, Math.floor(random() * list.length), 'list');
const int = (random: Random, below: number): number => Math.floor(random() * below);

const VALUE = /^(\s*[A-Za-z0-9_]+:\s*)([^\s{#][^#\n]*?)\s*$/gm;
const NUMBER = /-?\d+(\.\d+)?/g;
const KEY = /^(\s*)([A-Za-z_][A-Za-z0-9_]*):/gm;

function replaceNth(text: string, pattern: RegExp, pickIndex: (count: number) => number, make: (match: RegExpExecArray) => string): string {
  const matches = [...text.matchAll(pattern)];
  if (matches.length === 0) return text;
  const m = itemAt(matches, pickIndex(matches.length), 'matches') as RegExpExecArray;
  return text.slice(0, m.index) + make(m) + text.slice(m.index + m[0].length);
}

const TYPES = ['[]', '{}', '"text"', '42', 'true', 'null', '~', '[1, 2]', '{ a: 1 }', '.nan', '.inf', '-.inf', '""', "'  '", '2027-01-01', '!!binary aGVsbG8='];
const HUGE = ['1e308', '-1e308', '1e400', '-1e400', '9007199254740993', '0x7fffffffffffffff', '-0', '1e-320', '123456789012345678901234567890', '.5e999'];
const INSERTS = ['\u0000', '\u202e', '\ud83c\udf0a', '\t', '\r', '"', "'", ':', '- ', '&a ', '*a', '!!str ', '---\n', '? ', '%YAML 1.2\n', '\ufeff'];

/** The kinds of damage, each a function of the text and the random source. */
export const MUTATIONS: Readonly<Record<string, (text: string, random: Random) => string>> = {
  'byte flip': (text, random) => {
    const bytes = Buffer.from(text, 'utf8');
    for (let i = 1 + int(random, 3); i > 0; i--) { const at = int(random, bytes.length); bytes[at] = itemAt(bytes, at, 'bytes') ^ (1 << int(random, 8)); }
    return bytes.toString('utf8');
  },
  truncation: (text, random) => text.slice(0, int(random, text.length)),
  'key swap': (text, random) => {
    const keys = [...text.matchAll(KEY)].map((m) => itemAt(m, 2, 'm'));
    if (keys.length < 2) return text;
    const [a, b] = [pick(random, keys), pick(random, keys)];
    return text.replace(KEY, (all, indent: string, key: string) => (key === a ? `${indent}${b}:` : key === b ? `${indent}${a}:` : all));
  },
  'type swap': (text, random) => replaceNth(text, VALUE, (n) => int(random, n), (m) => `${m[1]}${pick(random, TYPES)}`),
  'huge number': (text, random) => replaceNth(text, NUMBER, (n) => int(random, n), () => pick(random, HUGE)),
  'deep nesting': (text, random) => {
    const depth = 50 + int(random, 5000);
    const nest = random() < 0.5 ? `${'['.repeat(depth)}1${']'.repeat(depth)}` : `${'{ a: '.repeat(depth)}1${' }'.repeat(depth)}`;
    return replaceNth(text, VALUE, (n) => int(random, n), (m) => `${m[1]}${nest}`);
  },
  'long text': (text, random) => replaceNth(text, VALUE, (n) => int(random, n), (m) => `${m[1]}${'x'.repeat(1000 + int(random, 200_000))}`),
  'line shuffle': (text, random) => {
    const lines = text.split('\n');
    const i = int(random, lines.length);
    const choice = int(random, 3);
    if (choice === 0) lines.splice(i, 0, itemAt(lines, int(random, lines.length), 'lines')); // duplicated
    else if (choice === 1) lines.splice(i, 1); // deleted
    else lines[i] = `${' '.repeat(int(random, 6))}${itemAt(lines, i, 'lines').trimStart()}`; // re-indented
    return lines.join('\n');
  },
  insertion: (text, random) => { const at = int(random, text.length + 1); return text.slice(0, at) + pick(random, INSERTS) + text.slice(at); },
  'alias bomb': (text) => `${text}\nx0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n${Array.from({ length: 9 }, (_, i) => `x${i + 1}: &a${i + 1} [${Array(9).fill(`*a${i}`).join(', ')}]`).join('\n')}\n`,
};
const KINDS = Object.keys(MUTATIONS);

export interface Mutant {
  index: number;
  base: string; // the demo file it was made from
  kinds: string[];
  text: string;
}

/** The demo files, read now (so a changed demo is fuzzed as it is). */
export function demoFiles(dir = DEMO): { name: string; text: string }[] {
  return readdirSync(dir).filter((n) => /\.ya?ml$/.test(n) && n !== 'tidewright.yaml').sort()
    .map((name) => ({ name, text: readFileSync(join(dir, name), 'utf8') }));
}

/** Mutant number `index` of the run with `seed`: the same every time for the same demo files. */
export function mutant(seed: number, index: number, files: readonly { name: string; text: string }[]): Mutant {
  const random = seeded((seed * 1_000_003 + index) >>> 0);
  const base = pick(random, files);
  const kinds = Array.from({ length: 1 + int(random, 3) }, () => pick(random, KINDS));
  let text = base.text;
  for (const kind of kinds) text = entryOf(MUTATIONS, kind, 'MUTATIONS')(text, random);
  return { index, base: base.name, kinds, text };
}

export interface Verdict {
  outcome: 'refused' | 'passed';
  lines: string[];
  stations: Station[]; // the set that passed (empty when refused)
}

/**
 * Writes the mutant into `dir` beside the demo file it names as its reference port (if any), and runs
 * check on that set. Throws if check fails in any way other than one-line problems.
 */
export function checkMutant(m: Mutant, files: readonly { name: string; text: string }[], dir: string): Verdict {
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, m.base), m.text);
  const original = parse(files.find((f) => f.name === m.base)!.text) as { reference?: string };
  const reference = files.find((f) => original.reference !== undefined && (parse(f.text) as { id?: string }).id === original.reference);
  if (reference && reference.name !== m.base) writeFileSync(join(dir, reference.name), reference.text);
  let report;
  try {
    report = checkStations(dir);
  } catch (error) {
    if (error instanceof TidewrightError) return { outcome: 'refused', lines: [error.message], stations: [] };
    throw error;
  }
  const lines = report.problems.map((p) => p.message);
  for (const line of lines) {
    if (line.includes('\n') || line.length > 2000) throw new Error(`check printed a line ${line.length} characters long or broken: ${line.slice(0, 200)}`);
  }
  if (lines.length > 0) return { outcome: 'refused', lines, stations: [] };
  return { outcome: 'passed', lines: [], stations: loadStationSet(dir).stations };
}

export function describeMutant(seed: number, m: Mutant): string {
  return `seed ${seed}, mutant ${m.index} (${m.kinds.join(' + ')} of ${m.base})`;
}
