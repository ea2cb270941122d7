// Station files: every rejection path names file, field, what was wrong and what to write instead;
// good files load with the keys of the station file and nothing else.

import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { StationFileError } from '../../engine/errors.js';
import {
  checkStationSet,
  loadStationFile,
  loadStationSet,
  nearestName,
  parseStation,
  suspiciousConstants,
} from '../../engine/stations.js';
import { CONSTITUENT_NAMES } from '../../engine/constituents.js';
import type { ReferenceStation } from '../../engine/types.js';

const FIXTURES = join(import.meta.dirname, '..', 'fixtures');
const BAD = join(FIXTURES, 'stations-bad');

function rejection(run: () => unknown): StationFileError {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(StationFileError);
    return error as StationFileError;
  }
  throw new Error('expected a StationFileError, but the input was accepted');
}

// [fixture, field, words the problem must contain, words the fix must contain]
const BAD_FILES: [string, string, string, string][] = [
  ['yaml-syntax', 'line 5, column 1', 'YAML syntax error', 'close every [ or {'],
  ['duplicate-key', 'line 7, column 1', 'Map keys must be unique', 'write each key only once'],
  ['two-documents', 'line 11, column 1', 'a second YAML document starts here', 'keep one station per file'],
  ['empty-file', '(file)', 'is empty', 'key: value'],
  ['not-a-map', '(file)', 'holds a list, not a station', 'key: value'],
  ['scalar-file', '(file)', 'holds the text "just some words"', 'key: value'],
  ['missing-key', 'timezone', 'is missing', 'IANA time zone'],
  ['misspelt-key', 'timezon', 'is not a key tidewright knows', 'did you mean timezone?'],
  ['unknown-key', 'colour', 'is not a key tidewright knows', 'the keys allowed here are id, name, kind'],
  ['key-of-secondary', 'reference', 'is a key of secondary ports', 'write kind: secondary'],
  ['missing-kind', 'kind', 'is missing', 'kind: reference'],
  ['misspelt-kind', 'kind', '"referance" is not a kind of station', 'write kind: reference'],
  ['bad-id', 'id', '"Brinewold Head" may only hold lower-case letters a-z, digits and hyphens', 'write brinewold-head'],
  ['id-escape', 'id', '"../../etc/passwd" may only hold', 'write etc-passwd'],
  ['unknown-constituent', 'constituents.X9', '"X9" is not a constituent tidewright knows', 'tidewright help constituents'],
  ['lowercase-constituent', 'constituents.m2', '"m2" is not a constituent', 'did you mean M2? write M2'],
  ['misspelt-constituent', 'constituents.SS2', '"SS2" is not a constituent', 'did you mean S2?'],
  ['unknown-constituent-key', 'constituents.S2.speed', 'is not a key tidewright knows', 'amplitude, phase'],
  ['no-constituents', 'constituents', 'lists no constituents', 'add at least M2'],
  // A negative amplitude is the same wave turned by 180°: 258 + 180 = 438, that is 78.
  ['negative-amplitude', 'constituents.S2.amplitude', '-0.592 is negative', 'write amplitude: 0.592 with phase: 78'],
  ['phase-360', 'constituents.M2.phase', '360 is outside 0 to 360 degrees', 'write 0,'],
  ['phase-negative', 'constituents.M2.phase', '-20 is outside 0 to 360 degrees', 'write 340,'],
  ['unknown-timezone', 'timezone', '"Europe/Lisbn" is not a known IANA time zone', 'did you mean Europe/Lisbon?'],
  ['timezone-case', 'timezone', 'wrong capitals', 'write timezone: Europe/Lisbon'],
  ['latitude-range', 'position.latitude', '95 is above the largest allowed value 90', 'from -90 to 90'],
  ['longitude-range', 'position.longitude', '344.2 is outside -180 to 180', 'write -15.8'],
  ['text-for-number', 'mean_level', 'should be a number but is the text "2.52 m"', 'mean_level: 2.52'],
  ['number-for-text', 'name', 'should be text but is 2027', 'write it in quotes'],
  ['empty-value', 'datum', 'is empty', 'datum: Chart Datum'],
  ['datum-epoch-fraction', 'datum_epoch', 'should be a whole number but is 2020.5', 'datum_epoch: 2020'],
  ['secondary-incomplete', 'differences.low_water.neaps', 'is missing', '{ time: 25, height: -0.30 }'],
  ['secondary-time-range', 'differences.high_water.springs.time', '900 is above the largest allowed value 720', 'minutes from -720 to 720'],
];

describe('a bad station file is rejected with one line naming file, field, problem and fix', () => {
  it.each(BAD_FILES)('%s → %s', (fixture, field, problem, fix) => {
    const file = join(BAD, `${fixture}.yaml`);
    const error = rejection(() => loadStationFile(file));
    expect(error.file).toBe(file);
    expect(error.field).toBe(field);
    expect(error.problem).toContain(problem);
    expect(error.fix).toContain(fix);
    expect(error.message).toBe(`${file}: ${field}: ${error.problem}; ${error.fix}`);
    expect(error.message).not.toContain('\n');
  });

  it('has a fixture for every case and a case for every fixture', async () => {
    const { readdirSync } = await import('node:fs');
    const files = readdirSync(BAD).map((f) => f.replace(/\.yaml$/, '')).sort();
    expect(files).toEqual(BAD_FILES.map(([f]) => f).sort());
  });

  it('a file that does not exist says so', () => {
    const error = rejection(() => loadStationFile(join(BAD, 'no-such-station.yaml')));
    expect(error.problem).toBe('does not exist');
  });

  it('lists every problem of a file, not only the first', async () => {
    const { checkStationText } = await import('../../engine/stations.js');
    const text = [
      'id: Two Words',
      'name: Several Faults (invented)',
      'kind: reference',
      'position: { latitude: -91, longitude: 10 }',
      'timezone: Mars/Olympus',
      'datum: Chart Datum',
      'mean_level: 1',
      'constituents: { M2: { amplitude: -1, phase: 10 }, XX: { amplitude: 1, phase: 0 } }',
      'provenance: test',
    ].join('\n');
    const fields = checkStationText(text, 'several.yaml').problems.map((p) => p.field);
    expect(fields).toEqual(['id', 'position.latitude', 'timezone', 'constituents.M2.amplitude', 'constituents.XX']);
  });

  it('an alias and its canonical name listed together is one constituent twice', () => {
    const text = [
      'id: twice', 'name: Twice (invented)', 'kind: reference', 'position: { latitude: 1, longitude: 2 }',
      'timezone: UTC', 'datum: Chart Datum', 'mean_level: 1', 'provenance: test',
      'constituents: { LAMBDA2: { amplitude: 0.1, phase: 1 }, LAM2: { amplitude: 0.1, phase: 1 } }',
    ].join('\n');
    const error = rejection(() => parseStation(text, 'twice.yaml'));
    expect(error.field).toBe('constituents.LAM2');
    expect(error.problem).toContain('another name for LAMBDA2');
  });
});

describe('a good station file', () => {
  it('loads a reference port with exactly the keys of the file, the default datum epoch and its source file', () => {
    const file = join(FIXTURES, 'stations-good', 'brinewold-head.yaml');
    const station = loadStationFile(file) as ReferenceStation;
    expect(station).toEqual({
      id: 'brinewold-head',
      name: 'Brinewold Head (invented)',
      kind: 'reference',
      position: { latitude: 47.60, longitude: -15.80 },
      timezone: 'Europe/Lisbon',
      datum: 'Chart Datum',
      mean_level: 2.52,
      constituents: { M2: { amplitude: 1.734, phase: 211.6 }, S2: { amplitude: 0.592, phase: 258.0 } },
      provenance: 'Invented test fixture',
      datum_epoch: 2020,
      sourceFile: file,
    });
  });

  it('keeps texts as plain strings, markup and all (the renderers escape them)', () => {
    const text = [
      'id: markup', 'name: "<script>alert(1)</script> & Sons"', 'kind: reference',
      'position: { latitude: 1, longitude: 2 }', 'timezone: UTC', 'datum: "CD <b>"',
      'mean_level: 1', 'constituents: { M2: { amplitude: 0.5, phase: 1 } }', 'provenance: "a & b"', 'datum_epoch: 2001',
    ].join('\n');
    const station = parseStation(text, 'markup.yaml');
    expect(station.name).toBe('<script>alert(1)</script> & Sons');
    expect(station.datum).toBe('CD <b>');
    expect(station.datum_epoch).toBe(2001);
  });

  it('accepts an alias of a constituent and stores it under its canonical name', () => {
    const text = [
      'id: alias', 'name: Alias (invented)', 'kind: reference', 'position: { latitude: 1, longitude: 2 }',
      'timezone: UTC', 'datum: Chart Datum', 'mean_level: 1', 'provenance: test',
      'constituents: { M2: { amplitude: 0.5, phase: 1 }, LAM2: { amplitude: 0.01, phase: 3 } }',
    ].join('\n');
    const station = parseStation(text, 'alias.yaml') as ReferenceStation;
    expect(Object.keys(station.constituents)).toEqual(['M2', 'LAMBDA2']);
  });

  it('validates names against the engine constituent table', () => {
    expect(CONSTITUENT_NAMES.length).toBeGreaterThanOrEqual(60);
    expect(nearestName('m4', CONSTITUENT_NAMES)).toBe('M4');
    expect(nearestName('MSF', CONSTITUENT_NAMES)).toBe('MSf');
  });
});

describe('a station set', () => {
  const made: string[] = [];
  afterAll(() => {
    for (const dir of made) rmSync(dir, { recursive: true, force: true });
  });

  it('loads every station, resolves ids, skips the project file and other files', () => {
    const dir = join(FIXTURES, 'stations-good');
    const set = loadStationSet(dir);
    expect(set.dir).toBe(dir);
    expect(set.stations.map((s) => s.id)).toEqual(['brinewold-head', 'saltgrist-cove']);
    expect(set.byId.get('saltgrist-cove')?.kind).toBe('secondary');
  });

  it('rejects two stations with the same id, naming both files', () => {
    const dir = join(FIXTURES, 'stations-duplicate-id');
    const error = rejection(() => loadStationSet(dir));
    expect(error.file).toBe(join(dir, 'b-brinewold-head-copy.yaml'));
    expect(error.field).toBe('id');
    expect(error.problem).toContain(join(dir, 'a-brinewold-head.yaml'));
  });

  it('rejects a reference that does not exist, suggesting the near one', () => {
    const error = rejection(() => loadStationSet(join(FIXTURES, 'stations-reference-missing')));
    expect(error.field).toBe('reference');
    expect(error.problem).toContain('has the id "brinwold-head"');
    expect(error.fix).toContain('write reference: brinewold-head');
  });

  it('rejects a reference that is itself a secondary port, naming the reference port to use', () => {
    const error = rejection(() => loadStationSet(join(FIXTURES, 'stations-reference-secondary')));
    expect(error.file).toMatch(/mackerel-quay\.yaml$/);
    expect(error.problem).toContain('"saltgrist-cove" is itself a secondary port');
    expect(error.fix).toContain('write reference: brinewold-head');
  });

  it('rejects references that go round in a loop, and a station naming itself', () => {
    const { problems } = checkStationSet(join(FIXTURES, 'stations-reference-cycle'));
    const words = problems.map((p) => `${p.file.split('/').pop()}: ${p.problem}`);
    expect(words).toEqual([
      'lonely-steps.yaml: names the station itself ("lonely-steps")',
      'north-quay.yaml: the references go round in a loop (north-quay → south-quay → north-quay)',
      'south-quay.yaml: the references go round in a loop (south-quay → north-quay → south-quay)',
    ]);
  });

  it('rejects an empty folder and a folder that does not exist', () => {
    const empty = mkdtempSync(join(tmpdir(), 'tidewright-empty-'));
    made.push(empty);
    expect(rejection(() => loadStationSet(empty)).problem).toBe('holds no station files (*.yaml)');
    expect(rejection(() => loadStationSet(join(empty, 'nowhere'))).problem).toContain('does not exist');
  });

  it('does not report a reference to a file that has problems of its own a second time', () => {
    const { problems } = checkStationSet(join(FIXTURES, 'stations-check-many'));
    const saltgrist = problems.filter((p) => p.file.endsWith('saltgrist-cove.yaml'));
    // brinewold-head.yaml fails on its own; the typo "brinewold-hed" is still caught and matched to it.
    expect(saltgrist.map((p) => p.fix)).toEqual(['did you mean brinewold-head? write reference: brinewold-head']);
  });

  it('loads the demo scenario: invented, at least two reference ports and four secondary ports', () => {
    const set = loadStationSet(join(import.meta.dirname, '..', '..', 'stations-demo'));
    const references = set.stations.filter((s) => s.kind === 'reference');
    const secondaries = set.stations.filter((s) => s.kind === 'secondary');
    expect(references.length).toBeGreaterThanOrEqual(2);
    expect(secondaries.length).toBeGreaterThanOrEqual(4);
    for (const s of set.stations) expect(`${s.name} ${s.provenance}`).toMatch(/invented/i);
    expect(set.stations.some((s) => s.position.latitude > 66.56)).toBe(true); // above the Arctic Circle
    expect(set.stations.some((s) => s.position.latitude < 0)).toBe(true);
    for (const s of set.stations) expect(suspiciousConstants(s, s.kind === 'secondary' ? set.byId.get(s.reference) : undefined)).toEqual([]);
  });
});

describe('suspicious constants', () => {
  const base: ReferenceStation = {
    id: 'x', name: 'X (invented)', kind: 'reference', position: { latitude: 47, longitude: -16 },
    timezone: 'UTC', datum: 'Chart Datum', provenance: 'test', mean_level: 2.3,
    constituents: { M2: { amplitude: 1.6, phase: 100 }, S2: { amplitude: 0.55, phase: 140 } },
    sourceFile: 'x.yaml',
  };

  it('accept a datum near the lowest tides', () => {
    expect(suspiciousConstants(base)).toEqual([]);
  });

  // For a pure M2 + S2 station the lowest tide is Z0 − (f·H_M2 + H_S2), with f(M2) between 0.9632 and
  // 1.0378 over the nodal cycle (Schureman 1958, REFERENCE-VALUES.md §3): 1.0 − (1.6f + 0.55). The scan
  // samples every 30 min, so it may miss the true lowest by up to 3 cm (½·h″·(¼ h)²): tolerance 0.03 m.
  it('flag a mean level that puts chart datum far above the lowest tides, with the mean level to write', () => {
    const [problem, ...rest] = suspiciousConstants({ ...base, mean_level: 1.0 });
    expect(rest).toEqual([]);
    expect(problem?.field).toBe('mean_level');
    const below = Number(/falls (\d+\.\d+) m below Chart Datum/.exec(problem?.problem ?? '')?.[1]);
    expect(below).toBeGreaterThanOrEqual(1.6 * 0.9632 + 0.55 - 1.0 - 0.03);
    expect(below).toBeLessThanOrEqual(1.6 * 1.0378 + 0.55 - 1.0 + 0.005);
    const suggested = Number(/raise mean_level to about (\d+\.\d+)/.exec(problem?.fix ?? '')?.[1]);
    expect(suggested).toBeCloseTo(1.0 + below + 0.05, 2);
  });

  it('flag a mean level that puts chart datum far below the lowest tides', () => {
    const [problem] = suspiciousConstants({ ...base, mean_level: 4.0 });
    const above = Number(/stays (\d+\.\d+) m above Chart Datum/.exec(problem?.problem ?? '')?.[1]);
    expect(above).toBeGreaterThanOrEqual(4.0 - (1.6 * 1.0378 + 0.55) - 0.005);
    expect(above).toBeLessThanOrEqual(4.0 - (1.6 * 0.9632 + 0.55) + 0.03);
    expect(problem?.fix).toContain('lower mean_level to about');
  });

  it('count the phases: an M4 overtide can deepen the lows past the datum, or lift them', () => {
    // M4's argument is twice M2's, so at M2 low water (M2 angle 180°) the M4 term is B·cos(2g_M2 − g_M4):
    // with g_M2 = 100°, g_M4 = 20° gives −B (lows deepened by 0.6 m), g_M4 = 200° gives +B.
    const withM4 = (phase: number): ReferenceStation => ({
      ...base,
      mean_level: 1.7,
      constituents: { ...base.constituents, M4: { amplitude: 0.6, phase } },
    });
    expect(suspiciousConstants(withM4(200))).toEqual([]);
    expect(suspiciousConstants(withM4(20)).map((p) => p.field)).toEqual(['mean_level']);
  });

  it('flag a missing M2 and amplitudes beyond any tide on Earth', () => {
    const problems = suspiciousConstants({
      ...base,
      mean_level: 60,
      constituents: { S2: { amplitude: 55, phase: 1 }, N2: { amplitude: 0.3, phase: 1 } },
    });
    // The datum is not judged again from an amplitude already flagged (it would only echo it).
    expect(problems.map((p) => p.field)).toEqual(['constituents.M2', 'constituents.S2.amplitude']);
  });
});
