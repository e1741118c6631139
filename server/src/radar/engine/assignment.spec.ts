import { describe, expect, it } from 'vitest';
import { assign, FORBIDDEN } from './assignment.js';

describe('assign (optimal linear sum assignment)', () => {
  it('solves the scipy documentation example: columns [1, 0, 2], cost 5', () => {
    // scipy.optimize.linear_sum_assignment documentation example (REFERENCES §8, published).
    const r = assign([
      [4, 1, 3],
      [2, 0, 5],
      [3, 2, 2],
    ]);
    expect(r.pairs).toEqual([
      [0, 1],
      [1, 0],
      [2, 2],
    ]);
    expect(r.cost).toBe(5);
  });

  it.each([
    // REFERENCES §8: two optima tie at 12, so only the cost is checked.
    [
      [
        [5, 9, 1],
        [10, 3, 2],
        [8, 7, 4],
      ],
      12,
    ],
    // REFERENCES §8 (computed): unique optimum 0→2, 1→1, 2→0.
    [
      [
        [1, 2, 3],
        [2, 4, 6],
        [3, 6, 9],
      ],
      10,
    ],
    // Rectangular, REFERENCES §8 (computed).
    [
      [
        [4, 1, 3],
        [2, 0, 5],
      ],
      3,
    ],
  ])('finds the optimal cost of %j', (matrix, cost) => {
    expect(assign(matrix).cost).toBe(cost);
  });

  it('never returns a forbidden pair, even when that leaves a row unassigned', () => {
    const r = assign([
      [1, FORBIDDEN],
      [FORBIDDEN, FORBIDDEN],
    ]);
    expect(r.pairs).toEqual([[0, 0]]);
  });

  it('handles an empty side', () => {
    expect(assign([])).toEqual({ pairs: [], cost: 0 });
    expect(assign([[]])).toEqual({ pairs: [], cost: 0 });
  });
});
