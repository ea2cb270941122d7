// `tidewright analyse` on current-meter records: a record made from known ellipses (the engine's own
// velocity, checked against direct cosines in tests/engine/streams.test.ts) gives those ellipses back.
// The least squares is the gauge analysis' (tested against published constants elsewhere); the ellipse
// conversion is checked on worked values in tests/engine/streams-ellipse.test.ts.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../fixtures/run-cli.js';
import { entryOf, INFERENCE_RULES, itemAt, parseAnyStation, streamVelocities, type StreamStation } from '../../engine/index.js';

let tmp: string;
const original: StreamStation = {
  id: 'meter', name: 'Meter (invented)', kind: 'stream', position: { latitude: 47.66, longitude: -15.88 }, timezone: 'Europe/Lisbon',
  flood_direction: 70, unit: 'kn', mean_current: { east: 0.05, north: -0.1 }, provenance: 'Invented for a test',
  constituents: {
    M2: { major: 2.2, minor: 0.3, inclination: 20, phase: 170 },
    S2: { major: 0.75, minor: -0.1, inclination: 25, phase: 215 },
    N2: { major: 0.42, minor: 0.05, inclination: 21, phase: 150 },
    K1: { major: 0.2, minor: 0.05, inclination: 35, phase: 100 },
    O1: { major: 0.15, minor: 0.03, inclination: 30, phase: 340 },
    M4: { major: 0.15, minor: 0.02, inclination: 18, phase: 60 },
  },
};

// A record of 40 days cannot separate K2, T2 from S2, P1 from K1…: the analysis infers them from their
// neighbour at the equilibrium ratio and phase, so the record is made with them in exactly that relation.
for (const r of INFERENCE_RULES) {
  const from = original.constituents[r.from];
  if (from && !original.constituents[r.name]) {
    original.constituents[r.name] = { ...from, major: from.major * r.ratio, minor: from.minor * r.ratio };
  }
}

function record(columns: 'speed-direction' | 'east-north'): string {
  const start = Date.UTC(2027, 2, 1);
  const step = 20 * 60_000;
  const count = 40 * 72;
  const { east, north } = streamVelocities(original, {}, start, step, count);
  const rows = [columns === 'east-north' ? 'time,east,north' : 'time,speed,direction'];
  for (let i = 0; i < count; i++) {
    const t = new Date(start + i * step).toISOString().replace('.000Z', 'Z');
    const e = itemAt(east, i, 'east');
    const n = itemAt(north, i, 'north');
    if (columns === 'east-north') rows.push(`${t},${e.toFixed(4)},${n.toFixed(4)}`);
    else rows.push(`${t},${Math.hypot(e, n).toFixed(4)},${(((Math.atan2(e, n) * 180) / Math.PI + 360) % 360).toFixed(3)}`);
  }
  return `${rows.join('\n')}\n`;
}

beforeAll(() => {
  tmp = mkdtempSync(join(tmpdir(), 'tidewright-current-'));
  writeFileSync(join(tmp, 'meter-sd.csv'), record('speed-direction'));
  writeFileSync(join(tmp, 'meter-en.csv'), record('east-north'));
});
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

const angle = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);

describe('analyse a current-meter record', () => {
  it.each(['meter-sd.csv', 'meter-en.csv'])('%s gives back the ellipses it was made from', async (name) => {
    const out = join(tmp, `${name}.yaml`);
    const { code, stderr } = await runCli(['analyse', join(tmp, name), '--latitude', '47.66', '--longitude', '-15.88',
      '--timezone', 'Europe/Lisbon', '--flood-direction', '70', '--output', out]);
    expect(stderr).toMatch(/constituent ellipses, residual RMS/);
    expect(code).toBe(0);
    const station = parseAnyStation(readFileSync(out, 'utf8'), out) as StreamStation;
    expect(station.kind).toBe('stream');
    expect(station.flood_direction).toBe(70);
    expect(station.mean_current.east).toBeCloseTo(0.05, 2);
    expect(station.mean_current.north).toBeCloseTo(-0.1, 2);
    for (const [c, tol] of [['M2', 0.005], ['S2', 0.01], ['N2', 0.01], ['K1', 0.01], ['O1', 0.01], ['M4', 0.005]] as const) {
      const want = entryOf(original.constituents, c, 'constituents');
      const got = entryOf(station.constituents, c, 'constituents');
      expect(got.major, c).toBeCloseTo(want.major, 1);
      expect(Math.abs(got.major - want.major), c).toBeLessThan(tol);
      expect(Math.abs(got.minor - want.minor), c).toBeLessThan(tol);
      expect(angle(got.inclination, want.inclination), c).toBeLessThan(1);
      expect(angle(got.phase, want.phase), c).toBeLessThan(1);
    }
  }, 60_000);

  it('without --flood-direction: one line naming the two directions of the main axis', async () => {
    const { code, stderr } = await runCli(['analyse', join(tmp, 'meter-en.csv'), '--latitude', '47.66', '--longitude', '-15.88', '--timezone', 'Europe/Lisbon']);
    expect(code).toBe(1);
    expect(stderr.trim().split('\n')).toHaveLength(1);
    expect(stderr).toContain('--flood-direction');
    expect(stderr).toContain('toward 70° and 250°');
  }, 60_000);

  it('a bad row is one line naming the file, the line and the fix', async () => {
    const bad = join(tmp, 'bad.csv');
    writeFileSync(bad, 'time,speed,direction\n2027-01-01T00:00:00Z,1.2,70\n2027-01-01T00:20:00Z,1.1,400\n');
    const { code, stderr } = await runCli(['analyse', bad, '--latitude', '47.66', '--longitude', '-15.88', '--timezone', 'Europe/Lisbon', '--flood-direction', '70']);
    expect(code).toBe(1);
    expect(stderr).toContain('bad.csv: line 3, direction: 400 is not a direction from 0 to 360 degrees');
  });
});
