/**
 * @stormhour/sample-data — the Vessary demo scenario generator.
 *
 *   const sc = generateScenario({ seed: 2031, days: 122 });
 *   const vol = renderVolume(sc, sc.run.steps[0]);   // any nominal scan index of the season
 *   writeScenario(sc, 'sample-data/out/x');
 */
export * from './anomalies.js';
export type { BlockFeature, BlockGeometry, BlocksCollection, Position } from './blocks.js';
export { districtRegion, generateBlocks, polygonsOf } from './blocks.js';
export type { CellMeasure } from './cellprops.js';
export { coreDbz, fieldDbz, measureCell, vilKgM2 } from './cellprops.js';
export * from './config.js';
export { cropCalendarCsv } from './crop-calendars.js';
export { aeqdProj4, polygonAreaKm2, RadarProjection, ringAreaKm2 } from './geo.js';
export { BLOCK_NAMES, DISTRICTS } from './names.js';
export { Rng, ValueNoise } from './prng.js';
export { pointInRing, provinceOutline } from './province.js';
export * from './readers.js';
export type { RadarGridSpec, RenderedVolume } from './render.js';
export {
  columnMax,
  dbzToRaw,
  interleave,
  pixelCentreKm,
  radarGrid,
  rawToDbz,
  renderVolume,
} from './render.js';
export type { RadarRun, Scenario, ScenarioOptions } from './scenario.js';
export { generateScenario } from './scenario.js';
export * from './stats.js';
export type { BirthKind, CellState, ModelCell } from './storms.js';
export { dayFactor, envelope, semiMajor, simulateStorms } from './storms.js';
export { TERRAIN_CLASSES, Terrain } from './terrain.js';
export type { GdalItem, GeoTiffSpec } from './tiff.js';
export { aeqdKeys, encodeGeoTiff, GEOKEY, gdalMetadataXml, geographicKeys } from './tiff.js';
export * from './times.js';
export type { TableCell, Track } from './tracks.js';
export { exportTracks } from './tracks.js';
export type { WriteOptions, WriteResult, WrittenFile } from './write.js';
export { createSiteRequest, GENERATOR_VERSION, siteJson, volumeSteps, writeScenario } from './write.js';
