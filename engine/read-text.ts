// Reading a text file a user named, with a size limit: only a plain file is read (a device such as
// /dev/zero, a pipe or a folder is refused before a byte is read), and never more than `maxBytes`, so
// a wrong path can neither hang a command nor exhaust its memory. Problems come back as words
// (problem, fix) for the caller's own error class.
import { closeSync, fstatSync, openSync, readSync, statSync } from 'node:fs';

export interface ReadProblem {
  problem: string;
  fix: string;
}

export type ReadResult = { text: string } | ReadProblem;

/** "256 KiB", "64 MiB". */
export function sizeText(bytes: number): string {
  return bytes >= 1_048_576 ? `${Math.round(bytes / 1_048_576)} MiB` : `${Math.round(bytes / 1024)} KiB`;
}

function openProblem(code: string | undefined, what: string): ReadProblem {
  if (code === 'ENOENT') return { problem: 'does not exist', fix: `give the path of ${what}` };
  if (code === 'EISDIR') return { problem: 'is a folder, not a file', fix: `give the path of ${what}` };
  if (code === 'EACCES' || code === 'EPERM') return { problem: 'cannot be read (no permission)', fix: 'make the file readable for you (e.g. chmod a+r), or run as a user who may read it' };
  if (code === 'ELOOP') return { problem: 'is a loop of symbolic links', fix: `give the path of ${what}` };
  return { problem: `cannot be read (${code ?? 'error'})`, fix: `give the path of ${what}` };
}

/** The file's text (UTF-8), or why it cannot be used. `what` names the kind of file, e.g. "a station .yaml file". */
export function readTextFile(path: string, maxBytes: number, what: string): ReadResult {
  let fd: number;
  try {
    // Opening a named pipe would wait for a writer: look before opening.
    if (statSync(path).isFIFO()) return { problem: 'is not a plain file (a named pipe)', fix: `give the path of ${what}` };
    fd = openSync(path, 'r');
  } catch (error) {
    return openProblem((error as NodeJS.ErrnoException).code, what);
  }
  try {
    const stat = fstatSync(fd);
    if (stat.isDirectory()) return openProblem('EISDIR', what);
    if (!stat.isFile()) return { problem: 'is not a plain file (a device, a pipe or a socket)', fix: `give the path of ${what}` };
    const tooBig: ReadProblem = { problem: `is larger than ${sizeText(maxBytes)}, the most tidewright reads`, fix: `give the path of ${what}` };
    if (stat.size > maxBytes) return tooBig;
    // Read until the end even if the size said otherwise (a file still growing), never past the limit.
    let buffer = Buffer.allocUnsafe(Math.min(maxBytes + 1, stat.size + 1));
    let length = 0;
    for (;;) {
      if (length === buffer.length) {
        if (length > maxBytes) return tooBig;
        const larger = Buffer.allocUnsafe(Math.min(maxBytes + 1, buffer.length * 2));
        buffer.copy(larger, 0, 0, length);
        buffer = larger;
      }
      const n = readSync(fd, buffer, length, buffer.length - length, null);
      if (n === 0) break;
      length += n;
    }
    if (length > maxBytes) return tooBig;
    return { text: buffer.toString('utf8', 0, length) };
  } catch (error) {
    return openProblem((error as NodeJS.ErrnoException).code, what);
  } finally {
    closeSync(fd);
  }
}
