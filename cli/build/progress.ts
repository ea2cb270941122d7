// Progress of a long build on a terminal: one line on stderr, rewritten in place. Silent otherwise.

export interface Progress {
  stage(label: string, total?: number): void; // a new stage; `total` when it counts stations
  tick(done: number): void; // stations done in the current stage
  clear(): void; // erase the line and stop redrawing (before a summary or an error)
}

export interface ProgressStream {
  isTTY?: boolean;
  columns?: number;
  write(text: string): unknown;
}

/** "1:05" or "1:02:03". */
export function clock(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000));
  const mm = String(Math.floor(s / 60) % 60);
  const ss = String(s % 60).padStart(2, '0');
  return s >= 3600 ? `${Math.floor(s / 3600)}:${mm.padStart(2, '0')}:${ss}` : `${mm}:${ss}`;
}

/** The text of the progress line. The estimate assumes the stations left take as long as those done. */
export function progressLine(label: string, done: number, total: number | undefined, elapsedMs: number, stageMs: number): string {
  const parts = [label];
  if (total !== undefined) {
    parts.push(`${done}/${total} stations`);
  }
  parts.push(`${clock(elapsedMs)} elapsed`);
  if (total !== undefined && done > 0 && done < total) {
    parts.push(`about ${clock((stageMs / done) * (total - done))} left`);
  }
  return parts.join(' · ');
}

const SILENT: Progress = { stage() {}, tick() {}, clear() {} };

export function createProgress(stream: ProgressStream, quiet: boolean, now: () => number = Date.now): Progress {
  if (quiet || !stream.isTTY) return SILENT;
  const start = now();
  let label = '';
  let total: number | undefined;
  let done = 0;
  let stageStart = start;
  let lastDraw = 0;
  let shown = false;
  let timer: ReturnType<typeof setInterval> | undefined;
  const draw = (force: boolean): void => {
    const t = now();
    if (!force && t - lastDraw < 200) return;
    lastDraw = t;
    const width = Math.max(20, (stream.columns || 80) - 1); // 0 or missing: a terminal of unknown size
    stream.write(`\r\x1b[K${progressLine(label, done, total, t - start, t - stageStart).slice(0, width)}`);
    shown = true;
  };
  return {
    stage(next, count) {
      label = next;
      total = count;
      done = 0;
      stageStart = now();
      draw(true);
      // Keep the elapsed time moving through stages that report nothing until they end.
      timer ??= setInterval(() => draw(true), 1000).unref();
    },
    tick(count) {
      done = count;
      draw(count === total);
    },
    clear() {
      if (timer) clearInterval(timer);
      timer = undefined;
      if (shown) stream.write('\r\x1b[K');
      shown = false;
    },
  };
}
