import { BadRequestException, Injectable, type OnModuleInit } from '@nestjs/common';
import {
  AnomalyCsvMapping,
  CellTableMapping,
  type IntakeRequest,
  type JobView,
  type SessionUser,
} from '@stormhour/shared';
import type { z } from 'zod';
import { AuditService } from '../audit/audit.service.js';
import type { JobFile } from '../jobs/job-problem.js';
import { JobsService } from '../jobs/jobs.service.js';
import { SitesRepository } from '../radar/sites.repository.js';
import {
  ANOMALY_INTAKE_JOB,
  AnomalyIntakeHandler,
  type AnomalyIntakeParams,
} from './anomaly-intake.handler.js';
import { RADAR_INTAKE_JOB, RadarIntakeHandler, type RadarIntakeParams } from './radar-intake.handler.js';
import { UploadStore } from './upload-store.js';
import { UploadsRepository } from './uploads.repository.js';

export interface IncomingFile {
  originalname: string;
  buffer: Buffer;
  size: number;
}

/** Takes uploads in: stores each file once by content, then hands the work to a job. */
@Injectable()
export class IntakeService implements OnModuleInit {
  constructor(
    private readonly uploads: UploadsRepository,
    private readonly store: UploadStore,
    private readonly sites: SitesRepository,
    private readonly jobs: JobsService,
    private readonly audit: AuditService,
    private readonly radarIntake: RadarIntakeHandler,
    private readonly anomalyIntake: AnomalyIntakeHandler,
  ) {}

  onModuleInit(): void {
    this.jobs.register(RADAR_INTAKE_JOB, (params, ctx) =>
      this.radarIntake.run(params as unknown as RadarIntakeParams, ctx),
    );
    this.jobs.register(ANOMALY_INTAKE_JOB, (params, ctx) =>
      this.anomalyIntake.run(params as unknown as AnomalyIntakeParams, ctx),
    );
  }

  async submit(
    actor: SessionUser | null,
    req: IntakeRequest,
    files: IncomingFile[],
  ): Promise<{ job: JobView; done: Promise<void> }> {
    if (files.length === 0) {
      throw new BadRequestException({
        message: 'Attach one or more files as the multipart field "files[]".',
        details: [{ where: 'files', problem: 'missing' }],
      });
    }
    const site = await this.sites.find(req.siteId);
    if (!site) {
      throw new BadRequestException({
        message: `There is no radar site with id ${req.siteId}.`,
        details: [{ where: 'siteId', problem: 'no such site' }],
      });
    }
    const mapping = req.kind === 'cell-table' ? parseMapping(CellTableMapping, req.mapping) : undefined;
    const csvMapping =
      req.kind === 'anomaly-grid' && req.mapping ? parseMapping(AnomalyCsvMapping, req.mapping) : undefined;

    const jobFiles: JobFile[] = [];
    const uploadIds: number[] = [];
    for (const file of files) {
      const sha256 = await this.store.save(file.buffer);
      const known = await this.uploads.findByContent(site.id, req.kind, sha256);
      const duplicate = Boolean(known?.importedAt);
      const upload =
        known ??
        (await this.uploads.insert({
          siteId: site.id,
          kind: req.kind,
          fileName: file.originalname,
          sha256,
          sizeBytes: file.size,
        }));
      // The same content twice in one upload counts once.
      if (!duplicate && uploadIds.includes(upload.id)) continue;
      if (!duplicate) uploadIds.push(upload.id);
      jobFiles.push({
        uploadId: upload.id,
        fileName: file.originalname,
        sizeBytes: file.size,
        duplicate,
        state: duplicate ? 'duplicate' : 'waiting',
      });
    }
    const fileRefs = jobFiles.map((f) => ({
      uploadId: f.uploadId,
      fileName: f.fileName,
      duplicate: f.duplicate,
    }));
    const [jobKind, params] =
      req.kind === 'anomaly-grid'
        ? [
            ANOMALY_INTAKE_JOB,
            {
              siteId: site.id,
              onError: req.onError,
              variable: req.variable,
              units: req.units,
              product: req.product,
              fieldKind: req.fieldKind,
              timePattern: req.timePattern,
              csvMapping,
              files: fileRefs,
            } satisfies AnomalyIntakeParams,
          ]
        : [
            RADAR_INTAKE_JOB,
            {
              siteId: site.id,
              kind: req.kind,
              onError: req.onError,
              mapping,
              timePattern: req.timePattern,
              settingsVersion: site.settingsVersion,
              files: fileRefs,
            } satisfies RadarIntakeParams,
          ];
    const queued = await this.jobs.enqueue(
      jobKind,
      params as unknown as Record<string, unknown>,
      actor?.id ?? null,
      jobFiles,
    );
    await this.uploads.attachToJob(uploadIds, queued.job.id);
    await this.audit.record(actor, 'intake.upload', `job:${queued.job.id}`, {
      siteId: site.id,
      kind: req.kind,
      files: jobFiles.map((f) => f.fileName),
    });
    return queued;
  }

  /** Reads an uploaded file's content for the job that processes it. */
  read(sha256: string): Promise<Buffer> {
    return this.store.read(sha256);
  }
}

/** The `mapping` field read against its schema; every problem named by its path in the mapping. */
function parseMapping<T extends z.ZodType>(schema: T, text: string | undefined): z.output<T> {
  if (!text) return schema.parse({ columns: {} });
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new BadRequestException({
      message: 'The field "mapping" is not valid JSON.',
      details: [{ where: 'mapping', problem: 'not JSON' }],
    });
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    const details = parsed.error.issues.map((i) => ({
      where: ['mapping', ...i.path].join('.'),
      problem: i.message,
    }));
    throw new BadRequestException({
      message: `The column mapping is not valid: ${details.map((d) => `${d.where}: ${d.problem}`).join('; ')}`,
      details,
    });
  }
  return parsed.data;
}
