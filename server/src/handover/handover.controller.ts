import { Body, Controller, Get, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type CurrentShiftDto, type HandoverDraftDto, type HandoverNoteDto, type HandoverNoteWithEventsDto, type Page } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { AcknowledgeHandoverDto, CreateHandoverDto, HandoverSearchDto } from './dto/create-handover.dto';
import { HandoverService } from './handover.service';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

/** The shift log: written and read by the forecasting roles only (not viewers, not admin: README's role table). */
@ApiTags('handover')
@ApiBearerAuth()
@Controller('handover')
export class HandoverController {
  constructor(private readonly handover: HandoverService) {}

  @Get('shift')
  @Roles(...PERMISSIONS.readDeskWork)
  shift(): Promise<CurrentShiftDto> {
    return this.handover.currentShift();
  }

  @Get('draft')
  @Roles(...PERMISSIONS.forecast)
  draft(): Promise<HandoverDraftDto> {
    return this.handover.draft();
  }

  @Get('pending')
  @Roles(...PERMISSIONS.readDeskWork)
  pending(): Promise<HandoverNoteDto[]> {
    return this.handover.pending();
  }

  @Get()
  @Roles(...PERMISSIONS.readDeskWork)
  search(@Query() query: HandoverSearchDto): Promise<Page<HandoverNoteDto>> {
    return this.handover.search(query);
  }

  @Get(':id')
  @Roles(...PERMISSIONS.readDeskWork)
  get(@Param('id', ParseIdPipe) id: number): Promise<HandoverNoteWithEventsDto> {
    return this.handover.get(id);
  }

  @Post()
  @Roles(...PERMISSIONS.forecast)
  create(@CurrentUser() user: AuthUser, @Body() body: CreateHandoverDto): Promise<HandoverNoteDto> {
    return this.handover.create(user, body);
  }

  @Post(':id/acknowledge')
  @Roles(...PERMISSIONS.forecast)
  acknowledge(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: AcknowledgeHandoverDto): Promise<HandoverNoteDto> {
    return this.handover.acknowledge(user, id, body.reply);
  }
}
