// The set-wide checks of stream stations: ids unique among all stations of the folder, each
// stream-secondary station's reference a stream station (kind: stream), each tide_reference a tide station.

import { StationFileError } from '../errors.js';
import type { Station } from '../types.js';
import type { AnyStreamStation } from '../streams/types.js';
import { nearestName } from './suggest.js';

export function streamSetProblems(
  dir: string,
  stations: readonly Station[],
  streams: readonly AnyStreamStation[],
  failedIds: ReadonlyMap<string, string>,
): StationFileError[] {
  const problems: StationFileError[] = [];
  const ids = new Map<string, string>(stations.map((s) => [s.id, s.sourceFile ?? 'another station']));
  const unique: AnyStreamStation[] = [];
  for (const stream of streams) {
    const other = ids.get(stream.id);
    if (other !== undefined) {
      problems.push(new StationFileError(stream.sourceFile ?? dir, 'id', `"${stream.id}" is also the id of ${other}`, 'give each station its own id (file names and web addresses are made from it)'));
      continue;
    }
    ids.set(stream.id, stream.sourceFile ?? 'another station');
    unique.push(stream);
  }
  const referenceStreams = unique.filter((s) => s.kind === 'stream').map((s) => s.id);
  const tideIds = stations.map((s) => s.id);
  for (const stream of unique) {
    const file = stream.sourceFile ?? dir;
    if (stream.kind === 'stream-secondary' && !failedIds.has(stream.reference)) {
      const target = unique.find((s) => s.id === stream.reference);
      if (stream.reference === stream.id) {
        problems.push(new StationFileError(file, 'reference', `names the station itself ("${stream.id}")`, 'write the id of a stream station (kind: stream) in the same folder'));
      } else if (!target) {
        const nearest = nearestName(stream.reference, referenceStreams);
        const fix = nearest
          ? `did you mean ${nearest}? write reference: ${nearest}`
          : referenceStreams.length > 0
            ? `write the id of one of the stream stations here: ${referenceStreams.join(', ')}`
            : 'add the reference stream station\'s file (kind: stream) to this folder';
        const what = tideIds.includes(stream.reference) ? `"${stream.reference}" is a tide station, not a stream station` : `no stream station in ${dir} has the id "${stream.reference}"`;
        problems.push(new StationFileError(file, 'reference', what, fix));
      } else if (target.kind !== 'stream') {
        problems.push(new StationFileError(file, 'reference', `"${target.id}" is itself a stream-secondary station; differences are only taken from a stream station with constants`, 'write the id of a station of kind: stream'));
      }
    }
    const tide = stream.tide_reference;
    if (tide !== undefined && !tideIds.includes(tide) && !failedIds.has(tide)) {
      const nearest = nearestName(tide, tideIds);
      problems.push(new StationFileError(file, 'tide_reference', `no tide station in ${dir} has the id "${tide}"`, nearest ? `did you mean ${nearest}? write tide_reference: ${nearest}` : 'write the id of a reference or secondary port in the same folder, or leave tide_reference out'));
    }
  }
  return problems;
}
