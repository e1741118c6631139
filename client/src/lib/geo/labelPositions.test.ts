import { describe, expect, it } from 'vitest';
import { groupLabelPositions } from './labelPositions';

describe('groupLabelPositions', () => {
  it.each([
    // Weighted arithmetic mean, Σwx/Σw (common practice).
    [
      'equal weights',
      [
        [0, 0, 1],
        [10, 20, 1],
      ],
      { x: 5, y: 10 },
    ],
    [
      'a larger block pulls the label',
      [
        [0, 0, 3],
        [8, 4, 1],
      ],
      { x: 2, y: 1 },
    ],
    [
      'empty or unprojectable members are skipped',
      [
        [0, 0, 0],
        [6, 6, 2],
        [Number.NaN, 1, 5],
      ],
      { x: 6, y: 6 },
    ],
  ])('%s', (_name, members, expected) => {
    const points = members.map(([x, y, weight]) => ({ group: 'Riverbend', x, y, weight }));
    expect(groupLabelPositions(points)).toEqual([{ group: 'Riverbend', ...expected }]);
  });

  it('gives one label per group', () => {
    const labels = groupLabelPositions([
      { group: 'Riverbend', x: 1, y: 1, weight: 1 },
      { group: 'Upland', x: 9, y: 9, weight: 1 },
      { group: 'Riverbend', x: 3, y: 3, weight: 1 },
    ]);
    expect(labels).toEqual([
      { group: 'Riverbend', x: 2, y: 2 },
      { group: 'Upland', x: 9, y: 9 },
    ]);
  });
});
