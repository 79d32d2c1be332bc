import { Body, Controller, Get, Param, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type ZoneDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles, SignedIn } from '../common/decorators/roles.decorator';
import { CreateZoneDto, UpdateZoneDto } from './dto/zone.dto';
import { ZonesService } from './zones.service';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

@ApiTags('zones')
@ApiBearerAuth()
@Controller('zones')
export class ZonesController {
  constructor(private readonly zones: ZonesService) {}

  @Get()
  @SignedIn()
  list(): Promise<ZoneDto[]> {
    return this.zones.list();
  }

  @Post()
  @Roles(...PERMISSIONS.administer)
  create(@CurrentUser() actor: AuthUser, @Body() body: CreateZoneDto): Promise<ZoneDto> {
    return this.zones.create(actor, body);
  }

  @Patch(':id')
  @Roles(...PERMISSIONS.administer)
  update(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: UpdateZoneDto): Promise<ZoneDto> {
    return this.zones.update(actor, id, body);
  }
}
