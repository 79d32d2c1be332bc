import { EntityManager } from '@mikro-orm/mariadb';
import { Controller, Get } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { HealthDto } from '@morrowline/shared';
import { Public } from '../common/decorators/roles.decorator';

const VERSION: string = (require('../../package.json') as { version: string }).version;

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly em: EntityManager) {}

  /** For monitoring: answers 200 with database status, so a probe can tell "up but degraded". */
  @Get()
  @Public()
  async health(): Promise<HealthDto> {
    let database: HealthDto['database'];
    try {
      await this.em.getConnection().execute('select 1');
      database = 'up';
    } catch {
      database = 'down';
    }
    return { status: database === 'up' ? 'ok' : 'degraded', database, version: VERSION, time: new Date().toISOString() };
  }
}
