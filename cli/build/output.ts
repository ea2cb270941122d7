// Safe output: the build writes into a temporary folder beside the destination (same file system),
// then swaps it in with two renames. Until the swap, the previous output is never touched.
import { existsSync, lstatSync, mkdirSync, readdirSync, realpathSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, isAbsolute, join, parse, relative, resolve, sep } from 'node:path';
import { UsageError } from '../../engine/index.js';

/** Left in every output folder so a later build knows the folder is its own to replace. */
export const OUTPUT_MARKER = '.tidewright-output';
const MARKER_TEXT = 'This folder is written by `tidewright build` and replaced whole by the next build.\n';

// `.tidewright-tmp-` is the prefix .gitignore already ignores.
const PREFIX = '.tidewright-tmp-';
const ASIDE_SUFFIX = '-previous';

export interface OutputTarget {
  out: string; // the destination folder
  parent: string; // where the temporary and aside folders live
  temp: string; // the new output is written here
  aside: string; // the previous output waits here during the swap
}

function isInside(child: string, ancestor: string): boolean {
  const rel = relative(ancestor, child);
  return rel === '' || (rel !== '..' && !rel.startsWith(`..${sep}`) && !isAbsolute(rel));
}

function realOrResolved(path: string): string {
  if (existsSync(path)) return realpathSync(path);
  const parent = dirname(path);
  return parent === path ? path : join(realOrResolved(parent), basename(path));
}

/**
 * Checks the destination before anything is written: it must not be the file-system root, a file,
 * the stations folder (or hold it), the working folder (or hold it), or a folder of someone else's files.
 */
export function planOutput(outDir: string, stationsDir: string, cwd: string = process.cwd(), pid: number = process.pid): OutputTarget {
  const out = realOrResolved(resolve(cwd, outDir));
  const stations = realOrResolved(stationsDir);
  const here = realOrResolved(cwd);
  const fix = 'give a folder of its own, e.g. --out out';
  if (parse(out).root === out) throw new UsageError('--out', `${out} is the root of the file system`, fix);
  if (isInside(stations, out)) {
    throw new UsageError('--out', `${out} ${out === stations ? 'is' : 'holds'} the stations folder and would be replaced`, fix);
  }
  if (isInside(out, stations)) throw new UsageError('--out', `${out} is inside the stations folder ${stations}`, fix);
  if (isInside(here, out)) throw new UsageError('--out', `${out} holds the current folder and would be replaced`, fix);
  if (existsSync(out)) {
    if (!lstatSync(out).isDirectory()) throw new UsageError('--out', `${out} is a file, not a folder`, fix);
    const entries = readdirSync(out);
    if (entries.length > 0 && !entries.includes(OUTPUT_MARKER)) {
      throw new UsageError('--out', `${out} holds files that tidewright did not write, and a build replaces the whole folder`,
        'give a new or empty folder, or empty this one first');
    }
  }
  const parent = dirname(out);
  if (existsSync(parent) && !statSync(parent).isDirectory()) {
    throw new UsageError('--out', `${parent} is a file, not a folder`, fix);
  }
  const temp = join(parent, `${PREFIX}${basename(out)}-${pid}`);
  return { out, parent, temp, aside: temp + ASIDE_SUFFIX };
}

function isRunning(pid: number): boolean {
  if (pid === process.pid) return false; // a folder of ours from before this process existed
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Cleans what a build that died left behind: a temporary folder is deleted; a previous output left
 * aside between the two renames of the swap is put back if the destination is missing, else deleted.
 * Folders of builds still running are left alone. Returns one note per folder handled.
 */
export function recoverStale(target: OutputTarget): string[] {
  if (!existsSync(target.parent)) return [];
  const own = `${PREFIX}${basename(target.out)}-`;
  const notes: string[] = [];
  const names = readdirSync(target.parent).filter((name) => name.startsWith(own)).sort();
  // Restore an aside folder first, so a temp folder of the same dead build is never mistaken for output.
  names.sort((a, b) => Number(b.endsWith(ASIDE_SUFFIX)) - Number(a.endsWith(ASIDE_SUFFIX)));
  for (const name of names) {
    const match = /^(\d+)(-previous)?$/.exec(name.slice(own.length));
    if (!match || isRunning(Number(match[1]))) continue;
    const path = join(target.parent, name);
    if (match[2] && !existsSync(target.out)) {
      renameSync(path, target.out);
      notes.push(`restored ${target.out} from ${name}, left by an interrupted build`);
    } else {
      rmSync(path, { recursive: true, force: true, maxRetries: 3 });
      notes.push(`removed ${name}, left by an interrupted build`);
    }
  }
  return notes;
}

/** Makes the (empty) temporary folder, and the destination's parent folders if they are missing. */
export function createTemp(target: OutputTarget): void {
  try {
    mkdirSync(target.parent, { recursive: true });
    rmSync(target.temp, { recursive: true, force: true });
    mkdirSync(target.temp);
    writeFileSync(join(target.temp, OUTPUT_MARKER), MARKER_TEXT);
  } catch (error) {
    rmSync(target.temp, { recursive: true, force: true });
    const code = (error as NodeJS.ErrnoException).code;
    const why = code === 'EACCES' || code === 'EPERM' ? 'no permission' : code === 'EROFS' ? 'a read-only disk' : code === 'ENOSPC' ? 'the disk is full' : code ?? 'error';
    throw new UsageError('--out', `${target.out} cannot be written: nothing can be made in ${target.parent} (${why})`,
      'give a folder you may write to, e.g. --out out');
  }
}

/**
 * Moves the finished output into place. Synchronous on purpose: no signal handler can run between the
 * two renames. If the second rename fails the previous output goes back where it was.
 */
export function commitOutput(target: OutputTarget): void {
  const hadPrevious = existsSync(target.out);
  if (hadPrevious) renameSync(target.out, target.aside);
  try {
    renameSync(target.temp, target.out);
  } catch (err) {
    if (hadPrevious) renameSync(target.aside, target.out);
    throw err;
  }
  if (hadPrevious) rmSync(target.aside, { recursive: true, force: true, maxRetries: 3 });
}

/** Removes the temporary folder of a build that failed; the destination is not touched. */
export function discardTemp(target: OutputTarget): void {
  rmSync(target.temp, { recursive: true, force: true, maxRetries: 3 });
}
