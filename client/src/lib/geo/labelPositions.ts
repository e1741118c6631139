export interface WeightedPoint {
  group: string;
  x: number;
  y: number;
  weight: number;
}

export interface GroupLabel {
  group: string;
  x: number;
  y: number;
}

/** Where to write each group's name: the weighted mean of its members' centres. */
export function groupLabelPositions(points: readonly WeightedPoint[]): GroupLabel[] {
  const sums = new Map<string, { x: number; y: number; weight: number }>();
  for (const point of points) {
    if (!Number.isFinite(point.x) || !Number.isFinite(point.y) || point.weight <= 0) continue;
    const sum = sums.get(point.group) ?? { x: 0, y: 0, weight: 0 };
    sum.x += point.x * point.weight;
    sum.y += point.y * point.weight;
    sum.weight += point.weight;
    sums.set(point.group, sum);
  }
  return [...sums].map(([group, sum]) => ({ group, x: sum.x / sum.weight, y: sum.y / sum.weight }));
}
