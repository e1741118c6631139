/** One thing wrong with one input: which file, and where in it (row, column, band, feature). */
export interface JobProblem {
  file: string;
  where: string | null;
  problem: string;
}

/** A file a job was given, and what became of it. */
export interface JobFile {
  uploadId: number;
  fileName: string;
  sizeBytes: number;
  duplicate: boolean;
  state: 'waiting' | 'imported' | 'skipped' | 'failed' | 'duplicate';
}
