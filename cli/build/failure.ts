// How a failed build is described: which step failed and why, and the exit code that goes with it.
import { StationFileError, UserError, UsageError } from '../../engine/index.js';

/** A step of the build failed (a station's computation, a renderer, a write). */
export class BuildStepError extends Error {
  override name = 'BuildStepError';
  constructor(
    readonly step: string,
    override readonly cause: unknown,
  ) {
    super(`${step}: ${cause instanceof Error ? cause.message.split('\n')[0] : String(cause)}`);
  }
}

/** The station set has problems; each is listed, nothing is written. */
export class StationSetInvalid extends UserError {
  override name = 'StationSetInvalid';
  constructor(readonly problems: readonly StationFileError[]) {
    super(`${problems.length} problem${problems.length === 1 ? '' : 's'} in the station files; nothing was written`);
  }
}

/** The innermost error with a system error code, following `cause` and `originalError` (Eleventy's). */
function systemErrorIn(error: Error): Error | undefined {
  let current: unknown = error;
  let found: Error | undefined;
  for (let depth = 0; current instanceof Error && depth < 8; depth++) {
    if (typeof (current as NodeJS.ErrnoException).code === 'string' && /^E[A-Z]+$/.test((current as NodeJS.ErrnoException).code!)) found = current;
    const next: unknown = (current as { originalError?: unknown }).originalError ?? current.cause;
    current = next;
  }
  return found;
}

export function messageOf(error: unknown): string {
  if (error instanceof BuildStepError) return `${error.step}: ${messageOf(error.cause)}`;
  if (error instanceof Error) {
    const system = systemErrorIn(error);
    if (system && system !== error) return messageOf(system);
    const code = (error as NodeJS.ErrnoException).code;
    // A full disk or a folder we may not write to is the usual cause of a write error: say it plainly.
    if (code === 'ENOSPC') return `no space left on the disk (${error.message})`;
    if (code === 'EDQUOT') return `disk quota exceeded (${error.message})`;
    if (code === 'EACCES' || code === 'EPERM') return `not allowed to write there (${error.message})`;
    if (code === 'EROFS') return `the file system is read-only (${error.message})`;
    return error.message.split('\n')[0] ?? error.message;
  }
  return String(error);
}

/** 1 for input the user can fix, 2 for everything else (a fault in tidewright or the machine). */
export function exitCodeOf(error: unknown): number {
  const cause = error instanceof BuildStepError ? error.cause : error;
  return cause instanceof UserError ? 1 : 2;
}

// Errors cross from worker threads as plain data and are rebuilt on this side with their class.
export interface SerializedError {
  name: string;
  message: string;
  stack?: string;
  code?: string;
  fields?: { file?: string; field?: string; problem?: string; fix?: string; option?: string };
}

export function serializeError(error: unknown): SerializedError {
  if (!(error instanceof Error)) return { name: 'Error', message: String(error) };
  const out: SerializedError = { name: error.name, message: error.message };
  if (error.stack !== undefined) out.stack = error.stack;
  const code = (error as NodeJS.ErrnoException).code;
  if (code !== undefined) out.code = code;
  if (error instanceof StationFileError) {
    out.fields = { file: error.file, field: error.field, problem: error.problem, fix: error.fix };
  } else if (error instanceof UsageError) {
    out.fields = { option: error.option, problem: error.problem, fix: error.fix };
  }
  return out;
}

export function deserializeError(data: SerializedError): Error {
  const f = data.fields ?? {};
  let error: Error;
  if (data.name === 'StationFileError' && f.file !== undefined) {
    error = new StationFileError(f.file, f.field ?? '', f.problem ?? '', f.fix ?? '');
  } else if (data.name === 'UsageError' && f.option !== undefined) {
    error = new UsageError(f.option, f.problem ?? '', f.fix ?? '');
  } else {
    error = new Error(data.message);
    error.name = data.name;
  }
  if (data.code !== undefined) (error as NodeJS.ErrnoException).code = data.code;
  if (data.stack !== undefined) error.stack = data.stack;
  return error;
}
