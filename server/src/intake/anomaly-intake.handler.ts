import { Injectable } from '@nestjs/common';
import type { AnomalyVariable } from '@stormhour/shared';
import type { JobContext, JobOutcome } from '../jobs/jobs.service.js';
import { AnomaliesRepository } from '../regimes/anomalies.repository.js';
import { parseAnomalyCsv } from './anomaly-csv.js';
import { type AnomalyUnits, readAnomalyTiff } from './anomaly-reader.js';
import { readEveryFile } from './read-phase.js';
import { UploadStore } from './upload-store.js';
import { UploadsRepository } from './uploads.repository.js';

export const ANOMALY_INTAKE_JOB = 'anomaly-intake';

export interface AnomalyIntakeParams {
  onError: 'fail' | 'skip';
  variable?: AnomalyVariable;
  units?: AnomalyUnits;
  files: { uploadId: number; fileName: string; duplicate: boolean }[];
}

/** Anomaly grids through the shared intake: every file read first, then each stored in one transaction. */
@Injectable()
export class AnomalyIntakeHandler {
  constructor(
    private readonly uploads: UploadsRepository,
    private readonly store: UploadStore,
    private readonly anomalies: AnomaliesRepository,
  ) {}

  async run(p: AnomalyIntakeParams, ctx: JobContext): Promise<JobOutcome> {
    // A TIFF starts with II* or MM*; anything else is taken as long-form CSV.
    const isTiff = (c: Buffer) =>
      c.length > 4 && (c.toString('latin1', 0, 2) === 'II' || c.toString('latin1', 0, 2) === 'MM');
    const read = await readEveryFile(
      p.files,
      p.onError,
      ctx,
      { uploads: this.uploads, store: this.store },
      async (content) =>
        isTiff(content)
          ? [await readAnomalyTiff(content, p)]
          : parseAnomalyCsv(content.toString('utf8'), p.units),
    );
    if (read.stopped) return read.stopped;
    const { files, todo, parsed, problems } = read;
    const summary: string[] = [];
    for (const [n, f] of todo.entries()) {
      const fields = parsed.get(f.uploadId);
      if (!fields) continue;
      await ctx.progress(0.5 + (0.5 * n) / todo.length, `Storing ${f.fileName}`);
      // Every field of a file, or none of them.
      await this.anomalies.transaction(async (tx) => {
        await this.uploads.markImported(f.uploadId, tx);
        for (const file of fields)
          for (const day of file.days) {
            await this.anomalies.upsert(
              {
                uploadId: f.uploadId,
                variable: file.variable,
                levelHpa: file.levelHpa,
                date: day.date,
                ...file.grid,
                values: Buffer.from(day.values.buffer, day.values.byteOffset, day.values.byteLength),
                sourceFile: f.fileName,
              },
              tx,
            );
          }
      });
      f.state = 'imported';
      for (const file of fields) {
        const first = file.days[0]?.date;
        const last = file.days[file.days.length - 1]?.date;
        summary.push(
          `${f.fileName}: ${file.variable} at ${file.levelHpa} hPa, ${file.days.length} days ${first}–${last}, ${file.conversion}`,
        );
      }
    }
    await ctx.setFiles(files);
    return { result: { summary: summary.join('; ') }, problems };
  }
}
