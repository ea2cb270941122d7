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
import { workersExited } from './build/threads.js';
import { releaseSignals } from './signals.js';

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
  const years = s.years.length > 1 ? `${s.years[0]}\u2013${s.years[s.years.length - 1]}` : String(s.year);
  return `built ${s.stations} station${s.stations === 1 ? '' : 's'} for ${years}: ${s.webPages} web pages, `
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

  // Ctrl-C or a kill: every worker thread is asked to stop and finishes the station or book it is
  // drawing (never cut off mid-stream), then the temporary folder goes and the process leaves; the
  // previous output is untouched. (The swap itself is synchronous, so this never runs between its
  // two renames.) A second Ctrl-C leaves at once.
  let stopping: Promise<never> | null = null;
  const leave = (signal: NodeJS.Signals): never => {
    const complete = started && temp === null;
    if (temp) discardTemp(temp);
    say(complete
      ? `build interrupted (${signal}) just after ${shown(plan.outDir)}/ was replaced`
      : `build interrupted (${signal}); ${shown(plan.outDir)}/ is as it was before`);
    process.exit(SIGNAL_EXIT[signal] ?? 1);
  };
  const onSignal = (signal: NodeJS.Signals): void => {
    if (stopping) leave(signal);
    progress.clear();
    abort.abort(new Error(`interrupted by ${signal}`));
    stopping = workersExited(abort.signal).then(() => leave(signal));
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
  releaseSignals(); // after ours are on: a signal already caught but not yet delivered must not be lost
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
    if (stopping) await stopping;
    if (!plan.quiet) process.stdout.write(`${summaryLine(summary)}\n`);
    return 0;
  } catch (error) {
    if (stopping) await stopping; // the signal's own line and exit code, once the workers are gone
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
