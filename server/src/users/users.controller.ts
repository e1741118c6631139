import { Body, Controller, Get, Param, ParseIntPipe, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { CreateUserRequest, ROLES, type SessionUser, UpdateUserRequest } from '@stormhour/shared';
import { z } from 'zod';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody, zodQuery } from '../common/zod-validation.pipe.js';
import { UsersService } from './users.service.js';

const UsersQuery = z.object({
  q: z.string().trim().min(1).optional(),
  role: z.enum(ROLES).optional(),
});

@ApiTags('users')
@ApiBearerAuth()
@Controller('users')
@Roles('admin')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  list(@Query(zodQuery(UsersQuery)) q: z.infer<typeof UsersQuery>) {
    return this.users.list(q);
  }

  @Post()
  @ApiBody({ schema: jsonSchema(CreateUserRequest) })
  create(@CurrentUser() actor: SessionUser, @Body(zodBody(CreateUserRequest)) body: CreateUserRequest) {
    return this.users.create(actor, body);
  }

  @Patch(':id')
  @ApiBody({ schema: jsonSchema(UpdateUserRequest) })
  update(
    @CurrentUser() actor: SessionUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(zodBody(UpdateUserRequest)) body: UpdateUserRequest,
  ) {
    return this.users.update(actor, id, body);
  }
}
