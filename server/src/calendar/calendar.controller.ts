import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type SpecialDayDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles, SignedIn } from '../common/decorators/roles.decorator';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import { CalendarService } from './calendar.service';
import { SpecialDayDtoIn, SpecialDayPatchDto, SpecialDaysQueryDto } from './dto/special-day.dto';

@ApiTags('calendar')
@ApiBearerAuth()
@Controller('calendar')
export class CalendarController {
  constructor(private readonly calendar: CalendarService) {}

  /** Holidays, bridge days and local events in a range of local days. */
  @Get()
  @SignedIn()
  list(@Query() query: SpecialDaysQueryDto): Promise<SpecialDayDto[]> {
    return this.calendar.list(query.from, query.to);
  }

  @Post()
  @Roles(...PERMISSIONS.editCalendar)
  create(@CurrentUser() actor: AuthUser, @Body() body: SpecialDayDtoIn): Promise<SpecialDayDto> {
    return this.calendar.create(actor, body);
  }

  @Patch(':id')
  @Roles(...PERMISSIONS.editCalendar)
  update(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: SpecialDayPatchDto): Promise<SpecialDayDto> {
    return this.calendar.update(actor, id, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @Roles(...PERMISSIONS.editCalendar)
  remove(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<void> {
    return this.calendar.remove(actor, id);
  }
}
