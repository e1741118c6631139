import { Body, Controller, Get, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { CreateSiteRequest, type SessionUser, UpdateSiteRequest } from '@stormhour/shared';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody } from '../common/zod-validation.pipe.js';
import { SitesService } from './sites.service.js';

@ApiTags('radar sites')
@ApiBearerAuth()
@Controller('radar-sites')
export class SitesController {
  constructor(private readonly sites: SitesService) {}

  @Get()
  @Roles('scientist', 'writer', 'admin')
  list() {
    return this.sites.list();
  }

  @Get(':id')
  @Roles('scientist', 'writer', 'admin')
  get(@Param('id', ParseIntPipe) id: number) {
    return this.sites.get(id);
  }

  @Get(':id/coverage')
  @Roles('scientist', 'writer', 'admin')
  coverage(@Param('id', ParseIntPipe) id: number) {
    return this.sites.coverage(id);
  }

  @Get(':id/settings')
  @Roles('scientist')
  settingsHistory(@Param('id', ParseIntPipe) id: number) {
    return this.sites.settingsHistory(id);
  }

  @Post()
  @Roles('scientist')
  @ApiBody({ schema: jsonSchema(CreateSiteRequest) })
  create(@CurrentUser() actor: SessionUser, @Body(zodBody(CreateSiteRequest)) body: CreateSiteRequest) {
    return this.sites.create(actor, body);
  }

  @Patch(':id')
  @Roles('scientist')
  @ApiBody({ schema: jsonSchema(UpdateSiteRequest) })
  update(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(UpdateSiteRequest)) body: UpdateSiteRequest,
  ) {
    return this.sites.update(actor, id, body);
  }
}
