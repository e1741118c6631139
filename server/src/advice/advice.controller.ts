import {
  BadRequestException,
  Body,
  Controller,
  Get,
  Param,
  ParseIntPipe,
  Post,
  Put,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiTags } from '@nestjs/swagger';
import { AdviceRuleRequest, CropCalendarRequest, type SessionUser } from '@stormhour/shared';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody } from '../common/zod-validation.pipe.js';
import { AdviceRulesService } from './advice-rules.service.js';
import { CropCalendarService } from './crop-calendar.service.js';

/** The part of multer's file object this controller reads. */
interface UploadedBlob {
  originalname: string;
  buffer: Buffer;
}

@ApiTags('advice')
@ApiBearerAuth()
@Controller()
export class AdviceController {
  constructor(
    private readonly calendars: CropCalendarService,
    private readonly rules: AdviceRulesService,
  ) {}

  @Get('districts/:id/crop-calendar')
  @Roles('scientist', 'writer', 'admin')
  calendar(@Param('id', ParseIntPipe) id: number) {
    return this.calendars.get(id);
  }

  @Put('districts/:id/crop-calendar')
  @Roles('scientist', 'admin')
  @ApiBody({ schema: jsonSchema(CropCalendarRequest) })
  replaceCalendar(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(CropCalendarRequest)) body: CropCalendarRequest,
  ) {
    return this.calendars.replace(actor, id, body);
  }

  @Post('crop-calendars/import')
  @Roles('scientist', 'admin')
  @ApiConsumes('multipart/form-data')
  @ApiBody({ schema: { type: 'object', properties: { file: { type: 'string', format: 'binary' } } } })
  @UseInterceptors(FileInterceptor('file'))
  importCalendars(@CurrentUser() actor: SessionUser, @UploadedFile() file: UploadedBlob | undefined) {
    if (!file) {
      throw new BadRequestException({
        message: 'Attach the crop calendar CSV as the multipart field "file".',
        details: [{ where: 'file', problem: 'missing' }],
      });
    }
    return this.calendars.importCsv(actor, file.originalname, file.buffer.toString('utf8'));
  }

  @Get('advice-rules')
  @Roles('scientist', 'writer')
  listRules() {
    return this.rules.list();
  }

  @Post('advice-rules')
  @Roles('scientist')
  @ApiBody({ schema: jsonSchema(AdviceRuleRequest) })
  createRule(@CurrentUser() actor: SessionUser, @Body(zodBody(AdviceRuleRequest)) body: AdviceRuleRequest) {
    return this.rules.create(actor, body);
  }

  @Put('advice-rules/:id')
  @Roles('scientist')
  @ApiBody({ schema: jsonSchema(AdviceRuleRequest) })
  updateRule(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(AdviceRuleRequest)) body: AdviceRuleRequest,
  ) {
    return this.rules.update(actor, id, body);
  }
}
