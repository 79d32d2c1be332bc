import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type AlertDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles, SignedIn } from '../common/decorators/roles.decorator';
import { AlertsService } from './alerts.service';
import { AcknowledgeAlertDto, AlertsQueryDto } from './dto/alerts.dto';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

@ApiTags('alerts')
@ApiBearerAuth()
@Controller('alerts')
export class AlertsController {
  constructor(private readonly alerts: AlertsService) {}

  @Get()
  @SignedIn()
  list(@Query() query: AlertsQueryDto): Promise<AlertDto[]> {
    return this.alerts.list(query.state, query.zone, query.limit);
  }

  @Post(':id/acknowledge')
  @HttpCode(200)
  @Roles(...PERMISSIONS.forecast)
  acknowledge(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: AcknowledgeAlertDto): Promise<AlertDto> {
    return this.alerts.acknowledge(actor, id, body.comment);
  }
}
