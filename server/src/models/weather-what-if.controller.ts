import { BadRequestException, Body, Controller, Get, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiQuery, ApiTags } from '@nestjs/swagger';
import { parseDecimal, parseInstant, PERMISSIONS, WHAT_IF_MAX_SHIFT_C, type AdjustmentResultDto, type WeatherVintagesDto, type WeatherWhatIfDto } from '@morrowline/shared';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import type { AuthUser } from '../common/auth-user';
import { WeatherWhatIfAdjustDto } from './dto/weather-what-if.dto';
import { ParseDayPipe } from '../common/pipes/parse-day.pipe';
import { WeatherWhatIfService, type WhatIfChange } from './weather-what-if.service';

/** Reads `shift` (plain decimal °C within ±WHAT_IF_MAX_SHIFT_C) or `vintage` (an instant), exactly one. */
export function parseWhatIfQuery(query: Record<string, unknown>): WhatIfChange {
  const unknown = Object.keys(query).filter((k) => k !== 'shift' && k !== 'vintage');
  if (unknown.length) throw new BadRequestException(`Unknown query parameter ${unknown.join(', ')}; give shift or vintage`);
  const hasShift = query.shift !== undefined;
  const hasVintage = query.vintage !== undefined;
  if (hasShift === hasVintage) throw new BadRequestException('Give exactly one of shift (°C, e.g. 2.5 or -3) and vintage (the issue time of a temperature forecast)');
  if (hasShift) {
    const shift = parseDecimal(query.shift, 'shift');
    if (!shift.ok) throw new BadRequestException(shift.message);
    if (Math.abs(shift.value) > WHAT_IF_MAX_SHIFT_C) throw new BadRequestException(`shift must be between −${WHAT_IF_MAX_SHIFT_C} and ${WHAT_IF_MAX_SHIFT_C} °C`);
    return { shiftC: shift.value };
  }
  const vintage = parseInstant(query.vintage, 'vintage');
  if (!vintage.ok) throw new BadRequestException(vintage.message);
  return { vintageMs: vintage.value };
}

/** The body's what-if: exactly one of shift (a JSON number, range checked by the DTO) and vintage (an instant). */
export function whatIfOfBody(body: WeatherWhatIfAdjustDto): WhatIfChange {
  const hasShift = body.shift !== undefined;
  const hasVintage = body.vintage !== undefined;
  if (hasShift === hasVintage) throw new BadRequestException('Give exactly one of shift (°C) and vintage (the issue time of a temperature forecast)');
  if (hasShift) return { shiftC: body.shift! };
  const vintage = parseInstant(body.vintage, 'vintage');
  if (!vintage.ok) throw new BadRequestException(vintage.message);
  return { vintageMs: vintage.value };
}

@ApiTags('schedules')
@ApiBearerAuth()
@Controller('schedules')
export class WeatherWhatIfController {
  constructor(private readonly whatIfs: WeatherWhatIfService) {}

  @Get(':day/:zone/weather-vintages')
  @Roles(...PERMISSIONS.forecast)
  vintages(@Param('day', ParseDayPipe) day: string, @Param('zone') zone: string, @Query() query: Record<string, unknown>): Promise<WeatherVintagesDto> {
    const unknown = Object.keys(query);
    if (unknown.length) throw new BadRequestException(`Unknown query parameter ${unknown.join(', ')}; this route takes none`);
    return this.whatIfs.vintages(day, zone);
  }

  @Get(':day/:zone/weather-what-if')
  @Roles(...PERMISSIONS.forecast)
  @ApiQuery({ name: 'shift', required: false, description: `°C added to the temperature forecast, plain decimal, −${WHAT_IF_MAX_SHIFT_C} to ${WHAT_IF_MAX_SHIFT_C}` })
  @ApiQuery({ name: 'vintage', required: false, description: 'issue time of another temperature forecast vintage (ISO 8601 with offset)' })
  whatIf(@Param('day', ParseDayPipe) day: string, @Param('zone') zone: string, @Query() query: Record<string, unknown>): Promise<WeatherWhatIfDto> {
    return this.whatIfs.whatIf(day, zone, parseWhatIfQuery(query));
  }

  /** The what-if as one "add" per hour on the zone's draft, all in one transaction, audited once, undone together. */
  @Post(':day/:zone/weather-what-if/adjustments')
  @Roles(...PERMISSIONS.forecast)
  adjust(@CurrentUser() user: AuthUser, @Param('day', ParseDayPipe) day: string, @Param('zone') zone: string, @Body() body: WeatherWhatIfAdjustDto): Promise<AdjustmentResultDto> {
    return this.whatIfs.adjust(user, day, zone, whatIfOfBody(body), body.reason);
  }
}
