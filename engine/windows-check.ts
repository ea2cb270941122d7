// `tidewright check` on access windows: a level the tide never reaches (or never leaves) over the
// station's whole datum epoch is almost surely a slip, since that window would never open (or close).
import { stationDatums } from './datums.js';
import { StationFileError } from './errors.js';
import { sideAndLevel } from './almanac/windows.js';
import type { StationLookup } from './tides.js';
import type { Station } from './types.js';

/** One problem per window whose level lies outside LAT..HAT of the station's 19-year epoch. */
export function windowLevelProblems(station: Station, set: StationLookup): StationFileError[] {
  const windows = station.windows ?? [];
  if (windows.length === 0) return [];
  const { LAT, HAT, epoch } = stationDatums(station, set).datums;
  const file = station.sourceFile ?? station.id;
  const span = `LAT ${LAT.toFixed(2)} m to HAT ${HAT.toFixed(2)} m (${epoch.from}–${epoch.to})`;
  const problems: StationFileError[] = [];
  windows.forEach((spec, i) => {
    const { side, level } = sideAndLevel(spec);
    const never = side === 'above' ? level > HAT : level < LAT;
    const always = side === 'above' ? level <= LAT : level >= HAT;
    if (!never && !always) return;
    const effect = never ? 'never opens' : 'never closes';
    problems.push(new StationFileError(file, `windows.${i}.${side}`,
      `${level} m is outside the predicted range ${span}, so "${spec.name}" ${effect}`,
      `write a level between ${LAT.toFixed(2)} and ${HAT.toFixed(2)} m above ${station.datum}`));
  });
  return problems;
}
