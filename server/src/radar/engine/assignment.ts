import { linearSumAssignment } from 'linear-sum-assignment';

/** Cost of a pair that must never be made (outside the speed gate). Finite: the solver needs numbers. */
export const FORBIDDEN = 1e12;

export interface Assignment {
  /** [row, column] pairs, every one allowed. */
  pairs: [number, number][];
  cost: number;
}

/**
 * Optimal one-to-one assignment minimising total cost (the linear sum assignment problem solved by
 * Kuhn's Hungarian method, Munkres 1957); the solver used is the Jonker–Volgenant shortest augmenting
 * path method as set out by Crouse (2016), which finds the same optimum and also takes rectangular
 * matrices. Pairs at FORBIDDEN cost are dropped afterwards, so gated pairs are never returned.
 */
export function assign(cost: number[][]): Assignment {
  if (cost.length === 0 || cost[0].length === 0) return { pairs: [], cost: 0 };
  const { rowAssignments } = linearSumAssignment(cost, { maximaze: false });
  const pairs: [number, number][] = [];
  let total = 0;
  rowAssignments.forEach((col, row) => {
    if (col < 0 || cost[row][col] >= FORBIDDEN) return;
    pairs.push([row, col]);
    total += cost[row][col];
  });
  return { pairs, cost: total };
}
