import { Controller, Get, Param, ParseIntPipe, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { z } from 'zod';
import { Roles } from '../common/access.decorators.js';
import { zodQuery } from '../common/zod-validation.pipe.js';
import { JobsService } from './jobs.service.js';

const JobsQuery = z.object({ limit: z.coerce.number().int().min(1).max(500).default(50) });

@ApiTags('jobs')
@ApiBearerAuth()
@Controller('jobs')
@Roles('scientist', 'admin')
export class JobsController {
  constructor(private readonly jobs: JobsService) {}

  @Get()
  list(@Query(zodQuery(JobsQuery)) q: z.infer<typeof JobsQuery>) {
    return this.jobs.list(q.limit);
  }

  @Get(':id')
  get(@Param('id', ParseIntPipe) id: number) {
    return this.jobs.get(id);
  }
}
