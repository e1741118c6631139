import { describe, expect, it } from 'vitest';
import { aBlock } from '../../../test/builders';
import { filterBlocks, formatArea, importSummary, isBoundaryFile } from './blockList';

const blocks = [
  aBlock({ id: 1, code: 'RVB-01', name: 'Sallow Ford', districtId: 1 }),
  aBlock({ id: 2, code: 'RVB-02', name: 'Marrow Bend', districtId: 1 }),
  aBlock({ id: 3, code: 'LKS-01', name: 'Reedmere', districtId: 2 }),
];

describe('filterBlocks', () => {
  it.each([
    ['everything', '', null, [1, 2, 3]],
    ['by code, any case', 'rvb', null, [1, 2]],
    ['by part of the name', 'mere', null, [3]],
    ['by district', '', 2, [3]],
    ['by both', 'ford', 2, []],
    ['ignoring surrounding spaces', '  bend ', null, [2]],
  ])('%s', (_name, query, districtId, ids) => {
    expect(filterBlocks(blocks, { query, districtId }).map((b) => b.id)).toEqual(ids);
  });
});

describe('formatArea', () => {
  // ECMA-402 Intl.NumberFormat, English: thousands grouped by commas, halfExpand rounding.
  it.each([
    [0, '0.0'],
    [12.34, '12.3'],
    [12.35, '12.4'],
    [1234.56, '1,234.6'],
  ])('%d km² → %s', (km2, text) => {
    expect(formatArea(km2)).toBe(text);
  });
});

describe('importSummary', () => {
  it.each([
    [
      { blocksCreated: 5, blocksUpdated: 2, districtsCreated: 1 },
      'Imported: 5 blocks created, 2 updated, 1 district created',
    ],
    [
      { blocksCreated: 1, blocksUpdated: 0, districtsCreated: 0 },
      'Imported: 1 block created, 0 updated, 0 districts created',
    ],
  ])('%o', (result, text) => {
    expect(importSummary(result)).toBe(text);
  });
});

describe('isBoundaryFile', () => {
  it.each([
    ['blocks.geojson', true],
    ['BLOCKS.JSON', true],
    ['blocks.geojson.zip', false],
    ['blocks.csv', false],
  ])('%s → %s', (name, ok) => {
    expect(isBoundaryFile(name)).toBe(ok);
  });
});
