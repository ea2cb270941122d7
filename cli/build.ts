// `tidewright build`: the whole almanac (website, PDF books, downloads) for a station set, written
// into a temporary folder and swapped into place only when everything succeeded.
import { relative } from 'node:path';
import { BUILD_USAGE, parseBuildArgs } from './build/args.js';
import { realBuildDeps } from './build/deps.js';
import { exitCodeOf, messageOf, StationSetInvalid } from './build/failure.js';
import { discardTemp, type OutputTarget } from './build/output.js';
import { makePlan } from './build/plan.js';
import { clock, createProgress } from './build/progress.js';
import { buildAlmanac, type BuildSummary } from './build/run.js';

const SIGNAL_EXIT: Readonly<Record<string, number>> = { SIGINT: 130, SIGTERM: 143 };

function say(line: string): void {
  process.stderr.write(`tidewright: ${line}\n`);
}

function shown(path: string): string {
  const rel = relative(process.cwd(), path);
  return rel === '' ? '.' : rel.startsWith('..') ? path : rel;
}

export function summaryLine(s: BuildSummary): string {
  const mib = (s.bytes / 1_048_576).toFixed(1);
  return `built ${s.stations} station${s.stations === 1 ? '' : 's'} for ${s.year}: ${s.webPages} web pages, `
    + `${s.pdfPages} PDF pages, ${s.files} files (${mib} MiB) in ${clock(s.ms)} with ${s.workers} worker`
    + `${s.workers === 1 ? '' : 's'} → ${shown(s.out)}/`;
}

export async function runBuild(argv: string[]): Promise<number> {
  const args = parseBuildArgs(argv);
  if (args.help) {
    process.stdout.write(`${BUILD_USAGE}\n`);
    return 0;
  }
  const plan = makePlan(args);
  const progress = createProgress(process.stderr, plan.quiet);
  const abort = new AbortController();
  let temp: OutputTarget | null = null;
  let started = false;

  // Ctrl-C or a kill: remove our temporary folder and leave at once; the previous output is untouched.
  // (The swap itself is synchronous, so this can never run between its two renames.)
  const onSignal = (signal: NodeJS.Signals): void => {
    progress.clear();
    abort.abort(new Error(`interrupted by ${signal}`));
    if (temp) discardTemp(temp);
    say(`build interrupted (${signal}); ${shown(plan.outDir)}/ is as it was before`);
    process.exit(SIGNAL_EXIT[signal] ?? 1);
  };
  // A renderer's library may fail outside any promise we await (Eleventy's file copying on a full disk
  // does): the build cannot go on, so clean up the same way and say what failed in one line.
  const onStray = (error: unknown): void => {
    progress.clear();
    if (temp) discardTemp(temp);
    say(`build failed: ${messageOf(error)}; ${shown(plan.outDir)}/ is as it was before`);
    if (process.env.TIDEWRIGHT_DEBUG && error instanceof Error && error.stack) process.stderr.write(`${error.stack}\n`);
    process.exit(2);
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  process.on('unhandledRejection', onStray);
  process.on('uncaughtException', onStray);
  try {
    const summary = await buildAlmanac(plan, realBuildDeps, {
      progress,
      note: (text) => { if (!plan.quiet) say(text); },
      tempCreated: (target) => {
        temp = target;
        started = true;
      },
      committed: () => { temp = null; },
      signal: abort.signal,
    });
    if (!plan.quiet) process.stdout.write(`${summaryLine(summary)}\n`);
    return 0;
  } catch (error) {
    progress.clear();
    if (error instanceof StationSetInvalid) {
      for (const problem of error.problems) say(problem.message);
    }
    // Once a temporary folder existed, say that the previous output survived; before, nothing was written.
    if (started) say(`build failed: ${messageOf(error)}; ${shown(plan.outDir)}/ is as it was before`);
    else say(error instanceof StationSetInvalid ? `build failed: ${error.message}` : messageOf(error));
    if (process.env.TIDEWRIGHT_DEBUG && error instanceof Error && error.stack) process.stderr.write(`${error.stack}\n`);
    return exitCodeOf(error);
  } finally {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
    process.off('unhandledRejection', onStray);
    process.off('uncaughtException', onStray);
  }
}
