import { Controller, Get, Inject } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Public } from '../common/access.decorators.js';
import { DATABASE, type DatabaseHandle } from '../database/database.js';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  /** Answers only when the database answers, so a load balancer sees a real state. */
  @Get()
  @Public()
  async health() {
    await this.handle.pg.query('select 1');
    return { status: 'ok' };
  }
}
