// Station files: zod schema, YAML loader, station sets with references resolved, and the checks
// behind `tidewright check`. Every rejection is a StationFileError naming file, field and fix.

export { parseStation, parseAnyStation, checkStationText, type StationFileCheck } from './stations/parse.js';
export {
  loadStationFile,
  loadAnyStationFile,
  loadStationSet,
  checkStationSet,
  setProblems,
  stationFilesIn,
  PROJECT_FILE_NAME,
  type StationSet,
  type StationSetCheck,
} from './stations/set.js';
export { suspiciousConstants, distanceKm, lowestOfYear } from './stations/suspicious.js';
export { STATION_ID_PATTERN, DEFAULT_DATUM_EPOCH, idFromText, TEXT_LIMITS } from './stations/schema.js';
export { MAX_STATION_FILE_BYTES } from './stations/set.js';
export { nearestName } from './stations/suggest.js';
