// The public surface of the engine: re-exports only (whoever adds a module adds its line).
export * from './localtime.js';
export * from './stations.js';
export * from './sky.js';
export * from './astro.js';
export * from './constituents.js';
export * from './nodal.js';
export * from './predict.js';
export * from './extrema.js';
export * from './analysis.js';
export * from './secondary.js';
export * from './difference-example.js';
export * from './tides.js';
export * from './datums.js';
export * from './springneap.js';
export * from './almanac.js';
export * from './windows.js';
export * from './streams.js';
export * from './errors.js';
export * from './item.js';
export type * from './types.js';
export type { OffsetChange } from './types.js'; // the same shape as localtime's, named once
export * from './windows-check.js';
export { mm } from './almanac/format.js';
export * from './context.js';
export * from './read-text.js';
