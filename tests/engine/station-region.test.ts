// The optional `region:` key: read as written for every kind of station, refused in one line when empty
// or too long, and suggested when misspelt.
import { describe, expect, it } from 'vitest';
import { parseAnyStation, parseStation, StationFileError } from '../../engine/index.js';

const REFERENCE = `id: quay
name: Quay (invented)
kind: reference
position: { latitude: 10, longitude: -30 }
timezone: Atlantic/Cape_Verde
datum: Chart Datum
mean_level: 2
constituents:
  M2: { amplitude: 1, phase: 100 }
provenance: Invented
`;
const STREAM = `id: narrows
name: Narrows (invented)
kind: stream
position: { latitude: 10, longitude: -30 }
timezone: Atlantic/Cape_Verde
flood_direction: 75
unit: kn
constituents:
  M2: { major: 2, minor: 0.1, inclination: 15, phase: 110 }
provenance: Invented
`;

const problem = (text: string): string => {
  try {
    parseStation(text, 'quay.yaml');
  } catch (e) {
    if (e instanceof StationFileError) return e.message;
    throw e;
  }
  return '';
};

describe('region: in a station file', () => {
  it('is read as written by tide and stream stations, and absent when left out', () => {
    expect(parseStation(`${REFERENCE}region: "Outer Skerries"\n`, 'quay.yaml')).toMatchObject({ region: 'Outer Skerries' });
    expect(parseAnyStation(`${STREAM}region: Sound\n`, 'narrows.yaml')).toMatchObject({ region: 'Sound' });
    expect(parseStation(REFERENCE, 'quay.yaml')).not.toHaveProperty('region');
  });

  it.each([
    ['region: ""\n', /^quay\.yaml: region: is empty; write some text/],
    [`region: ${'x'.repeat(121)}\n`, /^quay\.yaml: region: is 121 characters long, more than the 120 allowed/],
    ['regoin: North\n', /^quay\.yaml: .*region/],
  ])('refuses %j in one line naming the field', (extra, message) => {
    expect(problem(REFERENCE + extra)).toMatch(message);
  });
});
