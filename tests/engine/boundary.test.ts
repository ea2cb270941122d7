// The engine's public surface is engine/index.ts: everything outside engine/ imports the engine
// through it, and the engine imports nothing that renders. (The engine's own unit tests in
// tests/engine/ mirror its modules and may import them directly.)
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { itemAt } from '../../engine/index.js';

const ROOT = join(import.meta.dirname, '..', '..');
const SOURCE = /\.(ts|js|mjs|cjs)$/;

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (name === 'node_modules' || name.startsWith('.')) return [];
    return statSync(path).isDirectory() ? sources(path) : SOURCE.test(name) ? [path] : [];
  });
}

// Every module specifier of a file: static imports and exports, and dynamic import().
function specifiers(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  return [...text.matchAll(/(?:\bfrom\s*|\bimport\s*\(\s*|^\s*import\s+)(['"])([^'"]+)\1/gm)].map((m) => itemAt(m, 2, 'm'));
}

describe('engine boundary', () => {
  it('outside engine/ the engine is imported through engine/index.ts only', () => {
    const outside = [
      ...['cli', 'templates', 'bin'].flatMap((d) => sources(join(ROOT, d))),
      ...sources(join(ROOT, 'tests')).filter((f) => !relative(ROOT, f).startsWith(join('tests', 'engine'))),
      join(ROOT, '.eleventy.js'),
    ];
    expect(outside.length).toBeGreaterThan(50);
    const offenders = outside.flatMap((file) => specifiers(file)
      .filter((s) => /(^|\/)engine\//.test(s) && !/(^|\/)engine\/index\.js$/.test(s))
      .map((s) => `${relative(ROOT, file)}: ${s}`));
    expect(offenders).toEqual([]);
  });

  it('the engine imports nothing from the renderers or the command line', () => {
    const offenders = sources(join(ROOT, 'engine')).flatMap((file) => specifiers(file)
      .filter((s) => /(^|\/)(templates|cli)\//.test(s) || /^(pdfkit|@11ty\/)/.test(s))
      .map((s) => `${relative(ROOT, file)}: ${s}`));
    expect(offenders).toEqual([]);
  });
});
