// `tidewright init DIR`: a publisher's folder to start from (cli/init-files.ts). It writes only into a
// folder that is new or empty, so it never mixes with or replaces anyone's files.

import { mkdirSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { UsageError } from '../engine/index.js';
import { parseCommandLine, positionalArguments } from './args.js';
import { STARTER_FILES } from './init-files.js';

export const INIT_HELP = `Usage: tidewright init DIR

Makes a folder to start a tide almanac from: tidewright.yaml with every setting explained, one invented
reference port and one invented secondary port (at sea, to replace with yours), one example page of
your own (pages/welcome.md) and a short README on replacing the stations and building. DIR must be new or empty.

Then: tidewright check --stations DIR, and tidewright build --stations DIR --out DIR-out
`;

function entriesOf(dir: string): string[] | null {
  let stat;
  try {
    stat = statSync(dir);
  } catch {
    return null; // does not exist yet
  }
  if (!stat.isDirectory()) throw new UsageError(dir, 'is a file, not a folder', 'give the name of a new or empty folder');
  return readdirSync(dir);
}

/** An output folder beside the almanac folder (the build refuses one inside the stations folder). */
function outBeside(dir: string): string {
  return join(dir, '..', `${basename(resolve(dir))}-out`);
}

export async function runInit(argv: string[]): Promise<number> {
  const { values, positionals } = parseCommandLine('init', argv, { help: { type: 'boolean', short: 'h' } });
  if (values.help) {
    process.stdout.write(INIT_HELP);
    return 0;
  }
  const [dir] = positionalArguments('init', positionals, ['DIR']) as [string];
  const entries = entriesOf(dir);
  if (entries !== null && entries.length > 0) {
    throw new UsageError(dir, `is not empty (it holds ${entries.length === 1 ? 'one entry' : `${entries.length} entries`}, e.g. ${entries.sort()[0]})`,
      'give the name of a new or empty folder; tidewright init never writes among existing files');
  }
  mkdirSync(dir, { recursive: true });
  for (const [name, text] of Object.entries(STARTER_FILES)) {
    mkdirSync(dirname(join(dir, name)), { recursive: true });
    writeFileSync(join(dir, name), text, { flag: 'wx' });
  }
  process.stderr.write(`tidewright: made ${dir} with ${Object.keys(STARTER_FILES).length} files; ` +
    `next: tidewright check --stations ${dir}, then tidewright build --stations ${dir} --out ${outBeside(dir)}\n`);
  return 0;
}
