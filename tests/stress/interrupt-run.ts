// Interrupting `tidewright build` (the compiled CLI) with SIGINT at a chosen moment, and what is left:
// the exit code, stderr, and any temporary folder beside the output. Shared by the quick test
// (tests/cli/build-interrupt.test.ts) and the long run (tests/stress/interrupt.ts).
import { spawn } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

export const ROOT = join(import.meta.dirname, '..', '..').replace(/[\\/]dist$/, '');
export const BIN = join(ROOT, 'bin', 'tidewright.js');

/**
 * When to send SIGINT: `ms` after the process started (from the launcher's first line on it answers
 * Ctrl-C; before that Node itself is starting and ends by the signal the default way), or `ms` after
 * `path(temp)` first exists.
 */
export interface Moment {
  label: string;
  ms: number;
  after?: (temp: string) => string;
}

export interface Interrupted {
  label: string;
  code: number | null;
  signal: NodeJS.Signals | null;
  stderr: string;
  finishedFirst: boolean; // the build was over before the moment came
  leftovers: string[]; // temporary folders of this build still beside the output
}

const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

/** How long the launcher takes to answer (`tidewright --version`): before that Node itself is starting. */
export async function launchMs(): Promise<number> {
  const start = Date.now();
  const child = spawn(process.execPath, [BIN, '--version'], { stdio: 'ignore' });
  await new Promise((resolve) => child.on('exit', resolve));
  return Date.now() - start;
}

export async function interruptBuild(stations: string, out: string, moment: Moment, extra: string[] = []): Promise<Interrupted> {
  const child = spawn(process.execPath, [BIN, 'build', '--stations', stations, '--out', out, '--year', '2027', '--quiet', ...extra],
    { stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => { stderr += chunk.toString(); });
  let exited = false;
  const done = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.on('exit', (code, signal) => { exited = true; resolve({ code, signal }); }));
  const temp = join(dirname(out), `.tidewright-tmp-${basename(out)}-${child.pid}`);
  const deadline = Date.now() + 300_000;
  if (moment.after) {
    const path = moment.after(temp);
    while (!exited && !existsSync(path) && Date.now() < deadline) await sleep(5);
  }
  for (const until = Date.now() + moment.ms; !exited && Date.now() < until;) await sleep(Math.min(5, until - Date.now()));
  const finishedFirst = exited;
  if (!exited) child.kill('SIGINT');
  const { code, signal } = await done;
  const parent = dirname(out);
  const leftovers = existsSync(parent)
    ? readdirSync(parent).filter((name) => name.startsWith(`.tidewright-tmp-${basename(out)}-${child.pid}`))
    : [];
  return { label: moment.label, code, signal, stderr, finishedFirst, leftovers };
}

/**
 * A moment counted from the start of the process, repeated later (twice as late, up to four times)
 * while the signal still found Node starting up, i.e. before the launcher's first line had run.
 */
export async function interruptEarly(stations: string, out: string, moment: Moment, extra: string[] = []): Promise<Interrupted> {
  let run = await interruptBuild(stations, out, moment, extra);
  for (let ms = moment.ms * 2, tries = 1; tries < 4 && run.signal === 'SIGINT' && run.stderr === ''; ms *= 2, tries++) {
    run = await interruptBuild(stations, out, { ...moment, ms }, extra);
  }
  return run;
}

/** Moments keyed to what the build has written so far, from loading to the combined book. */
export function phaseMoments(firstStation: string, launch: number): Moment[] {
  return [
    { label: 'while loading and checking the stations', ms: 2 * launch + 200 },
    { label: 'as the temporary folder appears', ms: 0, after: (t) => t },
    { label: 'as the first station book is written', ms: 0, after: (t) => join(t, 'pdf', `${firstStation}-2027.pdf`) },
    { label: 'during the website', ms: 200, after: (t) => join(t, 'site') },
  ];
}
