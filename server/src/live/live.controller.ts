import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { CommittedLoadDto } from '@morrowline/shared';
import { SignedIn } from '../common/decorators/roles.decorator';
import { CommittedLoadService } from './committed-load.service';
import { CommittedQueryDto } from './dto/committed-query.dto';

@ApiTags('live')
@ApiBearerAuth()
@Controller('live')
export class LiveController {
  constructor(private readonly committed: CommittedLoadService) {}

  /** Per zone and hour: the published schedule, the day-ahead forecast and which of them is committed. */
  @Get('committed')
  @SignedIn()
  committedLoad(@Query() query: CommittedQueryDto): Promise<CommittedLoadDto> {
    return this.committed.load(query.zone, query.from, query.to);
  }
}
