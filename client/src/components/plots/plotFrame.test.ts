import { describe, expect, it } from 'vitest';
import { innerSize, labelledIndexes } from './plotFrame';

describe('labelledIndexes', () => {
  it.each([
    [0, 8, []],
    [5, 8, [0, 1, 2, 3, 4]],
    [20, 8, [0, 3, 6, 9, 12, 15, 18]],
    [9, 3, [0, 3, 6]],
  ])('%i categories, at most %i labels → %j', (count, max, indexes) => {
    expect(labelledIndexes(count, max)).toEqual(indexes);
    expect(indexes.length).toBeLessThanOrEqual(max);
  });
});

describe('innerSize', () => {
  it('leaves the margins for the axes', () => {
    expect(innerSize({ width: 480, height: 220 })).toEqual({ w: 408, h: 152 });
  });
});
