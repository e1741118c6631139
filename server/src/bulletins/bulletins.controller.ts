import { Body, Controller, Get, Param, ParseIntPipe, Post, Put, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import {
  BulletinListQuery,
  CompareVersionsQuery,
  CreateBulletinRequest,
  ReturnBulletinRequest,
  SaveBulletinRequest,
  type SessionUser,
  TransitionRequest,
  WithdrawBulletinRequest,
} from '@stormhour/shared';
import type { Response } from 'express';
import type { z } from 'zod';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody, zodQuery } from '../common/zod-validation.pipe.js';
import { BulletinRenderer } from './bulletin-renderer.js';
import { BulletinsService } from './bulletins.service.js';
import { InboxService } from './inbox.service.js';

/** The parsed query; named apart from the schema so decorator metadata does not mistake it for a class. */
type ListParams = z.infer<typeof BulletinListQuery>;
type CreateBody = z.infer<typeof CreateBulletinRequest>;
type SaveBody = z.infer<typeof SaveBulletinRequest>;
type TransitionBody = z.infer<typeof TransitionRequest>;
type CompareQuery = z.infer<typeof CompareVersionsQuery>;

const STAFF = ['writer', 'scientist', 'admin'] as const;

@ApiTags('bulletins')
@ApiBearerAuth()
@Controller('bulletins')
export class BulletinsController {
  constructor(
    private readonly bulletins: BulletinsService,
    private readonly inbox: InboxService,
    private readonly renderer: BulletinRenderer,
  ) {}

  @Post()
  @Roles(...STAFF)
  @ApiBody({ schema: jsonSchema(CreateBulletinRequest) })
  create(@CurrentUser() actor: SessionUser, @Body(zodBody(CreateBulletinRequest)) body: CreateBody) {
    return this.bulletins.create(actor, body);
  }

  @Get()
  @Roles(...STAFF)
  list(@Query(zodQuery(BulletinListQuery)) q: ListParams) {
    return this.bulletins.list(q);
  }

  @Get(':id')
  @Roles(...STAFF)
  get(@CurrentUser() actor: SessionUser, @Param('id', ParseIntPipe) id: number) {
    return this.bulletins.view(actor, id);
  }

  @Put(':id')
  @Roles(...STAFF)
  @ApiBody({ schema: jsonSchema(SaveBulletinRequest) })
  save(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(SaveBulletinRequest)) body: SaveBody,
  ) {
    return this.bulletins.save(actor, id, body);
  }

  @Get(':id/versions/:n')
  @Roles(...STAFF)
  version(@Param('id', ParseIntPipe) id: number, @Param('n', ParseIntPipe) n: number) {
    return this.bulletins.version(id, n);
  }

  @Get(':id/diff')
  @Roles(...STAFF)
  diff(@Param('id', ParseIntPipe) id: number) {
    return this.bulletins.diff(id);
  }

  /** Two saved versions of the bulletin: what changed from version `from` to version `to`. */
  @Get(':id/compare')
  @Roles(...STAFF)
  compare(@Param('id', ParseIntPipe) id: number, @Query(zodQuery(CompareVersionsQuery)) q: CompareQuery) {
    return this.bulletins.compare(id, q.from, q.to);
  }

  @Post(':id/submit')
  @Roles(...STAFF)
  @ApiBody({ schema: jsonSchema(TransitionRequest) })
  submit(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(TransitionRequest)) body: TransitionBody,
  ) {
    return this.bulletins.submit(actor, id, body.comment);
  }

  @Post(':id/approve')
  @Roles('scientist', 'admin')
  @ApiBody({ schema: jsonSchema(TransitionRequest) })
  approve(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(TransitionRequest)) body: TransitionBody,
  ) {
    return this.bulletins.approve(actor, id, body.comment);
  }

  @Post(':id/return')
  @Roles('scientist', 'admin')
  @ApiBody({ schema: jsonSchema(ReturnBulletinRequest) })
  return(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(ReturnBulletinRequest)) body: z.infer<typeof ReturnBulletinRequest>,
  ) {
    return this.bulletins.return(actor, id, body.comment);
  }

  @Post(':id/send')
  @Roles(...STAFF)
  @ApiBody({ schema: jsonSchema(TransitionRequest) })
  send(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(TransitionRequest)) body: TransitionBody,
  ) {
    return this.bulletins.send(actor, id, body.comment);
  }

  @Post(':id/withdraw')
  @Roles('scientist', 'admin')
  @ApiBody({ schema: jsonSchema(WithdrawBulletinRequest) })
  withdraw(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(WithdrawBulletinRequest)) body: z.infer<typeof WithdrawBulletinRequest>,
  ) {
    return this.bulletins.withdraw(actor, id, body.reason);
  }

  @Get(':id/delivery')
  @Roles(...STAFF)
  delivery(@Param('id', ParseIntPipe) id: number) {
    return this.bulletins.delivery(id);
  }

  @Get(':id/reports')
  @Roles('scientist', 'admin')
  reports(@Param('id', ParseIntPipe) id: number) {
    return this.inbox.allReports(id);
  }

  // ── Exports of the shown version (the approved one once approved) ──

  @Get(':id/pdf')
  @Roles(...STAFF)
  async pdf(@Param('id', ParseIntPipe) id: number, @Res() res: Response) {
    const { content } = await this.bulletins.content(id);
    const pdf = await this.renderer.pdf(content);
    res.setHeader('Content-Disposition', `attachment; filename="${content.number.toLowerCase()}.pdf"`);
    res.type('application/pdf').send(pdf);
  }

  @Get(':id/cap.xml')
  @Roles(...STAFF)
  async cap(@Param('id', ParseIntPipe) id: number, @Res() res: Response) {
    const { number, xml } = await this.bulletins.capXml(id);
    res.setHeader('Content-Disposition', `attachment; filename="${number.toLowerCase()}.cap.xml"`);
    res.type('application/xml').send(xml);
  }

  @Get(':id/text')
  @Roles(...STAFF)
  async text(@Param('id', ParseIntPipe) id: number, @Res() res: Response) {
    const { content } = await this.bulletins.content(id);
    res.type('text/plain; charset=utf-8').send(this.renderer.text(content));
  }

  @Get(':id/sms')
  @Roles(...STAFF)
  async sms(@Param('id', ParseIntPipe) id: number, @Res() res: Response) {
    const { content } = await this.bulletins.content(id);
    res.type('text/plain; charset=utf-8').send(this.renderer.sms(content));
  }
}
