// The `tidewright` command: dispatches to cli/<command>.ts, turns user errors into one line on
// stderr and exit code 1 (no stack trace). Commands load lazily so `--help` stays instant.

import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { UserError, UsageError, nearestName } from '../engine/index.js';

type CommandRunner = (argv: string[]) => Promise<number>;

interface CommandInfo {
  usage: string;
  summary: string;
}

export const COMMANDS: Readonly<Record<string, CommandInfo>> = {
  init: { usage: 'init DIR', summary: 'a new almanac folder to start from: settings, example stations, README' },
  build: { usage: 'build [--stations DIR] [--year YYYY] [--out DIR]', summary: 'the website, PDF books and downloads for a whole station set' },
  check: { usage: 'check [--stations DIR]', summary: 'validate a station set and list every problem' },
  predict: { usage: 'predict STATION.yaml --from DATE --to DATE', summary: 'high and low waters (or heights every few minutes) for any span' },
  windows: { usage: 'windows STATION.yaml --above H | --below H', summary: 'when the tide stands above (or below) a level: sills, bars, bridges' },
  height: { usage: 'height STATION.yaml --at INSTANT', summary: 'the height at one instant and whether the tide is rising or falling' },
  almanac: { usage: 'almanac STATION.yaml --year YYYY', summary: 'one station-year as the JSON model the books are made from' },
  analyse: { usage: 'analyse RECORD.csv --latitude … --longitude … --timezone …', summary: 'harmonic constants from a tide gauge record' },
  differences: { usage: 'differences SECONDARY.csv --reference STATION.yaml', summary: 'secondary-port time and height differences from a short record' },
};

export function usageText(): string {
  const width = Math.max(...Object.values(COMMANDS).map((c) => c.usage.length));
  const lines = Object.values(COMMANDS).map((c) => `  tidewright ${c.usage.padEnd(width)}  ${c.summary}`);
  return [
    'tidewright: tide almanacs (website, PDF books, data files) from harmonic constants',
    '',
    'Usage:',
    ...lines,
    '',
    '  tidewright help COMMAND        details of one command (also: tidewright COMMAND --help)',
    '  tidewright help constituents   the constituent names a station file may use',
    '  tidewright --version',
    '',
    'Predictions are astronomical only; always defer to official tables and the harbour authority.',
    '',
  ].join('\n');
}

/** The package version, found by walking up from this file (works from cli/ and from dist/cli/). */
export function packageVersion(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 4; i++) {
    const candidate = join(dir, 'package.json');
    if (existsSync(candidate)) {
      const pkg = JSON.parse(readFileSync(candidate, 'utf8')) as { name?: string; version?: string };
      if (pkg.name === 'tidewright' && pkg.version) return pkg.version;
    }
    dir = dirname(dir);
  }
  return 'unknown';
}

async function loadCommand(name: string): Promise<CommandRunner> {
  // Compiled, the sibling is build.js; under vitest it is build.ts. Neither means "not in this copy".
  const here = dirname(fileURLToPath(import.meta.url));
  if (!existsSync(join(here, `${name}.js`)) && !existsSync(join(here, `${name}.ts`))) {
    throw new UsageError(name, 'is not available in this copy of tidewright (its module is missing)', 'update tidewright, or run tidewright help for the commands it has');
  }
  const module = (await import(/* @vite-ignore */ `./${name}.js`)) as Record<string, unknown>;
  const runner = module[`run${name.charAt(0).toUpperCase()}${name.slice(1)}`];
  if (typeof runner !== 'function') {
    throw new UsageError(name, 'is not available in this copy of tidewright', 'run tidewright help for the commands it has');
  }
  return runner as CommandRunner;
}

async function constituentList(): Promise<string> {
  const { CONSTITUENT_NAMES } = await import('../engine/index.js');
  return `Constituents a station file may list (${CONSTITUENT_NAMES.length}):\n${CONSTITUENT_NAMES.join(' ')}\n`;
}

async function help(topic: string | undefined): Promise<number> {
  if (topic === undefined) {
    process.stdout.write(usageText());
    return 0;
  }
  if (topic === 'help') {
    process.stdout.write(usageText());
    return 0;
  }
  if (topic === 'constituents') {
    process.stdout.write(await constituentList());
    return 0;
  }
  return (await loadCommand(commandName(topic)))(['--help']);
}

function commandName(word: string): string {
  if (Object.hasOwn(COMMANDS, word)) return word;
  const nearest = nearestName(word, Object.keys(COMMANDS));
  throw new UsageError(
    word,
    'is not a tidewright command',
    nearest ? `did you mean tidewright ${nearest}? (tidewright help lists the commands)` : 'tidewright help lists the commands',
  );
}

async function dispatch(argv: readonly string[]): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined) {
    process.stderr.write(usageText());
    return 1;
  }
  if (first === '--help' || first === '-h') {
    process.stdout.write(usageText());
    return 0;
  }
  if (first === 'help') return help(rest[0]);
  if (first === '--version' || first === '-v') {
    process.stdout.write(`tidewright ${packageVersion()}\n`);
    return 0;
  }
  if (first.startsWith('-')) {
    throw new UsageError(first, 'is not an option here', 'put the command first, e.g. tidewright predict --help (tidewright help lists the commands)');
  }
  return (await loadCommand(commandName(first)))(rest);
}

let pipeGuarded = false;

/** A reader that stops early (`| head`) closes the pipe: stop quietly instead of a stack trace. */
function guardClosedPipe(): void {
  if (pipeGuarded) return;
  pipeGuarded = true;
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    process.stderr.write(`tidewright: cannot write the output: ${error.message}\n`);
    process.exit(2);
  });
}

/** Runs the command line (without `node` and the script) and returns the exit code. */
export async function main(argv: readonly string[]): Promise<number> {
  guardClosedPipe();
  try {
    return await dispatch(argv);
  } catch (error) {
    if (error instanceof UserError) {
      process.stderr.write(`tidewright: ${error.message}\n`);
      return 1;
    }
    if ((error as { code?: string }).code === 'EPIPE') return 0;
    const message = error instanceof Error ? error.message : String(error);
    process.stderr.write(`tidewright: internal error: ${message}\n`);
    if (process.env.TIDEWRIGHT_DEBUG && error instanceof Error && error.stack) process.stderr.write(`${error.stack}\n`);
    else process.stderr.write('tidewright: this is a fault in tidewright, not in your input; set TIDEWRIGHT_DEBUG=1 to see where it happened\n');
    return 2;
  }
}
