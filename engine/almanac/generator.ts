// Name and version of the program that built a model, read once from the project's package.json
// (found by walking up from this file, so it works from engine/ under vitest and from dist/engine/).
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let version: string | null = null;

function findVersion(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 6; i++) {
    const file = join(dir, 'package.json');
    if (existsSync(file)) {
      const pkg = JSON.parse(readFileSync(file, 'utf8')) as { name?: unknown; version?: unknown };
      if (pkg.name === 'tidewright' && typeof pkg.version === 'string') return pkg.version;
    }
    dir = dirname(dir);
  }
  return '0.0.0';
}

export function generator(): { name: 'tidewright'; version: string } {
  version ??= findVersion();
  return { name: 'tidewright', version };
}
