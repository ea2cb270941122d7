// The files `analyse` and `differences` write (--output, --report). Every target is checked before
// anything is written: it is never one of the run's own inputs, never a folder, never an existing file
// unless --force, and no two targets are the same file. Each is written to a temporary file in the same
// folder and renamed into place, so a reader never sees half a file and a failure leaves nothing behind.
import { existsSync, mkdirSync, realpathSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { UsageError } from '../engine/index.js';

export interface OutputFile {
  option: string; // e.g. --output, named in every error
  path: string;
  text: string;
}

/** The path with symbolic links resolved as far as the path exists, so two names of one file compare equal. */
function realOrResolved(path: string): string {
  const absolute = resolve(path);
  if (existsSync(absolute)) return realpathSync(absolute);
  const parent = dirname(absolute);
  return parent === absolute ? absolute : join(realOrResolved(parent), basename(absolute));
}

function nearestExisting(path: string): string {
  const parent = dirname(path);
  return existsSync(path) || parent === path ? path : nearestExisting(parent);
}

function errnoProblem(error: unknown, what: string): string {
  const code = (error as { code?: string }).code;
  if (code === 'EACCES' || code === 'EPERM' || code === 'EROFS') return `${what} cannot be written (no permission)`;
  if (code === 'ENOTDIR') return `${what}: part of the path is a file, not a folder`;
  if (code === 'ENOSPC') return `${what} cannot be written (the disk is full)`;
  return `${what} cannot be written (${code ?? 'error'})`;
}

/** Refuses, with one UsageError, any target that would lose data; nothing is written. */
export function checkOutputFiles(outputs: readonly OutputFile[], inputs: readonly string[], force: boolean): void {
  const inputPaths = new Map(inputs.map((input) => [realOrResolved(input), input]));
  const seen = new Map<string, string>();
  for (const { option, path } of outputs) {
    if (/[\\/]$/.test(path)) {
      throw new UsageError(option, `${path} names a folder`, `give a file name, e.g. ${option} ${join(path, option === '--report' ? 'report.html' : 'station.yaml')}`);
    }
    const real = realOrResolved(path);
    const input = inputPaths.get(real);
    if (input !== undefined) {
      throw new UsageError(option, `${path} is ${input === path ? 'an input' : `the input ${input}`} of this run and would be overwritten`, `give ${option} a new file name`);
    }
    const other = seen.get(real);
    if (other !== undefined) throw new UsageError(option, `${path} is also the file of ${other}`, `give ${option} a file name of its own`);
    seen.set(real, option);
    const folder = nearestExisting(dirname(real));
    if (!statSync(folder).isDirectory()) {
      throw new UsageError(option, `${path}: ${folder} is a file, not a folder`, `give ${option} a file in a folder`);
    }
    if (!existsSync(real)) continue;
    if (statSync(real).isDirectory()) {
      throw new UsageError(option, `${path} is a folder`, `give a file name, e.g. ${option} ${join(path, option === '--report' ? 'report.html' : 'station.yaml')}`);
    }
    if (!force) throw new UsageError(option, `${path} exists already`, 'give a new file name, or add --force to replace it');
  }
}

/** Writes each file through a temporary file and a rename; a failure removes the temporary file. */
export function writeOutputFiles(outputs: readonly OutputFile[]): void {
  for (const { option, path, text } of outputs) {
    const folder = dirname(resolve(path));
    const temporary = join(folder, `.${basename(path)}.${process.pid}.tidewright-tmp`);
    try {
      mkdirSync(folder, { recursive: true });
      writeFileSync(temporary, text, { flag: 'wx' });
      renameSync(temporary, path);
    } catch (error) {
      try {
        rmSync(temporary, { force: true });
      } catch {
        // the folder itself could not be made: there is no temporary file
      }
      throw new UsageError(option, errnoProblem(error, path), `give ${option} a file in a folder you may write to`);
    }
  }
}
