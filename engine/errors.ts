// Every error a user can cause is a named class carrying the file, the field and the fix,
// so the command line prints one sentence and exits non-zero without a stack trace.

/** The base of every error a user can cause: the command line prints its message as one line and exits 1. */
export class UserError extends Error {
  override name = 'UserError';
}

/** The former name of UserError (kept so that code written against it still compiles). */
export const TidewrightError = UserError;
export type TidewrightError = UserError;

/** A file the user wrote that cannot be used as written: names the file, the field, the problem and the fix. */
export class FileError extends UserError {
  override name = 'FileError';
  constructor(
    readonly file: string,
    readonly field: string,
    readonly problem: string,
    readonly fix: string,
  ) {
    super(`${file}: ${field}: ${problem}; ${fix}`);
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
    super(`${option}: ${problem}; ${fix}`);
  }
}

/** A gauge record (CSV) that cannot be analysed as written. */
export class RecordFileError extends FileError {
  override name = 'RecordFileError';
}
