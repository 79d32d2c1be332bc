import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type ModelCompareDto, type ModelVersionDto, type RefitJobDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles, SignedIn } from '../common/decorators/roles.decorator';
import { ModelsQueryDto, PromoteModelDto, RefitsQueryDto, StartRefitDto } from './dto/models.dto';
import { ModelsService } from './models.service';
import { RefitsService } from './refits.service';

@ApiTags('models')
@ApiBearerAuth()
@Controller('models')
export class ModelsController {
  constructor(
    private readonly models: ModelsService,
    private readonly refits: RefitsService,
  ) {}

  @Get('refits')
  @SignedIn()
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
  @SignedIn()
  list(@Query() query: ModelsQueryDto): Promise<ModelVersionDto[]> {
    return this.models.list(query.zone, query.limit);
  }

  @Get(':id')
  @SignedIn()
  get(@Param('id', ParseIntPipe) id: number): Promise<ModelVersionDto> {
    return this.models.get(id);
  }

  @Get(':id/compare')
  @SignedIn()
  compare(@Param('id', ParseIntPipe) id: number): Promise<ModelCompareDto> {
    return this.models.compare(id);
  }

  @Post(':id/promote')
  @HttpCode(200)
  @Roles(...PERMISSIONS.forecast)
  promote(@CurrentUser() actor: AuthUser, @Param('id', ParseIntPipe) id: number, @Body() body: PromoteModelDto): Promise<ModelVersionDto> {
    return this.models.promote(actor, id, body.reason);
  }
}
