import { Controller, Get, HttpStatus, Res } from '@nestjs/common';
import { ApiResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { HealthDto } from '@morrowline/shared';
import { Public } from '../common/decorators/roles.decorator';
import { DatabaseProbe } from './database-probe';

const VERSION: string = (require('../../package.json') as { version: string }).version;

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly database: DatabaseProbe) {}

  /**
   * For monitoring and load balancers: 200 when the server can serve, 503 (with the same body,
   * `database: "down"`) when it cannot reach its database, so a probe that reads only the status
   * code takes the instance out of service.
   */
  @Get()
  @Public()
  @ApiResponse({ status: 503, description: 'The database cannot be reached' })
  async health(@Res({ passthrough: true }) res: Response): Promise<HealthDto> {
    const database: HealthDto['database'] = (await this.database.isUp()) ? 'up' : 'down';
    if (database === 'down') {
      res.status(HttpStatus.SERVICE_UNAVAILABLE);
      res.setHeader('Retry-After', '5');
    }
    return { status: database === 'up' ? 'ok' : 'degraded', database, version: VERSION, time: new Date().toISOString() };
  }
}
