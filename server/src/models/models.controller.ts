import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type ModelCompareDto, type ModelVersionDto, type RefitJobDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { ModelsQueryDto, PromoteModelDto, RefitsQueryDto, StartRefitDto } from './dto/models.dto';
import { ModelsService } from './models.service';
import { RefitsService } from './refits.service';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

/** Model versions and refits: the model internals, read by the forecasting roles only (README's role table). */
@ApiTags('models')
@ApiBearerAuth()
@Controller('models')
export class ModelsController {
  constructor(
    private readonly models: ModelsService,
    private readonly refits: RefitsService,
  ) {}

  @Get('refits')
  @Roles(...PERMISSIONS.readDeskWork)
  jobs(@Query() query: RefitsQueryDto): Promise<RefitJobDto[]> {
    return this.refits.list(query.state, query.zone, query.limit);
  }

  /** One job per zone (all active zones when none given); a zone's queued or running job is answered as it is. */
  @Post('refits')
  @HttpCode(202)
  @Roles(...PERMISSIONS.forecast)
  start(@CurrentUser() actor: AuthUser, @Body() body: StartRefitDto): Promise<RefitJobDto[]> {
    return this.refits.request(actor, body.zone, body.reason, 'operator', 'full');
  }

  @Get()
  @Roles(...PERMISSIONS.readDeskWork)
  list(@Query() query: ModelsQueryDto): Promise<ModelVersionDto[]> {
    return this.models.list(query.zone, query.limit);
  }

  @Get(':id')
  @Roles(...PERMISSIONS.readDeskWork)
  get(@Param('id', ParseIdPipe) id: number): Promise<ModelVersionDto> {
    return this.models.get(id);
  }

  @Get(':id/compare')
  @Roles(...PERMISSIONS.readDeskWork)
  compare(@Param('id', ParseIdPipe) id: number): Promise<ModelCompareDto> {
    return this.models.compare(id);
  }

  @Post(':id/promote')
  @HttpCode(200)
  @Roles(...PERMISSIONS.forecast)
  promote(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: PromoteModelDto): Promise<ModelVersionDto> {
    return this.models.promote(actor, id, body.reason);
  }
}
