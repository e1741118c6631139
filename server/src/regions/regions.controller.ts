import {
  BadRequestException,
  Body,
  Controller,
  Get,
  Param,
  ParseIntPipe,
  Patch,
  Post,
  Query,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiTags } from '@nestjs/swagger';
import {
  CreateDistrictRequest,
  type SessionUser,
  UpdateBlockRequest,
  UpdateDistrictRequest,
} from '@stormhour/shared';
import { z } from 'zod';
import { AnyRole, CurrentUser, Roles } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody, zodQuery } from '../common/zod-validation.pipe.js';
import { RegionsService } from './regions.service.js';

/** The part of multer's file object this controller reads. */
interface UploadedBlob {
  originalname: string;
  buffer: Buffer;
}

const BlocksQuery = z.object({
  districtId: z.coerce.number().int().positive().optional(),
  q: z.string().trim().min(1).optional(),
});

@ApiTags('regions')
@ApiBearerAuth()
@Controller()
export class RegionsController {
  constructor(private readonly regions: RegionsService) {}

  @Get('districts')
  @AnyRole()
  listDistricts() {
    return this.regions.listDistricts();
  }

  @Post('districts')
  @Roles('admin')
  @ApiBody({ schema: jsonSchema(CreateDistrictRequest) })
  createDistrict(
    @CurrentUser() actor: SessionUser,
    @Body(zodBody(CreateDistrictRequest)) body: CreateDistrictRequest,
  ) {
    return this.regions.createDistrict(actor, body);
  }

  @Patch('districts/:id')
  @Roles('admin')
  @ApiBody({ schema: jsonSchema(UpdateDistrictRequest) })
  updateDistrict(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(UpdateDistrictRequest)) body: UpdateDistrictRequest,
  ) {
    return this.regions.updateDistrict(actor, id, body);
  }

  @Get('blocks')
  @AnyRole()
  listBlocks(@Query(zodQuery(BlocksQuery)) q: z.infer<typeof BlocksQuery>) {
    return this.regions.listBlocks(q);
  }

  @Get('blocks/geojson')
  @AnyRole()
  blocksGeoJson(@Query(zodQuery(BlocksQuery)) q: z.infer<typeof BlocksQuery>) {
    return this.regions.blocksGeoJson(q);
  }

  @Patch('blocks/:id')
  @Roles('admin')
  @ApiBody({ schema: jsonSchema(UpdateBlockRequest) })
  updateBlock(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(UpdateBlockRequest)) body: UpdateBlockRequest,
  ) {
    return this.regions.updateBlock(actor, id, body);
  }

  @Post('blocks/import')
  @Roles('admin')
  @ApiConsumes('multipart/form-data')
  @ApiBody({ schema: { type: 'object', properties: { file: { type: 'string', format: 'binary' } } } })
  @UseInterceptors(FileInterceptor('file'))
  importBlocks(@CurrentUser() actor: SessionUser, @UploadedFile() file: UploadedBlob | undefined) {
    if (!file) {
      throw new BadRequestException({
        message: 'Attach the blocks file as the multipart field "file".',
        details: [{ where: 'file', problem: 'missing' }],
      });
    }
    return this.regions.importBlocks(actor, file.originalname, file.buffer.toString('utf8'));
  }
}
