import { Injectable } from '@nestjs/common';
import type { AnomalyCsvMapping, AnomalyProduct, AnomalyVariable, FieldKind } from '@stormhour/shared';
import type { JobContext, JobOutcome } from '../jobs/jobs.service.js';
import { SitesRepository } from '../radar/sites.repository.js';
import { AnomaliesRepository } from '../regimes/anomalies.repository.js';
import { checkOverlapsCoverage, UploadDates } from './anomaly-checks.js';
import { type ClimatologyField, subtractClimatology } from './anomaly-climatology.js';
import { parseAnomalyCsv } from './anomaly-csv.js';
import { type AnomalyFile, type AnomalyUnits, readAnomalyTiff } from './anomaly-reader.js';
import { FileProblem } from './geotiff-reader.js';
import { readEveryFile } from './read-phase.js';
import { UploadStore } from './upload-store.js';
import { UploadsRepository } from './uploads.repository.js';

export const ANOMALY_INTAKE_JOB = 'anomaly-intake';

export interface AnomalyIntakeParams {
  /** The site whose coverage the grids must overlap (jobs queued before this field have none). */
  siteId?: number;
  onError: 'fail' | 'skip';
  variable?: AnomalyVariable;
  units?: AnomalyUnits;
  product?: AnomalyProduct;
  fieldKind?: FieldKind;
  timePattern?: string;
  /** Long-form CSVs: the file's columns, variable names and date format. */
  csvMapping?: AnomalyCsvMapping;
  files: { uploadId: number; fileName: string; duplicate: boolean }[];
}

/** An uploaded file's fields as they will be stored: anomalies, with where they came from. */
interface ReadFields {
  fields: AnomalyFile[];
  /** Per field and day: the climatology file subtracted, when the upload held totals. */
  climatologyFile: (string | null)[][];
}

const bytesOf = (values: Float32Array) => Buffer.from(values.buffer, values.byteOffset, values.byteLength);

/**
 * Anomaly grids through the shared intake: every file read and checked first (coverage, dates, the
 * climatology for totals), then each stored in one transaction.
 */
@Injectable()
export class AnomalyIntakeHandler {
  constructor(
    private readonly uploads: UploadsRepository,
    private readonly store: UploadStore,
    private readonly anomalies: AnomaliesRepository,
    private readonly sites: SitesRepository,
  ) {}

  async run(p: AnomalyIntakeParams, ctx: JobContext): Promise<JobOutcome> {
    const product = p.product ?? 'analysis';
    const fieldKind = p.fieldKind ?? 'anomaly';
    const site = p.siteId === undefined ? undefined : await this.sites.find(p.siteId);
    const climatologies = new Map<string, ClimatologyField[]>();
    const climatologyOf = async (variable: AnomalyVariable, level: number) => {
      const key = `${variable}@${level}`;
      if (!climatologies.has(key)) climatologies.set(key, await this.anomalies.climatology(variable, level));
      return climatologies.get(key) as ClimatologyField[];
    };
    const uploadDates = new UploadDates();
    // A TIFF starts with II* or MM*; anything else is taken as long-form CSV.
    const isTiff = (c: Buffer) =>
      c.length > 4 && (c.toString('latin1', 0, 2) === 'II' || c.toString('latin1', 0, 2) === 'MM');
    const read = await readEveryFile<ReadFields>(
      p.files,
      p.onError,
      ctx,
      { uploads: this.uploads, store: this.store },
      async (content, fileName) => {
        if (!isTiff(content) && fieldKind === 'climatology')
          throw new FileProblem(
            null,
            'a climatology is taken as a GeoTIFF with one band per month or day of the year',
          );
        const fields = isTiff(content)
          ? [await readAnomalyTiff(content, { ...p, fileName })]
          : parseAnomalyCsv(content.toString('utf8'), {
              units: p.units,
              mapping: p.csvMapping,
              variable: p.variable,
            });
        if (site) for (const f of fields) checkOverlapsCoverage(f.grid, site);
        if (product === 'analysis' && fieldKind !== 'climatology') {
          const today = new Date().toISOString().slice(0, 10);
          for (const f of fields)
            for (const day of f.days)
              if (day.date > today)
                throw new FileProblem(
                  day.where,
                  `${day.date} is in the future: an analysis is of a past day; upload grids of coming days as product "forecast"`,
                );
        }
        const climatologyFile: (string | null)[][] = [];
        for (const f of fields) {
          const files: (string | null)[] = [];
          if (fieldKind === 'total') {
            const clim = await climatologyOf(f.variable, f.levelHpa);
            for (const day of f.days) {
              const done = subtractClimatology(day, day.where, f, clim);
              day.values = done.values;
              files.push(done.sourceFile);
            }
          } else files.push(...f.days.map(() => null));
          climatologyFile.push(files);
        }
        if (fieldKind !== 'climatology') uploadDates.check(fileName, fields);
        return { fields, climatologyFile };
      },
    );
    if (read.stopped) return read.stopped;
    const { files, todo, parsed, problems } = read;
    const summary: string[] = [];
    for (const [n, f] of todo.entries()) {
      const got = parsed.get(f.uploadId);
      if (!got) continue;
      await ctx.progress(0.5 + (0.5 * n) / todo.length, `Storing ${f.fileName}`);
      // Every field of a file, or none of them.
      await this.anomalies.transaction(async (tx) => {
        await this.uploads.markImported(f.uploadId, tx);
        for (const [k, file] of got.fields.entries())
          for (const [d, day] of file.days.entries()) {
            const grid = { ...file.grid, values: bytesOf(day.values), sourceFile: f.fileName };
            const common = { uploadId: f.uploadId, variable: file.variable, levelHpa: file.levelHpa };
            if (fieldKind === 'climatology')
              await this.anomalies.upsertClimatology({ ...common, key: day.date, ...grid }, tx);
            else
              await this.anomalies.upsert(
                {
                  ...common,
                  date: day.date,
                  ...grid,
                  product,
                  derivation: fieldKind === 'total' ? 'total-minus-climatology' : 'anomaly',
                  climatologyFile: got.climatologyFile[k][d],
                },
                tx,
              );
          }
      });
      f.state = 'imported';
      for (const [k, file] of got.fields.entries())
        summary.push(describe(f.fileName, file, product, got.climatologyFile[k]));
    }
    await ctx.setFiles(files);
    return { result: { summary: summary.join('; ') }, problems };
  }
}

/** One file's line of the job summary: what was stored, and what was done to the values to get there. */
function describe(
  fileName: string,
  file: AnomalyFile,
  product: AnomalyProduct,
  climatologyFiles: (string | null)[],
): string {
  const first = file.days[0]?.date;
  const last = file.days[file.days.length - 1]?.date;
  const steps = [file.conversion];
  if (file.reprojection) steps.push(file.reprojection);
  if (file.climatology)
    return `${fileName}: ${file.climatology} climatology of ${file.variable} at ${file.levelHpa} hPa, ${file.days.length} bands ${first}–${last}, ${steps.join(', ')}`;
  const subtracted = [...new Set(climatologyFiles.filter((c): c is string => c !== null))];
  const what = subtracted.length
    ? `anomalies computed as totals − climatology (${subtracted.join(', ')})`
    : 'anomalies';
  return `${fileName}: ${product} ${what} of ${file.variable} at ${file.levelHpa} hPa, ${file.days.length} days ${first}–${last}, ${steps.join(', ')}`;
}
