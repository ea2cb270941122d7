// noUncheckedIndexedAccess is on so that a read past the end of a list is handled where it can happen.
// A non-null assertion on an indexed read (`list[i]` followed by `!`) silences it instead: the code
// restructures (for…of, entries(), destructuring, the neighbour in a variable) or names the invariant
// with itemAt / numberAt / firstOf / lastOf / entryOf (engine/item.ts), which throw a named error.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const CHECKED = ['engine', 'cli', 'templates', 'tests'];

// Files allowed to keep such assertions while someone else rewrites them; keep this list empty otherwise.
const ALLOWED = new Set<string>([]);

// `]` then `!` that is not the start of `!=`/`!==`: the assertion, never a comparison.
const ASSERTED_INDEX = /\](?=!(?!=))/;

function typescript(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (name === 'node_modules' || name.startsWith('.')) return [];
    return statSync(path).isDirectory() ? typescript(path) : name.endsWith('.ts') ? [path] : [];
  });
}

describe('indexed reads', () => {
  it('carry no non-null assertion in engine/, cli/, templates/ or tests/', () => {
    const files = CHECKED.flatMap((d) => typescript(join(ROOT, d)));
    expect(files.length).toBeGreaterThan(100);
    const offenders = files
      .map((file) => relative(ROOT, file).split('\\').join('/'))
      .filter((file) => !ALLOWED.has(file))
      .flatMap((file) => readFileSync(join(ROOT, file), 'utf8').split('\n')
        .flatMap((line, i) => (ASSERTED_INDEX.test(line) ? [`${file}:${i + 1}: ${line.trim()}`] : [])));
    expect(offenders).toEqual([]);
  });

  it('allows only files that exist', () => {
    for (const file of ALLOWED) expect(statSync(join(ROOT, file)).isFile(), file).toBe(true);
  });
});
