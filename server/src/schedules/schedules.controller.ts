import { Body, Controller, Delete, Get, Header, Param, Post, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { PERMISSIONS, type AdjustmentResultDto, type DayScheduleDto, type ScheduleRevisionDto, type ScheduleSubscriberDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { CreateAdjustmentDto, CreateCorrectionDto, CreateSubscriberDto, DayQueryDto, ExportQueryDto, ReturnScheduleDto, SubmitScheduleDto } from './dto/schedules.dto';
import { dayFor, revisionFor, revisionsFor } from './published-only';
import { exportCsv, exportJson } from './schedule-export';
import { ScheduleSubscribersService } from './schedule-subscribers.service';
import { SchedulesService } from './schedules.service';
import { ParseDayPipe } from '../common/pipes/parse-day.pipe';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

/**
 * Day-ahead schedules; the contract is shared/src/schedules.ts. Admin takes no part (IT, not
 * forecasting); viewers read the published revisions only (published-only.ts).
 */
@ApiTags('schedules')
@ApiBearerAuth()
@Controller('schedules')
export class SchedulesController {
  constructor(
    private readonly schedules: SchedulesService,
    private readonly subscribers: ScheduleSubscribersService,
  ) {}

  // Fixed paths first, so "subscribers" and "revisions" are never read as an operating day.
  @Get('subscribers')
  @Roles(...PERMISSIONS.supervise)
  listSubscribers(): Promise<ScheduleSubscriberDto[]> {
    return this.subscribers.list();
  }

  @Post('subscribers')
  @Roles(...PERMISSIONS.supervise)
  addSubscriber(@CurrentUser() user: AuthUser, @Body() body: CreateSubscriberDto): Promise<ScheduleSubscriberDto> {
    return this.subscribers.add(user, body);
  }

  @Delete('subscribers/:id')
  @Roles(...PERMISSIONS.supervise)
  removeSubscriber(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<ScheduleSubscriberDto> {
    return this.subscribers.remove(user, id);
  }

  @Delete('adjustments/:id')
  @Roles(...PERMISSIONS.forecast)
  undo(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<ScheduleRevisionDto> {
    return this.schedules.undo(user, id);
  }

  @Delete('adjustment-batches/:id')
  @Roles(...PERMISSIONS.forecast)
  undoBatch(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<ScheduleRevisionDto> {
    return this.schedules.undoBatch(user, id);
  }

  @Get('revisions/:id')
  @Roles(...PERMISSIONS.readForecasts)
  async revision(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<ScheduleRevisionDto> {
    return revisionFor(user.role, await this.schedules.revision(id));
  }

  @Get('revisions/:id/export')
  @Roles(...PERMISSIONS.readForecasts)
  @Header('Cache-Control', 'no-store')
  async export(@Param('id', ParseIdPipe) id: number, @Query() query: ExportQueryDto, @Res({ passthrough: true }) res: Response): Promise<string> {
    const { revision, publishedByEmail } = await this.schedules.forExport(id);
    const name = `schedule-${revision.zone}-${revision.operatingDay}-r${revision.revision}.${query.format}`;
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    if (query.format === 'json') {
      res.setHeader('Content-Type', 'application/json; charset=utf-8');
      return JSON.stringify(exportJson(revision, publishedByEmail), null, 2);
    }
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    return exportCsv(revision, publishedByEmail);
  }

  @Post('revisions/:id/submit')
  @Roles(...PERMISSIONS.forecast)
  submit(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: SubmitScheduleDto): Promise<ScheduleRevisionDto> {
    return this.schedules.submit(user, id, body.comment);
  }

  @Post('revisions/:id/back-to-model')
  @Roles(...PERMISSIONS.forecast)
  backToModel(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<ScheduleRevisionDto> {
    return this.schedules.backToModel(user, id);
  }

  @Post('revisions/:id/restart')
  @Roles(...PERMISSIONS.forecast)
  restart(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<ScheduleRevisionDto> {
    return this.schedules.restartFromLatest(user, id);
  }

  @Post('revisions/:id/approve')
  @Roles(...PERMISSIONS.supervise)
  approve(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number): Promise<ScheduleRevisionDto> {
    return this.schedules.approve(user, id);
  }

  @Post('revisions/:id/return')
  @Roles(...PERMISSIONS.supervise)
  returnToOperators(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: ReturnScheduleDto): Promise<ScheduleRevisionDto> {
    return this.schedules.returnToOperators(user, id, body.comment);
  }

  @Get(':day')
  @Roles(...PERMISSIONS.readForecasts)
  async day(@CurrentUser() user: AuthUser, @Param('day', ParseDayPipe) day: string, @Query() query: DayQueryDto): Promise<DayScheduleDto> {
    return dayFor(user.role, await this.schedules.day(day, query.zone));
  }

  @Post(':day/adjustments')
  @Roles(...PERMISSIONS.forecast)
  adjust(@CurrentUser() user: AuthUser, @Param('day', ParseDayPipe) day: string, @Body() body: CreateAdjustmentDto): Promise<AdjustmentResultDto> {
    return this.schedules.adjust(user, day, body);
  }

  @Post(':day/:zone/draft')
  @Roles(...PERMISSIONS.forecast)
  draft(@CurrentUser() user: AuthUser, @Param('day', ParseDayPipe) day: string, @Param('zone') zone: string): Promise<ScheduleRevisionDto> {
    return this.schedules.createDraft(user, day, zone);
  }

  @Post(':day/:zone/corrections')
  @Roles(...PERMISSIONS.forecast)
  correction(@CurrentUser() user: AuthUser, @Param('day', ParseDayPipe) day: string, @Param('zone') zone: string, @Body() body: CreateCorrectionDto): Promise<ScheduleRevisionDto> {
    return this.schedules.correction(user, day, zone, body.reason);
  }

  @Get(':day/:zone/revisions')
  @Roles(...PERMISSIONS.readForecasts)
  async revisions(@CurrentUser() user: AuthUser, @Param('day', ParseDayPipe) day: string, @Param('zone') zone: string): Promise<ScheduleRevisionDto[]> {
    return revisionsFor(user.role, await this.schedules.revisions(day, zone));
  }
}
