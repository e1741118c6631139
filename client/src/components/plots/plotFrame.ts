/** Room around the drawing for the axes and their titles, in SVG units. */
export const MARGIN = { top: 24, right: 16, bottom: 44, left: 56 } as const;

export interface PlotSize {
  width: number;
  height: number;
}

export function innerSize({ width, height }: PlotSize) {
  return { w: width - MARGIN.left - MARGIN.right, h: height - MARGIN.top - MARGIN.bottom };
}

/** Indexes of the category labels to print so that at most `maxLabels` show, evenly spread. */
export function labelledIndexes(count: number, maxLabels: number): number[] {
  if (count <= 0) return [];
  const step = Math.max(1, Math.ceil(count / Math.max(1, maxLabels)));
  const indexes: number[] = [];
  for (let i = 0; i < count; i += step) indexes.push(i);
  return indexes;
}
