import { Body, Controller, Get, Param, ParseIntPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { FieldReportRequest, type SessionUser } from '@stormhour/shared';
import type { z } from 'zod';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody } from '../common/zod-validation.pipe.js';
import { InboxService } from './inbox.service.js';

/** The extension officer's inbox: the district's sent bulletins, acknowledgements and field reports. */
@ApiTags('inbox')
@ApiBearerAuth()
@Controller('inbox')
export class InboxController {
  constructor(private readonly inbox: InboxService) {}

  @Get()
  @Roles('officer')
  list(@CurrentUser() officer: SessionUser) {
    return this.inbox.list(officer);
  }

  @Get(':id')
  @Roles('officer')
  open(@CurrentUser() officer: SessionUser, @Param('id', ParseIntPipe) id: number) {
    return this.inbox.open(officer, id);
  }

  @Post(':id/acknowledge')
  @Roles('officer')
  acknowledge(@CurrentUser() officer: SessionUser, @Param('id', ParseIntPipe) id: number) {
    return this.inbox.acknowledge(officer, id);
  }

  @Post(':id/reports')
  @Roles('officer')
  @ApiBody({ schema: jsonSchema(FieldReportRequest) })
  addReport(
    @CurrentUser() officer: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(FieldReportRequest)) body: z.infer<typeof FieldReportRequest>,
  ) {
    return this.inbox.addReport(officer, id, body);
  }

  @Get(':id/reports')
  @Roles('officer')
  reports(@CurrentUser() officer: SessionUser, @Param('id', ParseIntPipe) id: number) {
    return this.inbox.reports(officer, id);
  }
}
