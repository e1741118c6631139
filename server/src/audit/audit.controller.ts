import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { z } from 'zod';
import { Roles } from '../common/access.decorators.js';
import { zodQuery } from '../common/zod-validation.pipe.js';
import { AuditService } from './audit.service.js';

const AuditQuery = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  action: z.string().trim().min(1).optional(),
});

@ApiTags('audit')
@ApiBearerAuth()
@Controller('audit')
@Roles('admin')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  @Get()
  page(@Query(zodQuery(AuditQuery)) q: z.infer<typeof AuditQuery>) {
    return this.audit.page(q.offset, q.limit, q.action);
  }

  @Get('actions')
  actions() {
    return this.audit.actions();
  }
}
