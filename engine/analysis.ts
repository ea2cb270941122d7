// Harmonic analysis of gauge records into station files: the public surface of engine/analysis/.
// Least squares with the engine's own nodal corrections; the Rayleigh criterion chooses the
// constituents; secondary-port differences from a short record against a reference port.

export { parseRecord, type GaugeRecord } from './analysis/record.js';
export { summariseRecord, checkAnalysable, type RecordSummary, type RecordGap } from './analysis/coverage.js';
export {
  selectConstituents, separationHours, ANALYSIS_CANDIDATES,
  type ConstituentSelection, type ExcludedConstituent, type SelectionOptions,
} from './analysis/rayleigh.js';
export { INFERENCE_RULES, applicableInferences, type InferenceRule } from './analysis/inference.js';
export { analyseRecord, type AnalysedConstituent, type AnalysisOptions, type HarmonicAnalysis } from './analysis/harmonic.js';
export type { ResidualStatistics } from './analysis/statistics.js';
export { recordExtrema, type RecordExtremaOptions } from './analysis/record-extrema.js';
export { analyseDifferences, type DifferenceAnalysis, type DifferenceOptions, type MatchedEvent } from './analysis/differences.js';
export type { DifferenceFit } from './analysis/difference-fit.js';
export { referenceStationFrom, referenceStationYaml, type StationMeta } from './analysis/station-yaml.js';
export { secondaryStationFrom, secondaryStationYaml } from './analysis/secondary-yaml.js';
