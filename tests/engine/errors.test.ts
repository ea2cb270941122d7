// One base for every error a user can cause, and one shape for the file errors.
import { describe, expect, it } from 'vitest';
import { FileError, RecordFileError, StationFileError, UsageError, UserError } from '../../engine/errors.js';

describe('user errors', () => {
  it('file errors share one base and one message shape: file, field, problem, fix', () => {
    for (const E of [StationFileError, RecordFileError]) {
      const e = new E('harbour.yaml', 'timezone', '"Mars/Base" is not a known IANA time zone', 'write a name such as Europe/Lisbon');
      expect(e).toBeInstanceOf(FileError);
      expect(e).toBeInstanceOf(UserError);
      expect(e.name).toBe(E.name);
      expect(e.message).toBe('harbour.yaml: timezone: "Mars/Base" is not a known IANA time zone; write a name such as Europe/Lisbon');
      expect([e.file, e.field]).toEqual(['harbour.yaml', 'timezone']);
      expect(e.message.split('\n')).toHaveLength(1);
    }
  });

  it('usage errors are user errors too, but not file errors', () => {
    const e = new UsageError('--year', '"abc" is not a year', 'write a year such as 2027');
    expect(e).toBeInstanceOf(UserError);
    expect(e).not.toBeInstanceOf(FileError);
    expect(e.message).toBe('--year: "abc" is not a year; write a year such as 2027');
  });
});
