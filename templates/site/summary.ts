// What the site's shared pages (index, map, search, imprint) and the combined volumes' plan need of a
// station-year: a few kilobytes instead of its whole model (about 3 MiB), so a build of any size keeps
// only these in memory and reads each model from disk when its own pages are drawn.
import type { Datums, StationYear, TideType } from '../../engine/index.js';

export interface StationYearSummary {
  station: StationYear['station'];
  year: number;
  timezone: string;
  invented: boolean;
  reference: StationYear['reference'];
  tideType: Pick<TideType, 'kind'>;
  datums: { epoch: Datums['epoch'] };
  generator: StationYear['generator'];
}

export function summaryOf(model: StationYear): StationYearSummary {
  return {
    station: model.station, year: model.year, timezone: model.timezone, invented: model.invented, reference: model.reference,
    tideType: { kind: model.tideType.kind }, datums: { epoch: model.datums.epoch }, generator: model.generator,
  };
}
