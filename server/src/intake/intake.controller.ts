import { Body, Controller, HttpCode, Post, UploadedFiles, UseInterceptors } from '@nestjs/common';
import { AnyFilesInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiTags } from '@nestjs/swagger';
import { IntakeRequest, type SessionUser } from '@stormhour/shared';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { zodBody } from '../common/zod-validation.pipe.js';
import { type IncomingFile, IntakeService } from './intake.service.js';

@ApiTags('intake')
@ApiBearerAuth()
@Controller('intake')
@Roles('scientist')
export class IntakeController {
  constructor(private readonly intake: IntakeService) {}

  /** Answers at once with the job; the client follows its progress at /api/jobs/:id. */
  @Post()
  @HttpCode(202)
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['siteId', 'kind', 'files[]'],
      properties: {
        'files[]': { type: 'array', items: { type: 'string', format: 'binary' } },
        siteId: { type: 'integer' },
        kind: { type: 'string', enum: ['volume', 'column-max', 'cell-table', 'scan-inventory'] },
        onError: { type: 'string', enum: ['fail', 'skip'] },
        mapping: { type: 'string', description: 'JSON column mapping for cell tables' },
        timePattern: { type: 'string', description: 'file-name time pattern, e.g. VSR_YYYYMMDD_hhmm.tif' },
      },
    },
  })
  @UseInterceptors(AnyFilesInterceptor())
  async submit(
    @CurrentUser() actor: SessionUser,
    @Body(zodBody(IntakeRequest)) body: IntakeRequest,
    @UploadedFiles() files: (IncomingFile & { fieldname: string })[] = [],
  ) {
    const { job } = await this.intake.submit(
      actor,
      body,
      files.filter((f) => f.fieldname === 'files[]' || f.fieldname === 'files'),
    );
    return job;
  }
}
