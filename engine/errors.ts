// Every error a user can cause is a named class carrying the file, the field and the fix,
// so the command line prints one sentence and exits non-zero without a stack trace.

/** The base of every error a user can cause: the command line prints its message as one line and exits 1. */
export class UserError extends Error {
  override name = 'UserError';
}

/** The former name of UserError (kept so that code written against it still compiles). */
export const TidewrightError = UserError;
export type TidewrightError = UserError;

/**
 * A part of a one-line message: line breaks and other control characters shown as escapes (so text
 * from a file can never break the line), and at most `max` characters.
 */
export function oneLine(text: string, max = 400): string {
  const flat = text.replace(/[\u0000-\u001f\u007f\u2028\u2029]/g, (c) => (c === '\n' ? '\\n' : c === '\t' ? '\\t' : `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`));
  return flat.length > max ? `${flat.slice(0, max)}…` : flat;
}

/** A file the user wrote that cannot be used as written: names the file, the field, the problem and the fix. */
export class FileError extends UserError {
  override name = 'FileError';
  constructor(
    readonly file: string,
    readonly field: string,
    readonly problem: string,
    readonly fix: string,
  ) {
    super(`${oneLine(file)}: ${oneLine(field, 120)}: ${oneLine(problem)}; ${oneLine(fix, 600)}`);
  }
}

/** A station file (or station set) that cannot be used as written. */
export class StationFileError extends FileError {
  override name = 'StationFileError';
}

/** A bad command-line value (date, option) or other user input that is not a station file. */
export class UsageError extends UserError {
  override name = 'UsageError';
  constructor(
    readonly option: string,
    readonly problem: string,
    readonly fix: string,
  ) {
    super(`${oneLine(option, 120)}: ${oneLine(problem)}; ${oneLine(fix, 600)}`);
  }
}

/** A gauge record (CSV) that cannot be analysed as written. */
export class RecordFileError extends FileError {
  override name = 'RecordFileError';
}
