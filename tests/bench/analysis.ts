// Benchmark of the harmonic analysis (issue 7): a 1-year hourly record of an invented 60-constituent
// port (predicted by the engine, 2 cm of noise, 5 % of the hours missing) analysed for those 60
// constituents, and again with the Rayleigh choice. Reports time (median of a few runs, and CPU time,
// steadier on a busy machine) and memory: heap growth during one analysis, and the process's peak
// resident size (maxRSS).
import { analyseRecord, compilePredictor, itemAt } from '../../engine/index.js';
import { degrade, evenTimes, HOUR, recordOf } from '../fixtures/analysis-records.js';
import { sixtyConstituentStation } from '../fixtures/engine-stations.js';

const RUNS = 5;
const MB = 1024 * 1024;

function collectGarbage(): void {
  (globalThis as { gc?: () => void }).gc?.();
}

function gcExposed(): boolean {
  return typeof (globalThis as { gc?: unknown }).gc === 'function';
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return itemAt(s, s.length >> 1, 's');
}

export async function bench(): Promise<void> {
  const station = sixtyConstituentStation();
  const names = Object.keys(station.constituents);
  const start = Date.UTC(2027, 0, 1);
  const count = 366 * 24 + 1;
  const clean = recordOf(evenTimes(start, HOUR, count), compilePredictor(station).heights(start, HOUR, count));
  const record = degrade(clean, { sigma: 0.02, seed: 7, dropShare: 0.05 });
  console.log(`record: ${record.times.length} hourly readings over 366 days; ${names.length} constituents`);

  for (const [label, options] of [
    [`fixed set of ${names.length}`, { constituents: names }],
    ['Rayleigh choice (R = 1)', {}],
  ] as const) {
    analyseRecord(record, options); // warm-up
    const times: number[] = [];
    let result = analyseRecord(record, options);
    const cpu0 = process.cpuUsage();
    for (let i = 0; i < RUNS; i++) {
      const t0 = performance.now();
      result = analyseRecord(record, options);
      times.push(performance.now() - t0);
    }
    const cpu = process.cpuUsage(cpu0);
    const cpuMs = (cpu.user + cpu.system) / 1000 / RUNS;
    collectGarbage();
    const before = process.memoryUsage();
    const kept = analyseRecord(record, options);
    const during = process.memoryUsage();
    collectGarbage();
    const after = process.memoryUsage();
    const mb = (bytes: number): string => (bytes / MB).toFixed(1);
    let worstAmplitude = 0, worstPhase = 0;
    for (const c of result.constituents) {
      const k = station.constituents[c.name];
      if (!k) continue;
      worstAmplitude = Math.max(worstAmplitude, Math.abs(c.amplitude - k.amplitude));
      worstPhase = Math.max(worstPhase, k.amplitude > 0.05 ? Math.abs(((c.phase - k.phase + 540) % 360) - 180) : 0);
    }
    console.log(`${label}: ${result.constituents.length} constituents, ${1 + 2 * result.constituents.length} unknowns; ` +
      `median ${median(times).toFixed(0)} ms (min ${Math.min(...times).toFixed(0)} ms, ${RUNS} runs), ` +
      `${cpuMs.toFixed(0)} ms of CPU per run`);
    console.log(gcExposed()
      ? `  memory: heap +${mb(during.heapUsed - before.heapUsed)} MB just after one analysis (before any collection), ` +
        `+${mb(Math.max(0, after.heapUsed - before.heapUsed))} MB once collected; its result holds ${mb(kept.fitted.byteLength)} MB of fitted heights`
      : '  memory: run with node --expose-gc (npm run bench does) for heap figures');
    console.log(`  check: residual RMS ${(result.residual.rms * 100).toFixed(2)} cm (noise 2 cm); worst amplitude error ` +
      `${(worstAmplitude * 1000).toFixed(1)} mm; worst phase error ${worstPhase.toFixed(2)}° (constituents over 5 cm)`);
  }
  console.log(`process peak resident size so far: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
}
