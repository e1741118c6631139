/** One thing wrong with one input: which file, and where in it (row, column, band, feature). */
export interface JobProblem {
  file: string;
  where: string | null;
  problem: string;
}
