import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkBlocksFile } from './block-import.js';

const fixture = (name: string) =>
  readFileSync(new URL(`../../../tests/fixtures/${name}`, import.meta.url), 'utf8');

describe('checkBlocksFile', () => {
  it('accepts a valid file and keeps every block with its district', () => {
    const result = checkBlocksFile(fixture('blocks-valid.geojson'));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.blocks.map((b) => b.code)).toEqual(['TFA-01', 'TFA-02', 'TFB-01', 'TFB-02']);
    expect(result.blocks[3]).toMatchObject({
      districtCode: 'TFB',
      districtName: 'Stonecrest',
      name: 'Twin Spurs',
    });
    expect(result.blocks[3].geometry.type).toBe('MultiPolygon');
  });

  it('names every bad feature of the broken fixture and the reason', () => {
    const result = checkBlocksFile(fixture('blocks-broken.geojson'));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const byFeature = new Map<number, string[]>();
    for (const p of result.problems)
      byFeature.set(p.feature, [...(byFeature.get(p.feature) ?? []), p.reason]);
    expect([...byFeature.keys()].sort()).toEqual([1, 2, 3, 4, 5, 6]);
    expect(byFeature.get(1)?.join()).toMatch(/crosses itself/);
    expect(byFeature.get(2)?.join()).toMatch(/not closed/);
    expect(byFeature.get(3)?.join()).toMatch(/latitude 91/);
    expect(byFeature.get(4)?.join()).toMatch(/block_code is missing/);
    expect(byFeature.get(5)?.join()).toMatch(/Point; blocks must be Polygon or MultiPolygon/);
    expect(byFeature.get(6)?.join()).toMatch(/TFA-01 is also used by feature 0/);
  });

  it.each([
    ['text that is not JSON', 'hello', /not JSON/],
    ['a TopoJSON file', fixture('not-geojson.geojson'), /not a GeoJSON FeatureCollection/],
    ['an empty collection', '{"type":"FeatureCollection","features":[]}', /no features/],
  ])('refuses %s as a whole', (_what, text, message) => {
    const result = checkBlocksFile(text);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.fileProblem).toMatch(message);
  });

  it.each([
    [
      'a ring of three positions',
      [
        [
          [0, 0],
          [1, 0],
          [0, 0],
        ],
      ],
      /needs at least 4/,
    ],
    [
      'a longitude beyond 180',
      [
        [
          [0, 0],
          [181, 0],
          [1, 1],
          [0, 0],
        ],
      ],
      /longitude 181/,
    ],
    [
      'a text coordinate',
      [
        [
          [0, 0],
          ['1', 0],
          [1, 1],
          [0, 0],
        ],
      ],
      /not a \[longitude, latitude\] pair/,
    ],
  ])('refuses %s', (_what, coordinates, message) => {
    const feature = {
      type: 'Feature',
      properties: {
        district_code: 'TFA',
        district_name: 'Fernwater',
        block_code: 'TFA-09',
        block_name: 'Test',
      },
      geometry: { type: 'Polygon', coordinates },
    };
    const result = checkBlocksFile(JSON.stringify({ type: 'FeatureCollection', features: [feature] }));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0].reason).toMatch(message);
  });

  it('refuses one district code carrying two names', () => {
    const base = JSON.parse(fixture('blocks-valid.geojson'));
    base.features[1].properties.district_name = 'Fernwater East';
    const result = checkBlocksFile(JSON.stringify(base));
    expect(result.ok).toBe(false);
    if (!result.ok)
      expect(result.problems[0]).toMatchObject({
        feature: 1,
        reason: expect.stringMatching(/named "Fernwater East" here but "Fernwater" in feature 0/),
      });
  });

  it('refuses codes with lower-case letters or spaces', () => {
    const base = JSON.parse(fixture('blocks-valid.geojson'));
    base.features[0].properties.block_code = 'tfa 01';
    const result = checkBlocksFile(JSON.stringify(base));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0].reason).toMatch(/block_code "tfa 01" is not a valid code/);
  });
});
