import { Controller, Get } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { HealthDto } from '@morrowline/shared';
import { Public } from '../common/decorators/roles.decorator';
import { DatabaseProbe } from './database-probe';

const VERSION: string = (require('../../package.json') as { version: string }).version;

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly database: DatabaseProbe) {}

  /** For monitoring: answers 200 with database status, so a probe can tell "up but degraded". */
  @Get()
  @Public()
  async health(): Promise<HealthDto> {
    const database: HealthDto['database'] = (await this.database.isUp()) ? 'up' : 'down';
    return { status: database === 'up' ? 'ok' : 'degraded', database, version: VERSION, time: new Date().toISOString() };
  }
}
