import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type OutageDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles, SignedIn } from '../common/decorators/roles.decorator';
import { CloseOutageDto, CreateOutageDto, OutagesQueryDto, UpdateOutageDto } from './dto/outage.dto';
import { OutagesService } from './outages.service';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

@ApiTags('outages')
@ApiBearerAuth()
@Controller('outages')
export class OutagesController {
  constructor(private readonly outages: OutagesService) {}

  @Get()
  @SignedIn()
  list(@Query() query: OutagesQueryDto): Promise<OutageDto[]> {
    return this.outages.list(query.zone, query.from, query.to);
  }

  @Post()
  @Roles(...PERMISSIONS.forecast)
  create(@CurrentUser() actor: AuthUser, @Body() body: CreateOutageDto): Promise<OutageDto> {
    return this.outages.create(actor, body);
  }

  @Patch(':id')
  @Roles(...PERMISSIONS.forecast)
  update(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: UpdateOutageDto): Promise<OutageDto> {
    return this.outages.update(actor, id, body);
  }

  @Post(':id/close')
  @HttpCode(200)
  @Roles(...PERMISSIONS.forecast)
  close(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: CloseOutageDto): Promise<OutageDto> {
    return this.outages.close(actor, id, body.end, body.reason);
  }
}
