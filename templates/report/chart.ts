// A static SVG chart of height against time for the analysis report: long series are reduced to the
// lowest and highest value of each pixel column, so a year of readings keeps its envelope in a few
// kilobytes; gaps in the record stay visible as breaks in the line.

import { numberAt } from '../../engine/index.js';
import { escapeHtml } from './escape.js';

const DAY = 86_400_000;

export interface ChartSeries {
  times: Float64Array; // UTC ms, increasing
  values: Float64Array; // metres
  className: string; // CSS class of the line
  label: string; // legend text
}

export interface ChartOptions {
  id: string; // unique within the page, for the title/description references
  title: string;
  description: string;
  breakAfterMs: number; // a step longer than this between readings draws as a break
  start?: number; // time window; defaults to the series' extent
  end?: number;
  zeroLine?: boolean;
}

const WIDTH = 760;
const HEIGHT = 240;
const LEFT = 52;
const RIGHT = 12;
const TOP = 26;
const BOTTOM = 28;
const PLOT_W = WIDTH - LEFT - RIGHT;
const PLOT_H = HEIGHT - TOP - BOTTOM;

/** Round numbers 1, 2, 5 × 10ⁿ for axis ticks, about `target` of them over [lo, hi]. */
export function niceTicks(lo: number, hi: number, target = 5): number[] {
  const span = hi - lo || 1;
  const raw = span / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) ticks.push(Math.round(v / step) * step);
  return ticks;
}

function tickStepDays(days: number): number {
  return [0.25, 0.5, 1, 2, 5, 7, 14].find((s) => days / s <= 8) ?? 14;
}

function timeTicks(start: number, end: number): number[] {
  const days = (end - start) / DAY;
  const ticks: number[] = [];
  if (days > 90) {
    const d = new Date(start);
    for (let y = d.getUTCFullYear(), m = d.getUTCMonth() + 1; ; m++) {
      const t = Date.UTC(y, m, 1);
      if (t > end) break;
      if (days <= 400 || m % 3 === 0) ticks.push(t);
    }
    return ticks;
  }
  const step = tickStepDays(days) * DAY;
  for (let t = Math.ceil(start / step) * step; t <= end; t += step) ticks.push(t);
  return ticks;
}

function timeLabel(t: number, spanDays: number): string {
  const iso = new Date(t).toISOString();
  if (spanDays > 90) return iso.slice(0, 7);
  return tickStepDays(spanDays) < 1 ? `${iso.slice(5, 10)} ${iso.slice(11, 16)}` : iso.slice(0, 10);
}

/** The path of one series: min and max per pixel column, in time order, broken at gaps. */
function seriesPath(s: ChartSeries, x: (t: number) => number, y: (v: number) => number, start: number, end: number, breakAfterMs: number): string {
  const parts: string[] = [];
  let column = -1, lo = 0, hi = 0, loT = 0, hiT = 0, lastT = Number.NaN, pen = 'M';
  const flush = (): void => {
    if (column < 0) return;
    const points: [number, number][] = loT <= hiT ? [[loT, lo], [hiT, hi]] : [[hiT, hi], [loT, lo]];
    for (const [t, v] of points) {
      parts.push(`${pen}${x(t).toFixed(1)} ${y(v).toFixed(1)}`);
      pen = 'L';
    }
  };
  for (const [i, t] of s.times.entries()) {
    const v = numberAt(s.values, i, 'chart values');
    if (t < start || t > end || !Number.isFinite(v)) continue;
    if (t - lastT > breakAfterMs) {
      flush();
      column = -1;
      pen = 'M';
    }
    lastT = t;
    const c = Math.floor(x(t));
    if (c !== column) {
      flush();
      column = c;
      lo = hi = v;
      loT = hiT = t;
    } else if (v < lo) {
      lo = v;
      loT = t;
    } else if (v > hi) {
      hi = v;
      hiT = t;
    }
  }
  flush();
  return parts.join('');
}

/** A complete <figure> holding the SVG chart and its caption. */
export function timeSeriesChart(series: readonly ChartSeries[], options: ChartOptions): string {
  let start = options.start ?? Infinity, end = options.end ?? -Infinity;
  let lo = Infinity, hi = -Infinity;
  for (const s of series) {
    const first = s.times.at(0), last = s.times.at(-1);
    if (options.start === undefined && first !== undefined) start = Math.min(start, first);
    if (options.end === undefined && last !== undefined) end = Math.max(end, last);
  }
  for (const s of series) {
    for (const [i, t] of s.times.entries()) {
      const v = numberAt(s.values, i, 'chart values');
      if (t < start || t > end || !Number.isFinite(v)) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  if (!Number.isFinite(lo)) lo = hi = 0;
  if (options.zeroLine) {
    const m = Math.max(Math.abs(lo), Math.abs(hi), 0.01);
    lo = -m;
    hi = m;
  }
  const pad = (hi - lo || 1) * 0.05;
  lo -= pad;
  hi += pad;
  if (!(end > start)) end = start + DAY;
  const x = (t: number): number => LEFT + ((t - start) / (end - start)) * PLOT_W;
  const y = (v: number): number => TOP + (1 - (v - lo) / (hi - lo)) * PLOT_H;
  const spanDays = (end - start) / DAY;
  const out: string[] = [];
  const tid = `${options.id}-title`, did = `${options.id}-desc`;
  out.push(`<figure class="chart"><svg viewBox="0 0 ${WIDTH} ${HEIGHT}" role="img" aria-labelledby="${tid} ${did}">`);
  out.push(`<title id="${tid}">${escapeHtml(options.title)}</title><desc id="${did}">${escapeHtml(options.description)}</desc>`);
  out.push(`<rect class="plot-area" x="${LEFT}" y="${TOP}" width="${PLOT_W}" height="${PLOT_H}"/>`);
  for (const v of niceTicks(lo, hi)) {
    const yy = y(v).toFixed(1);
    out.push(`<line class="grid" x1="${LEFT}" x2="${LEFT + PLOT_W}" y1="${yy}" y2="${yy}"/>`);
    out.push(`<text class="tick" x="${LEFT - 6}" y="${yy}" text-anchor="end" dominant-baseline="middle">${escapeHtml(formatTick(v))}</text>`);
  }
  for (const t of timeTicks(start, end)) {
    const xx = x(t).toFixed(1);
    out.push(`<line class="grid" x1="${xx}" x2="${xx}" y1="${TOP}" y2="${TOP + PLOT_H}"/>`);
    const label = timeLabel(t, spanDays);
    const halfWidth = label.length * 3.3; // about half the label's width at 11 px
    if (x(t) - halfWidth < 0 || x(t) + halfWidth > WIDTH) continue; // a label that would be cut off
    out.push(`<text class="tick" x="${xx}" y="${HEIGHT - 8}" text-anchor="middle">${escapeHtml(label)}</text>`);
  }
  if (options.zeroLine) out.push(`<line class="zero" x1="${LEFT}" x2="${LEFT + PLOT_W}" y1="${y(0).toFixed(1)}" y2="${y(0).toFixed(1)}"/>`);
  out.push(`<text class="tick" x="${LEFT - 6}" y="${TOP - 10}" text-anchor="end">m</text>`);
  let legendX = LEFT;
  for (const s of series) {
    const d = seriesPath(s, x, y, start, end, options.breakAfterMs);
    if (d !== '') out.push(`<path class="${escapeHtml(s.className)}" d="${d}"/>`);
    out.push(`<line class="${escapeHtml(s.className)}" x1="${legendX}" x2="${legendX + 18}" y1="12" y2="12"/>`);
    out.push(`<text class="legend" x="${legendX + 24}" y="12" dominant-baseline="middle">${escapeHtml(s.label)}</text>`);
    legendX += 40 + s.label.length * 7;
  }
  out.push('</svg>');
  out.push(`<figcaption>${escapeHtml(options.description)}</figcaption></figure>`);
  return out.join('\n');
}

function formatTick(v: number): string {
  const text = Math.abs(v) < 1e-9 ? '0' : String(Number(v.toPrecision(6)));
  return text.replace('-', '\u2212');
}
