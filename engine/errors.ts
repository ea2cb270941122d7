// Every error a user can cause is a named class carrying the file, the field and the fix,
// so the command line prints one sentence and exits non-zero without a stack trace.

export class TidewrightError extends Error {
  override name = 'TidewrightError';
}

/** A station file (or station set) that cannot be used as written. */
export class StationFileError extends TidewrightError {
  override name = 'StationFileError';
  constructor(
    readonly file: string,
    readonly field: string,
    readonly problem: string,
    readonly fix: string,
  ) {
    super(`${file}: ${field}: ${problem}; ${fix}`);
  }
}

/** A bad command-line value (date, option) or other user input that is not a station file. */
export class UsageError extends TidewrightError {
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
export class RecordFileError extends TidewrightError {
  override name = 'RecordFileError';
  constructor(
    readonly file: string,
    readonly field: string,
    readonly problem: string,
    readonly fix: string,
  ) {
    super(`${file}: ${field}: ${problem}; ${fix}`);
  }
}
