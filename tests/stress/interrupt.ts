// The long interrupt run (`npm run stress:interrupt [-- COUNT [STATIONS]]`): one full build of the set
// (default: the demo) to time it, then COUNT (default 50) builds each sent Ctrl-C at a moment spread
// evenly over that time, two at a time. Every one must exit 130 with one line and leave nothing behind.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { interruptBuild, interruptEarly, launchMs, ROOT, type Interrupted } from './interrupt-run.js';

const count = Number(process.argv[2] ?? 50);
const stations = resolve(process.argv[3] ?? join(ROOT, 'stations-demo'));
const work = mkdtempSync(join(tmpdir(), 'tw-interrupt-long-'));

function problems(run: Interrupted, out: string): string[] {
  const found: string[] = [];
  if (run.finishedFirst) found.push(`the build ended before the moment (exit ${run.code ?? run.signal}: ${run.stderr.trim().slice(0, 500)})`);
  else if (run.code !== 130) found.push(`exit ${run.code ?? `by ${run.signal}`}`);
  if (run.leftovers.length > 0) found.push(`left ${run.leftovers.join(', ')}`);
  if (/Assertion|FATAL|internal error|\n\s+at /.test(run.stderr)) found.push('a crash or stack trace');
  if (run.stderr.trim().split('\n').length > 1) found.push('more than one line');
  if (!run.finishedFirst && existsSync(out)) found.push('wrote the output');
  return found;
}

async function main(): Promise<number> {
  const launch = await launchMs();
  const started = Date.now();
  const full = await interruptBuild(stations, join(work, 'timing'), { label: 'timing', ms: 3_600_000, after: (t) => `${t}-never` });
  const total = Date.now() - started;
  console.log(`one build of ${stations}: ${(total / 1000).toFixed(1)} s (exit ${full.code}); launcher ${launch} ms; ${count} moments`);
  let failed = 0;
  const moments = Array.from({ length: count }, (_, i) => Math.round(launch + ((i + 0.5) / count) * (total - launch)));
  for (let i = 0; i < moments.length; i += 2) {
    const pair = moments.slice(i, i + 2).map(async (ms, k) => {
      const out = join(work, `out-${i + k}`);
      const run = await interruptEarly(stations, out, { label: `${ms} ms`, ms }, []);
      const found = problems(run, out);
      if (found.length > 0) failed++;
      console.log(`${String(i + k + 1).padStart(3)} at ${String(ms).padStart(6)} ms: ${found.length === 0 ? 'ok, exit 130' : `FAILED: ${found.join('; ')}`}`);
    });
    await Promise.all(pair);
  }
  console.log(`${count - failed} of ${count} interrupted builds exited 130 cleanly`);
  return failed === 0 ? 0 : 1;
}

main().then((code) => {
  rmSync(work, { recursive: true, force: true });
  process.exitCode = code;
});
